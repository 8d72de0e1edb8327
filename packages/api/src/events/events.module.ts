import { Module, OnModuleInit } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module';
import { TeamScopeRegistry } from '../teams/team-scope.registry';
import { TeamsModule } from '../teams/teams.module';
import { EventDetailCache } from './event-detail.cache';
import { EventsController } from './events.controller';
import { EventsService } from './events.service';

/** Ids are 36 characters: 100 000 entries are a few megabytes, and clearing them costs one read each. */
const TEAM_OF_EVENT_ENTRIES = 100_000;

@Module({
  imports: [TeamsModule, AuditModule],
  controllers: [EventsController],
  providers: [EventsService, EventDetailCache],
  exports: [EventsService],
})
export class EventsModule implements OnModuleInit {
  /**
   * Event id → team id, as this process has read them. An event's team is set when it is made and never
   * changes, and every event route asks for it before anything else, so the answer is kept instead of
   * read each time (one database round trip of the few a read costs). An event that is gone (its team
   * deleted) is refused further on, by the membership check or by the handler's own read.
   */
  private readonly teamOfEvent = new Map<string, string>();

  constructor(private readonly registry: TeamScopeRegistry) {}

  /** A soft-deleted event still resolves to its team, so that a coordinator can restore it. */
  onModuleInit(): void {
    this.registry.register('eventId', async (eventId, em) => {
      const known = this.teamOfEvent.get(eventId);
      if (known !== undefined) return known;
      // One column of one row, no entity.
      const [row] = await em
        .getConnection()
        .execute<Array<{ team_id: string }>>('select `team_id` from `events` where `id` = ? limit 1', [
          eventId,
        ]);
      if (!row) return null;
      if (this.teamOfEvent.size >= TEAM_OF_EVENT_ENTRIES) this.teamOfEvent.clear();
      this.teamOfEvent.set(eventId, row.team_id);
      return row.team_id;
    });
  }
}
