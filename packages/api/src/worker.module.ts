import { DynamicModule, Module } from '@nestjs/common';
import { coreImports } from './app.module';
import { Chi2MapsWorkerModule } from './chi2-maps/chi2-maps-worker.module';
import { ComparisonsWorkerModule } from './comparisons/comparisons-worker.module';
import type { AppConfig } from './config/app-config';
import { FitsWorkerModule } from './fits/fits-worker.module';
import { StorageModule } from './storage/storage.module';
import { TimingsWorkerModule } from './timings/timings-worker.module';

/** The worker process: no HTTP. Job processors (fits, ...) are added to `imports` here. */
@Module({})
export class WorkerModule {
  static register(config: AppConfig): DynamicModule {
    return {
      module: WorkerModule,
      imports: [
        ...(coreImports(config) ?? []),
        StorageModule,
        FitsWorkerModule,
        TimingsWorkerModule,
        ComparisonsWorkerModule,
        Chi2MapsWorkerModule,
      ],
    };
  }
}
