import { ValidationPipe } from '@nestjs/common';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { DocumentBuilder, SwaggerModule, type OpenAPIObject } from '@nestjs/swagger';
import helmet from 'helmet';
import { DomainExceptionFilter } from './common/errors/domain-exception.filter.js';
import { validationExceptionFactory } from './common/errors/validation-exception.factory.js';
import { guardedJson } from './common/http/guarded-json.js';
import { webAppHandler } from './common/http/web-app.js';
import { APP_CONFIG, type AppConfig } from './config/app-config.js';
import { APP_VERSION } from './modules/app-info/app-info.controller.js';

/** The object store's origin, for photos shown by signed URL; none when it cannot be read. */
function storageOrigin(config: AppConfig | undefined): string[] {
  try {
    return config ? [new URL(config.storage.endpoint).origin] : [];
  } catch {
    return [];
  }
}

/** Everything main.ts, the e2e tests and the OpenAPI export share: prefix, pipe, filter, docs. */
export function setupApp(app: NestExpressApplication): OpenAPIObject {
  let config: AppConfig | undefined;
  try {
    config = app.get<AppConfig>(APP_CONFIG, { strict: false });
  } catch {
    // preview mode (OpenAPI export): no providers, no requests
  }
  const trustProxy = config?.trustProxy ?? false;
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          // Fluent's Griffel writes its styles into a <style> sheet at run time (stack-notes §12).
          'style-src': ["'self'", "'unsafe-inline'"],
          // Photos load from object storage by short-lived signed URLs (issue 14).
          'img-src': ["'self'", 'data:', 'blob:', ...storageOrigin(config)],
          'worker-src': ["'self'"],
          'frame-ancestors': ["'none'"],
          // Served over plain http on a site network too: upgrading would break it.
          'upgrade-insecure-requests': null,
        },
      },
      frameguard: { action: 'deny' },
      referrerPolicy: { policy: 'no-referrer' },
      // Only on https; an http site install must not be told to refuse itself.
      strictTransportSecurity: config?.appUrl.startsWith('https:') ?? false,
    }),
  );
  const web = config?.webDistDir ? webAppHandler(config.webDistDir, config.env === 'production') : undefined;
  if (web) app.use(web);
  // Size and depth limits per route, checked on the raw bytes before anything is parsed into classes.
  app.use(guardedJson());
  // X-Forwarded-For is believed only from the proxies TRUST_PROXY names (default: none), so a forged header
  // cannot pick the address the sign-in limits count.
  app.set('trust proxy', trustProxy);
  app.disable('x-powered-by');
  app.setGlobalPrefix('api');
  app.useGlobalPipes(
    new ValidationPipe({
      whitelist: true,
      forbidNonWhitelisted: true,
      transform: true,
      exceptionFactory: validationExceptionFactory,
    }),
  );
  app.useGlobalFilters(new DomainExceptionFilter());
  app.enableShutdownHooks();
  const document = SwaggerModule.createDocument(
    app,
    new DocumentBuilder()
      .setTitle('Roundbook API')
      .setDescription('Round-by-round face mapping and shift handover for tunnels and underground headings.')
      .setVersion(APP_VERSION)
      .addBearerAuth()
      .build(),
  );
  SwaggerModule.setup('api/docs', app, document, { jsonDocumentUrl: 'api/docs/openapi.json' });
  return document;
}
