import { EntityManager } from '@mikro-orm/mariadb';
import { type CanActivate, type ExecutionContext, Injectable } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import type { Request } from 'express';
import { authUserOf } from '../auth/auth-user';
import { ForbiddenError, NotFoundError, UnauthorizedError } from '../common/domain-errors';
import { MembershipRepository } from './membership.repository';
import type { TeamRole } from './roles';
import { ADMIN_ONLY, REQUIRED_TEAM_ROLES } from './roles.decorator';
import { decideTeamAccess } from './team-access';
import { TeamScopeRegistry } from './team-scope.registry';

/** Global guard after JwtAuthGuard: applies @Roles / @TeamMember / @AdminOnly. */
@Injectable()
export class RolesGuard implements CanActivate {
  constructor(
    private readonly reflector: Reflector,
    private readonly registry: TeamScopeRegistry,
    private readonly memberships: MembershipRepository,
    private readonly em: EntityManager,
  ) {}

  async canActivate(context: ExecutionContext): Promise<boolean> {
    const targets = [context.getHandler(), context.getClass()];
    const adminOnly = this.reflector.getAllAndOverride<boolean | undefined>(ADMIN_ONLY, targets);
    const required = this.reflector.getAllAndOverride<TeamRole[] | undefined>(REQUIRED_TEAM_ROLES, targets);
    if (!adminOnly && required === undefined) return true;

    const request = context.switchToHttp().getRequest<Request>();
    const user = authUserOf(request);
    if (!user) throw new UnauthorizedError();
    if (adminOnly && !user.isAdmin) throw new ForbiddenError('Site administrators only');
    if (required === undefined) return true;

    const scope = this.registry.find(request.params as Record<string, string>);
    if (!scope)
      throw new Error(`@Roles on ${context.getClass().name} needs a route parameter with a team resolver`);
    const teamId = await scope.resolver(scope.value, this.em);
    if (teamId === null) throw new NotFoundError();
    const decision = decideTeamAccess({
      isAdmin: user.isAdmin,
      memberRoles: user.isAdmin ? null : await this.memberships.rolesOf(teamId, user.id),
      required,
    });
    if (decision === 'not-found') throw new NotFoundError();
    if (decision === 'forbidden') throw new ForbiddenError();
    return true;
  }
}
