import 'reflect-metadata';
import { writeFileSync } from 'node:fs';
import path from 'node:path';
import { NestFactory } from '@nestjs/core';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { AppModule } from './app.module.js';
import { toAppConfig } from './config/app-config.js';
import { EnvironmentVariables } from './config/env.validation.js';
import { setupApp } from './setup-app.js';

/**
 * Writes the OpenAPI document (apps/api/openapi.json, committed). Runs in Nest's preview mode, so no
 * database, storage or mail connection is made. `node dist/openapi.js [out]`.
 */
async function main(): Promise<void> {
  const env = Object.assign(new EnvironmentVariables(), {
    DB_HOST: '127.0.0.1',
    DB_PORT: 3306,
    DB_NAME: 'preview',
    DB_USER: 'preview',
    DB_PASSWORD: 'preview',
    JWT_SECRET: 'x'.repeat(32),
    S3_ENDPOINT: 'http://127.0.0.1:1',
    S3_BUCKET: 'preview',
    S3_ACCESS_KEY_ID: 'x',
    S3_SECRET_ACCESS_KEY: 'x',
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: 25,
  });
  const app = await NestFactory.create<NestExpressApplication>(AppModule.forRoot(toAppConfig(env)), {
    preview: true,
    logger: false,
  });
  const document = setupApp(app);
  const out = process.argv[2] ?? path.resolve(__dirname, '../openapi.json');
  writeFileSync(out, JSON.stringify(document, null, 2) + '\n');
  await app.close();
  console.log(`OpenAPI document written to ${out}`);
}

void main();
