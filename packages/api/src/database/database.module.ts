import { MikroOrmModule } from '@mikro-orm/nestjs';
import { MariaDbDriver } from '@mikro-orm/mariadb';
import { Module } from '@nestjs/common';
import { AppConfig } from '../config/app-config';
import { ormOptions } from './orm-options';

@Module({
  imports: [
    MikroOrmModule.forRootAsync({
      inject: [AppConfig],
      useFactory: (config: AppConfig) => ormOptions(config),
      driver: MariaDbDriver,
    }),
  ],
})
export class DatabaseModule {}
