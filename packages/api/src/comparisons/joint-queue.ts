/** Queue of joint ring-pole jobs; separate from `fits` so a long joint fit never delays a single-event solve. */
export const JOINT_QUEUE = 'joint';

export interface JointJobData {
  teamId: string;
  /** The body all the fits observe (jobs queued before bodies existed have none). */
  bodyId?: string;
  fitIds: string[];
  ring: string | null;
  requestedBy: string;
}

/** Finished jobs stay readable for 30 days; the result is a cheap recomputation after that. */
export const JOINT_RESULT_KEEP_SECONDS = 30 * 24 * 3600;
