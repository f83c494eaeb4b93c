import type { NestExpressApplication } from '@nestjs/platform-express';
import { DocumentBuilder, SwaggerModule } from '@nestjs/swagger';
import { jsonBodyGuard } from './common/json-body-guard.js';
import { validationPipe } from './common/validation.js';

export const JSON_BODY_LIMIT = '5mb';

/** Everything main.ts applies to the app, shared with the end-to-end tests. */
export function configureApp(app: NestExpressApplication) {
  app.setGlobalPrefix('api');
  app.useGlobalPipes(validationPipe);
  app.useBodyParser('json', { limit: JSON_BODY_LIMIT });
  app.use(jsonBodyGuard);
  app.set('trust proxy', 'loopback');
  app.enableShutdownHooks();
  const document = SwaggerModule.createDocument(
    app,
    new DocumentBuilder()
      .setTitle('Meritline API')
      .setDescription('Calibration, method validation and routine batches for analytical laboratories.')
      .setVersion('1')
      .addBearerAuth()
      .build(),
  );
  SwaggerModule.setup('api/docs', app, document);
  return app;
}
