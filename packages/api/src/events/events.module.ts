import { Module, OnModuleInit } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module';
import { TeamScopeRegistry } from '../teams/team-scope.registry';
import { TeamsModule } from '../teams/teams.module';
import { OccultationEvent } from './entities/occultation-event.entity';
import { EventsController } from './events.controller';
import { EventsService } from './events.service';

@Module({
  imports: [TeamsModule, AuditModule],
  controllers: [EventsController],
  providers: [EventsService],
  exports: [EventsService],
})
export class EventsModule implements OnModuleInit {
  constructor(private readonly registry: TeamScopeRegistry) {}

  /** A soft-deleted event still resolves to its team, so that a coordinator can restore it. */
  onModuleInit(): void {
    this.registry.register('eventId', async (eventId, em) => {
      const event = await em.findOne(OccultationEvent, { id: eventId }, { fields: ['team'] });
      return event?.team.id ?? null;
    });
  }
}
