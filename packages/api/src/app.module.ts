import { DynamicModule, Module } from '@nestjs/common';
import { APP_FILTER, APP_GUARD } from '@nestjs/core';
import { LoggerModule } from 'nestjs-pino';
import { AdminModule } from './admin/admin.module';
import { AuditModule } from './audit/audit.module';
import { AuthModule } from './auth/auth.module';
import { ComparisonsModule } from './comparisons/comparisons.module';
import { ChordsModule } from './chords/chords.module';
import { JwtAuthGuard } from './auth/jwt-auth.guard';
import { HttpErrorFilter } from './common/http-error.filter';
import { AppConfig } from './config/app-config';
import { ConfigModule } from './config/config.module';
import { DatabaseModule } from './database/database.module';
import { DynamicsModule } from './dynamics/dynamics.module';
import { EventsModule } from './events/events.module';
import { ExportsModule } from './exports/exports.module';
import { FitsModule } from './fits/fits.module';
import { HealthModule } from './health/health.module';
import { InvitationsModule } from './invitations/invitations.module';
import { MailModule } from './mail/mail.module';
import { QueueModule } from './queue/queue.module';
import { RedisModule } from './redis/redis.module';
import { ShapesModule } from './shapes/shapes.module';
import { StorageModule } from './storage/storage.module';
import { ReportsModule } from './reports/reports.module';
import { StationsModule } from './stations/stations.module';
import { ReviewsModule } from './reviews/reviews.module';
import { UploadsModule } from './uploads/uploads.module';
import { RolesGuard } from './teams/roles.guard';
import { TeamsModule } from './teams/teams.module';
import { TimingsModule } from './timings/timings.module';
import { UsersModule } from './users/users.module';

/** Modules both entry points need: configuration, logging, database and the queue. */
export function coreImports(config: AppConfig): DynamicModule['imports'] {
  return [
    ConfigModule.register(config),
    LoggerModule.forRoot({
      pinoHttp: {
        level: config.logLevel,
        // Tokens and cookies must never reach the log.
        redact: ['req.headers.authorization', 'req.headers.cookie', 'res.headers["set-cookie"]'],
      },
    }),
    DatabaseModule,
    RedisModule,
    QueueModule,
  ];
}

/** The API. Feature modules (events, fits, ...) are added to `imports` beside the ones here. */
@Module({})
export class AppModule {
  static register(config: AppConfig): DynamicModule {
    return {
      module: AppModule,
      imports: [
        ...(coreImports(config) ?? []),
        UsersModule,
        TeamsModule,
        AuthModule,
        InvitationsModule,
        MailModule,
        StorageModule,
        HealthModule,
        AdminModule,
        EventsModule,
        AuditModule,
        FitsModule,
        StationsModule,
        ChordsModule,
        ReportsModule,
        ReviewsModule,
        UploadsModule,
        ExportsModule,
        ComparisonsModule,
        TimingsModule,
        DynamicsModule,
        ShapesModule,
      ],
      providers: [
        // Order matters: authentication first, then roles read the authenticated user.
        { provide: APP_GUARD, useExisting: JwtAuthGuard },
        { provide: APP_GUARD, useExisting: RolesGuard },
        { provide: APP_FILTER, useClass: HttpErrorFilter },
      ],
    };
  }
}
