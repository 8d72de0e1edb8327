import { Module, OnModuleInit } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module';
import { TeamScopeRegistry } from '../teams/team-scope.registry';
import { TeamsModule } from '../teams/teams.module';
import { EventDetailCache } from './event-detail.cache';
import { EventsController } from './events.controller';
import { EventsService } from './events.service';

@Module({
  imports: [TeamsModule, AuditModule],
  controllers: [EventsController],
  providers: [EventsService, EventDetailCache],
  exports: [EventsService],
})
export class EventsModule implements OnModuleInit {
  constructor(private readonly registry: TeamScopeRegistry) {}

  /** A soft-deleted event still resolves to its team, so that a coordinator can restore it. */
  onModuleInit(): void {
    this.registry.register('eventId', async (eventId, em) => {
      // Every event route asks this first: one column of one row, no entity.
      const [row] = await em
        .getConnection()
        .execute<Array<{ team_id: string }>>('select `team_id` from `events` where `id` = ? limit 1', [
          eventId,
        ]);
      return row?.team_id ?? null;
    });
  }
}
