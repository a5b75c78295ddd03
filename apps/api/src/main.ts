import 'reflect-metadata';
import { Logger } from '@nestjs/common';
import type { ConfigType } from '@nestjs/config';
import { NestFactory } from '@nestjs/core';
import { AppModule } from './app.module';
import { configureApp } from './app.setup';
import { appConfig } from './config/app.config';

async function bootstrap(): Promise<void> {
  // Start-up route listings are noise under `npm test`; keep warnings and errors there.
  const quiet = process.env.CRIBRA_ENV === 'test';
  const app = await NestFactory.create(AppModule, { logger: quiet ? ['error', 'warn'] : ['error', 'warn', 'log'] });
  configureApp(app);
  app.enableShutdownHooks();
  const cfg = app.get<ConfigType<typeof appConfig>>(appConfig.KEY);
  await app.listen(cfg.port, '127.0.0.1');
  new Logger('Cribra').log(`API listening on http://127.0.0.1:${cfg.port}/api (${cfg.env})`);
}

bootstrap().catch((err: unknown) => {
  console.error(`The API could not start: ${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
});
