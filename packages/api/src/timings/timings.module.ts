import { BullModule } from '@nestjs/bullmq';
import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module';
import { ReportsModule } from '../reports/reports.module';
import { TeamsModule } from '../teams/teams.module';
import { TimingsController } from './timings.controller';
import { TimingsService } from './timings.service';
import { TIMINGS_QUEUE } from './timings-queue';

/** API side: routes that queue timing jobs and act on their results. Team scope comes from :eventId. */
@Module({
  imports: [TeamsModule, AuditModule, ReportsModule, BullModule.registerQueue({ name: TIMINGS_QUEUE })],
  controllers: [TimingsController],
  providers: [TimingsService],
})
export class TimingsModule {}
