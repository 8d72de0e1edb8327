export {
  AMBIGUITY_DELTA_CHI2,
  fitJointPole,
  formatDeltaChi2,
  type JointCrossing,
  type JointEvent,
  type JointPoleFit,
} from './joint-fit.js';
export { jointEventFromInput, ringLabels } from './from-event.js';
export { JOINT_FORMAT, jointPoleDocument, type JointPoleDocument } from './document.js';
