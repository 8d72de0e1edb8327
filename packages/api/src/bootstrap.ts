import { existsSync } from 'node:fs';
import path from 'node:path';
import { Reflector } from '@nestjs/core';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { DocumentBuilder, SwaggerModule } from '@nestjs/swagger';
import express, { type NextFunction, type Request, type Response } from 'express';
import helmet from 'helmet';
import { Logger } from 'nestjs-pino';
import { ContentTypeGuard } from './common/content-type.guard';
import type { AppConfig } from './config/app-config';

export const API_PREFIX = 'api';
const BODY_LIMIT = '1mb';

const isApi = (req: Request): boolean =>
  req.path === `/${API_PREFIX}` || req.path.startsWith(`/${API_PREFIX}/`);

/**
 * Everything main.ts does to the application before listening, shared with the e2e tests so they
 * exercise the same prefix, limits, headers and documents as production.
 */
export function configureApp(app: NestExpressApplication, config: AppConfig): void {
  app.useLogger(app.get(Logger));
  app.disable('x-powered-by');
  if (config.trustProxy !== null) app.set('trust proxy', config.trustProxy);
  const https = config.publicUrl.startsWith('https:');
  // Over plain http (the demo) HSTS and upgrade-insecure-requests would send the browser to an https port nobody serves.
  app.use(
    helmet({
      strictTransportSecurity: https,
      contentSecurityPolicy: { directives: { upgradeInsecureRequests: https ? [] : null } },
    }),
  );
  // Every API answer depends on who asks (or is a sign-in, a token, a refusal): no browser or proxy may
  // keep it, or the next person at a shared machine could be shown it. The client's files keep their caching.
  app.use((req: Request, res: Response, next: NextFunction) => {
    if (isApi(req)) res.setHeader('Cache-Control', 'no-store');
    next();
  });
  app.useGlobalGuards(new ContentTypeGuard(app.get(Reflector)));
  app.useBodyParser('json', { limit: BODY_LIMIT });
  app.useBodyParser('urlencoded', { limit: BODY_LIMIT, extended: false });
  app.setGlobalPrefix(API_PREFIX);
  app.enableShutdownHooks();

  const document = SwaggerModule.createDocument(
    app,
    new DocumentBuilder()
      .setTitle('Limbus API')
      .setDescription(
        'Teams, sign-in and occultation events. Errors are { statusCode, error, message, issues? }.',
      )
      .setVersion('1')
      .addBearerAuth()
      .build(),
  );
  SwaggerModule.setup(`${API_PREFIX}/docs`, app, document, { jsonDocumentUrl: `${API_PREFIX}/docs-json` });

  serveClient(app, config.webDistDir);
}

/**
 * The built client is served by the API itself so the demo needs one port. Any GET outside /api
 * that is not a file gets index.html, so client routes such as /invitations/:token load directly.
 */
function serveClient(app: NestExpressApplication, webDistDir: string): void {
  const indexHtml = path.join(webDistDir, 'index.html');
  if (!existsSync(indexHtml)) {
    app.get(Logger).warn(`no client build at ${webDistDir}; serving the API only`);
    return;
  }
  // API requests skip the file lookup: a stat of the client folder on every read is pure cost.
  const assets = express.static(webDistDir, { index: false, fallthrough: true });
  app.use((req: Request, res: Response, next: NextFunction) =>
    isApi(req) ? next() : assets(req, res, next),
  );
  app.use((req: Request, res: Response, next: NextFunction) => {
    if ((req.method === 'GET' || req.method === 'HEAD') && !isApi(req) && req.accepts('html')) {
      res.sendFile(indexHtml);
      return;
    }
    next();
  });
}
