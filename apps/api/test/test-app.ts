import type { INestApplication } from '@nestjs/common';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { Test } from '@nestjs/testing';
import { AppModule } from '../src/app.module';
import { loadAppConfig, type AppConfig } from '../src/config/app-config';
import { setupApp } from '../src/setup-app';

/**
 * Boots the whole app in-process against the real MariaDB, S3 fake and SMTP fake that `npm test` started
 * (their addresses come from the environment infra/test.mjs sets).
 */
export async function createTestApp(
  overrides: (c: AppConfig) => AppConfig = (c) => c,
): Promise<INestApplication> {
  const config = overrides(loadAppConfig());
  const moduleRef = await Test.createTestingModule({ imports: [AppModule.forRoot(config)] }).compile();
  const app = moduleRef.createNestApplication<NestExpressApplication>({ logger: ['error'] });
  setupApp(app);
  await app.init();
  return app;
}

export const DEMO_PASSWORD = process.env.DEMO_PASSWORD ?? 'rb-demo-2026';
