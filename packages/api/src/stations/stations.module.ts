import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module';
import { EventsModule } from '../events/events.module';
import { TeamsModule } from '../teams/teams.module';
import { StationsController } from './stations.controller';
import { StationsService } from './stations.service';

@Module({
  imports: [TeamsModule, EventsModule, AuditModule],
  controllers: [StationsController],
  providers: [StationsService],
})
export class StationsModule {}
