import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module';
import { TeamsModule } from '../teams/teams.module';
import { DynamicsController } from './dynamics.controller';
import { DynamicsService } from './dynamics.service';

/** A body's context beside the ring fits. Team scope comes from :bodyId or :eventId. */
@Module({
  imports: [TeamsModule, AuditModule],
  controllers: [DynamicsController],
  providers: [DynamicsService],
})
export class DynamicsModule {}
