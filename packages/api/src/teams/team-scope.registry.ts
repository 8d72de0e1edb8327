import { Injectable } from '@nestjs/common';
import type { EntityManager } from '@mikro-orm/mariadb';

/**
 * Finds the team that owns the object named by one route parameter, or null when there is no
 * such object. `teamId` is registered by TeamsModule; a feature with its own ids (e.g. `eventId`)
 * registers a resolver in its module's onModuleInit and then uses @Roles on its routes as is.
 */
export type TeamResolver = (paramValue: string, em: EntityManager) => Promise<string | null>;

@Injectable()
export class TeamScopeRegistry {
  private readonly resolvers = new Map<string, TeamResolver>();

  register(paramName: string, resolver: TeamResolver): void {
    if (this.resolvers.has(paramName))
      throw new Error(`A team resolver for :${paramName} is already registered`);
    this.resolvers.set(paramName, resolver);
  }

  /** The first route parameter with a resolver decides the team. */
  find(params: Record<string, string>): { paramName: string; value: string; resolver: TeamResolver } | null {
    for (const [paramName, resolver] of this.resolvers) {
      const value = params[paramName];
      if (value !== undefined) return { paramName, value, resolver };
    }
    return null;
  }
}
