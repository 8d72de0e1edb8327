import {
  type MiddlewareConsumer,
  Module,
  type NestModule,
  OnModuleInit,
  RequestMethod,
} from '@nestjs/common';
import { AuditModule } from '../audit/audit.module';
import { EventsModule } from '../events/events.module';
import { QueueModule } from '../queue/queue.module';
import { TeamScopeRegistry } from '../teams/team-scope.registry';
import { TeamsModule } from '../teams/teams.module';
import { accessTokenFromQuery } from './access-token-query.middleware';
import { FitRun } from './entities/fit-run.entity';
import { FitsController } from './fits.controller';
import { FitsService } from './fits.service';

/** The API side of fits: submit, read, stream. The worker side is FitsWorkerModule. */
@Module({
  imports: [TeamsModule, EventsModule, AuditModule, QueueModule],
  controllers: [FitsController],
  providers: [FitsService],
  exports: [FitsService],
})
export class FitsModule implements NestModule, OnModuleInit {
  constructor(private readonly registry: TeamScopeRegistry) {}

  configure(consumer: MiddlewareConsumer): void {
    consumer.apply(accessTokenFromQuery).forRoutes({ path: 'fits/:fitId/events', method: RequestMethod.GET });
  }

  onModuleInit(): void {
    this.registry.register('fitId', async (fitId, em) => {
      const fit = await em.findOne(FitRun, { id: fitId }, { populate: ['event'], fields: ['event.team'] });
      return fit?.event.team.id ?? null;
    });
  }
}
