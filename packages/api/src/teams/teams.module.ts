import { MikroOrmModule } from '@mikro-orm/nestjs';
import { Module, OnModuleInit } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module';
import { UsersModule } from '../users/users.module';
import { Membership } from './entities/membership.entity';
import { Team } from './entities/team.entity';
import { MeController } from './me.controller';
import { RolesGuard } from './roles.guard';
import { TeamScopeRegistry } from './team-scope.registry';
import { TeamsController } from './teams.controller';
import { TeamsService } from './teams.service';

@Module({
  imports: [MikroOrmModule.forFeature([Team, Membership]), UsersModule, AuditModule],
  controllers: [TeamsController, MeController],
  providers: [TeamsService, TeamScopeRegistry, RolesGuard],
  exports: [MikroOrmModule, TeamsService, TeamScopeRegistry, RolesGuard],
})
export class TeamsModule implements OnModuleInit {
  constructor(private readonly registry: TeamScopeRegistry) {}

  onModuleInit(): void {
    this.registry.register('teamId', async (teamId, em) =>
      (await em.count(Team, { id: teamId })) > 0 ? teamId : null,
    );
  }
}
