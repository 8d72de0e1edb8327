export {
  AMBIGUITY_DELTA_CHI2,
  fitJointPole,
  type JointCrossing,
  type JointEvent,
  type JointPoleFit,
} from './joint-fit.js';
export { jointEventFromInput, ringLabels } from './from-event.js';
