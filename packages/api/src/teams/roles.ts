/** Roles a member holds inside one team; site administration is a separate flag on the user. */
export const TEAM_ROLES = ['coordinator', 'observer', 'modeller', 'reviewer'] as const;
export type TeamRole = (typeof TEAM_ROLES)[number];
