import { ValidationPipe } from '@nestjs/common';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { DocumentBuilder, SwaggerModule, type OpenAPIObject } from '@nestjs/swagger';
import { DomainExceptionFilter } from './common/errors/domain-exception.filter.js';
import { validationExceptionFactory } from './common/errors/validation-exception.factory.js';
import { verifyJsonDepth } from './common/http/json-guard.js';
import { TextIntegrityPipe } from './common/http/text-integrity.pipe.js';
import { APP_VERSION } from './modules/app-info/app-info.controller.js';

/** Everything main.ts, the e2e tests and the OpenAPI export share: prefix, pipe, filter, docs. */
export function setupApp(app: NestExpressApplication): OpenAPIObject {
  // Nesting is checked on the raw bytes before parsing (a deep body cannot cost a stack overflow).
  // (Nest's option type leaves `verify` out because it uses it for rawBody, which Roundbook does not.)
  const jsonOptions = { limit: '2mb', verify: verifyJsonDepth };
  app.useBodyParser('json', jsonOptions);
  app.set('trust proxy', 'loopback');
  app.disable('x-powered-by');
  app.setGlobalPrefix('api');
  app.useGlobalPipes(
    new TextIntegrityPipe(),
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
