import 'reflect-metadata';
import { Logger } from '@nestjs/common';
import { NestFactory } from '@nestjs/core';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { AppModule } from './app.module.js';
import { loadAppConfig } from './config/app-config.js';
import { setupApp } from './setup-app.js';

async function bootstrap(): Promise<void> {
  let config;
  try {
    config = loadAppConfig();
  } catch (e) {
    console.error(e instanceof Error ? e.message : String(e));
    process.exit(1);
  }
  const app = await NestFactory.create<NestExpressApplication>(AppModule.forRoot(config), {
    bufferLogs: false,
  });
  setupApp(app);
  await app.listen(config.port, config.host);
  Logger.log(`Roundbook listening on http://${config.host}:${config.port}`, 'Main');
}

void bootstrap();
