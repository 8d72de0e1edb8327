import { Module, OnModuleInit } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module';
import { EventsModule } from '../events/events.module';
import { TeamScopeRegistry } from '../teams/team-scope.registry';
import { TeamsModule } from '../teams/teams.module';
import { BodiesController } from './bodies.controller';
import { BodiesService } from './bodies.service';

@Module({
  imports: [TeamsModule, AuditModule, EventsModule],
  controllers: [BodiesController],
  providers: [BodiesService],
  exports: [BodiesService],
})
export class BodiesModule implements OnModuleInit {
  constructor(private readonly registry: TeamScopeRegistry) {}

  onModuleInit(): void {
    this.registry.register('bodyId', async (bodyId, em) => {
      const [row] = await em
        .getConnection()
        .execute<Array<{ team_id: string }>>('select `team_id` from `bodies` where `id` = ? limit 1', [
          bodyId,
        ]);
      return row?.team_id ?? null;
    });
  }
}
