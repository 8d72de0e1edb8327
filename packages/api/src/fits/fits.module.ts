import { Module, OnModuleInit } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module';
import { EventsModule } from '../events/events.module';
import { QueueModule } from '../queue/queue.module';
import { TeamScopeRegistry } from '../teams/team-scope.registry';
import { TeamsModule } from '../teams/teams.module';
import { FitRun } from './entities/fit-run.entity';
import { FitsController } from './fits.controller';
import { FitsService } from './fits.service';
import { StreamTickets } from './stream-tickets';

/** The API side of fits: submit, read, stream. The worker side is FitsWorkerModule. */
@Module({
  imports: [TeamsModule, EventsModule, AuditModule, QueueModule],
  controllers: [FitsController],
  providers: [FitsService, StreamTickets],
  exports: [FitsService],
})
export class FitsModule implements OnModuleInit {
  constructor(private readonly registry: TeamScopeRegistry) {}

  onModuleInit(): void {
    this.registry.register('fitId', async (fitId, em) => {
      const fit = await em.findOne(FitRun, { id: fitId }, { populate: ['event'], fields: ['event.team'] });
      return fit?.event.team.id ?? null;
    });
  }
}
