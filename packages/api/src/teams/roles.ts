/** Roles a member holds inside one team; defined once in @limbus/schema, which the client reads too. */
export { TEAM_ROLES, type TeamRole } from '@limbus/schema';
