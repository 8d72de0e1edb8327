import { DynamicModule, Global, Module } from '@nestjs/common';
import { AppConfig } from './app-config';

/** Global so feature modules inject AppConfig without importing this module each time. */
@Global()
@Module({})
export class ConfigModule {
  static register(config: AppConfig): DynamicModule {
    return {
      module: ConfigModule,
      providers: [{ provide: AppConfig, useValue: config }],
      exports: [AppConfig],
    };
  }
}
