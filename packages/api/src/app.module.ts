import { DynamicModule, Module } from '@nestjs/common';
import { APP_FILTER, APP_GUARD } from '@nestjs/core';
import { LoggerModule } from 'nestjs-pino';
import pino from 'pino';
import { AdminModule } from './admin/admin.module';
import { AuditModule } from './audit/audit.module';
import { AuthModule } from './auth/auth.module';
import { BodiesModule } from './bodies/bodies.module';
import { Chi2MapsModule } from './chi2-maps/chi2-maps.module';
import { ComparisonsModule } from './comparisons/comparisons.module';
import { ChordsModule } from './chords/chords.module';
import { JwtAuthGuard } from './auth/jwt-auth.guard';
import { HttpErrorFilter } from './common/http-error.filter';
import { redactUrl } from './common/redact-url';
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
import { PlanningModule } from './planning/planning.module';
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
      pinoHttp: [
        {
          level: config.logLevel,
          // One line per request says who asked for what and how it went; headers stay out (they
          // cost a read request a tenth of its time), and tokens and cookies must never get in: the URL
          // loses its secret query values and path tokens (redactUrl).
          serializers: {
            req: (req: { id: unknown; method: string; url: string; remoteAddress?: string }) => ({
              id: req.id,
              method: req.method,
              url: redactUrl(req.url),
              remoteAddress: req.remoteAddress,
            }),
            res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
          },
          redact: ['req.headers.authorization', 'req.headers.cookie', 'res.headers["set-cookie"]'],
        },
        // Written off the request path; pino flushes what is buffered when the process exits.
        pino.destination({ sync: false }),
      ],
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
        BodiesModule,
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
        PlanningModule,
        Chi2MapsModule,
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
