import 'reflect-metadata';
import cluster from 'node:cluster';
import { NestFactory } from '@nestjs/core';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { superviseApiProcesses } from './api-processes';
import { AppModule } from './app.module';
import { configureApp } from './bootstrap';
import { loadConfigOrExit } from './config/app-config';

async function main(): Promise<void> {
  const config = loadConfigOrExit(process.env);
  // The start and test scripts wait for exactly this line.
  const readyLine = `ready api http://${config.host}:${config.port}`;
  if (cluster.isPrimary && config.apiProcesses > 1) {
    // All processes must sign and check tokens with one secret, also when demo mode made one up.
    superviseApiProcesses(config.apiProcesses, { ...process.env, JWT_SECRET: config.jwtSecret }, readyLine);
    return;
  }
  const app = await NestFactory.create<NestExpressApplication>(AppModule.register(config), {
    bufferLogs: true,
  });
  configureApp(app, config);
  await app.listen(config.port, config.host);
  if (cluster.isPrimary) console.log(readyLine);
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : String(error));
  process.exit(1);
});
