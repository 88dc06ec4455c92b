import 'reflect-metadata';
import { Logger } from '@nestjs/common';
import { NestFactory } from '@nestjs/core';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { AppModule } from './app.module';
import { AppConfig } from './config/app-config';
import { configureApp } from './configure-app';

async function bootstrap(): Promise<void> {
  // abortOnError false: a bad environment throws here (with the list of bad variables) instead of aborting.
  const app = await NestFactory.create<NestExpressApplication>(AppModule, { abortOnError: false });
  configureApp(app);
  app.enableShutdownHooks(['SIGTERM', 'SIGINT']);
  const config = app.get(AppConfig);
  await app.listen(config.port, config.host);
  new Logger('Keyloom').log(
    `Listening on http://${config.host}:${config.port} (API under /api, docs at /api/docs, NODE_ENV=${config.nodeEnv})`,
  );
}

bootstrap().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
