import { Module } from '@nestjs/common';
import { QueueModule } from '../queue/queue.module';
import { StorageModule } from '../storage/storage.module';
import { HealthController } from './health.controller';

@Module({ imports: [QueueModule, StorageModule], controllers: [HealthController] })
export class HealthModule {}
