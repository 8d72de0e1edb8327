import { BullModule } from '@nestjs/bullmq';
import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module';
import { Chi2MapRequeue } from './chi2-map-requeue';
import { Chi2MapsProcessor } from './chi2-maps.processor';
import { CHI2_MAPS_QUEUE } from './chi2-maps-queue';

/** Imported by the worker entry only, so the API process never consumes map jobs. */
@Module({
  imports: [AuditModule, BullModule.registerQueue({ name: CHI2_MAPS_QUEUE })],
  providers: [Chi2MapsProcessor, Chi2MapRequeue],
})
export class Chi2MapsWorkerModule {}
