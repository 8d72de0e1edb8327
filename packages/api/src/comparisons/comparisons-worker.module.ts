import { BullModule } from '@nestjs/bullmq';
import { Module } from '@nestjs/common';
import { JOINT_QUEUE } from './joint-queue';
import { JointPolesProcessor } from './joint-poles.processor';

/** Imported by the worker entry only, so the API process never runs joint fits. */
@Module({ imports: [BullModule.registerQueue({ name: JOINT_QUEUE })], providers: [JointPolesProcessor] })
export class ComparisonsWorkerModule {}
