import 'reflect-metadata';
import { NestFactory } from '@nestjs/core';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { AppModule } from './app.module';
import { configureApp } from './bootstrap';
import { loadConfigOrExit } from './config/app-config';

async function main(): Promise<void> {
  const config = loadConfigOrExit(process.env);
  const app = await NestFactory.create<NestExpressApplication>(AppModule.register(config), {
    bufferLogs: true,
  });
  configureApp(app, config);
  await app.listen(config.port, config.host);
  // The start and test scripts wait for exactly this line.
  console.log(`ready api http://${config.host}:${config.port}`);
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : String(error));
  process.exit(1);
});
