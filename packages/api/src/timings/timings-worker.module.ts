import { BullModule } from '@nestjs/bullmq';
import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module';
import { StorageModule } from '../storage/storage.module';
import { TimingRequeue } from './timing-requeue';
import { TimingsProcessor } from './timings.processor';
import { TIMINGS_QUEUE } from './timings-queue';

/** Imported by the worker entry only, so the API process never consumes timing jobs. */
@Module({
  imports: [AuditModule, StorageModule, BullModule.registerQueue({ name: TIMINGS_QUEUE })],
  providers: [TimingsProcessor, TimingRequeue],
})
export class TimingsWorkerModule {}
