import 'reflect-metadata';
import { NestFactory } from '@nestjs/core';
import { Logger } from 'nestjs-pino';
import { loadConfigOrExit } from './config/app-config';
import { FITS_QUEUE } from './queue/queue.module';
import { WorkerModule } from './worker.module';

async function main(): Promise<void> {
  const config = loadConfigOrExit(process.env);
  const app = await NestFactory.createApplicationContext(WorkerModule.register(config), { bufferLogs: true });
  app.useLogger(app.get(Logger));
  app.enableShutdownHooks();
  await app.init();
  // Host and port only: the URL may carry a password.
  const redis = new URL(config.redisUrl);
  console.log(`ready worker redis://${redis.host} queue=${FITS_QUEUE}`);
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : String(error));
  process.exit(1);
});
