import { DynamicModule, Module } from '@nestjs/common';
import { coreImports } from './app.module';
import type { AppConfig } from './config/app-config';
import { StorageModule } from './storage/storage.module';

/** The worker process: no HTTP. Job processors (fits, ...) are added to `imports` here. */
@Module({})
export class WorkerModule {
  static register(config: AppConfig): DynamicModule {
    return { module: WorkerModule, imports: [...(coreImports(config) ?? []), StorageModule] };
  }
}
