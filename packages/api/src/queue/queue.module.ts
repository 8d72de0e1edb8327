import { BullModule } from '@nestjs/bullmq';
import { Module } from '@nestjs/common';
import { AppConfig } from '../config/app-config';

/** Queue that carries fit jobs from the API to the worker. */
export const FITS_QUEUE = 'fits';

/** Imported by both entry points, so the API enqueues and the worker consumes the same queue. */
@Module({
  imports: [
    BullModule.forRootAsync({
      inject: [AppConfig],
      // BullMQ's blocking reads require maxRetriesPerRequest: null.
      useFactory: (config: AppConfig) => ({
        connection: { url: config.redisUrl, maxRetriesPerRequest: null },
        prefix: 'limbus',
      }),
    }),
    BullModule.registerQueue({ name: FITS_QUEUE }),
  ],
  exports: [BullModule],
})
export class QueueModule {}
