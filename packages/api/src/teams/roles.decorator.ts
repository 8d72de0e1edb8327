import { SetMetadata } from '@nestjs/common';
import type { TeamRole } from './roles';

export const REQUIRED_TEAM_ROLES = 'limbus:requiredTeamRoles';
export const ADMIN_ONLY = 'limbus:adminOnly';

/** Caller must hold one of these roles in the team the route's parameters resolve to. */
export const Roles = (...roles: TeamRole[]): MethodDecorator & ClassDecorator =>
  SetMetadata(REQUIRED_TEAM_ROLES, roles);

/** Caller must be a member (any role) of the team the route's parameters resolve to. */
export const TeamMember = (): MethodDecorator & ClassDecorator => SetMetadata(REQUIRED_TEAM_ROLES, []);

/** Caller must be a site administrator. */
export const AdminOnly = (): MethodDecorator & ClassDecorator => SetMetadata(ADMIN_ONLY, true);
