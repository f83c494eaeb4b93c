import type { NestExpressApplication } from '@nestjs/platform-express';
import type { NextFunction, Request, Response } from 'express';
import { DocumentBuilder, SwaggerModule } from '@nestjs/swagger';
import compression from 'compression';
import helmet from 'helmet';
import { SESSION_COOKIE } from './auth/session-cookie.js';
import { loadAppConfig } from './config/app.config.js';
import { bodyParserErrors, jsonBodyGuard } from './common/json-body-guard.js';
import { validationPipe } from './common/validation.js';

export const JSON_BODY_LIMIT = '5mb';

const helmetHeaders = helmet({
  contentSecurityPolicy: {
    useDefaults: false,
    directives: {
      defaultSrc: ["'self'"],
      scriptSrc: ["'self'"],
      // Chakra UI (emotion) and Plotly inject style elements at run time.
      styleSrc: ["'self'", "'unsafe-inline'"],
      // Plotly draws images and downloads snapshots through blob: and data: URLs.
      imgSrc: ["'self'", 'data:', 'blob:'],
      fontSrc: ["'self'", 'data:'],
      connectSrc: ["'self'"],
      workerSrc: ["'self'", 'blob:'],
      objectSrc: ["'none'"],
      baseUri: ["'self'"],
      formAction: ["'self'"],
      frameAncestors: ["'none'"],
    },
  },
  referrerPolicy: { policy: 'no-referrer' },
  strictTransportSecurity: false,
});
const hsts = helmet.strictTransportSecurity({ maxAge: 31_536_000, includeSubDomains: true });

/** HSTS only over TLS (directly or behind a trusted proxy): over plain HTTP it would lock browsers out of a lab server. */
function securityHeaders(req: Request, res: Response, next: NextFunction): void {
  helmetHeaders(req, res, (error?: unknown) => {
    if (error || !req.secure) return next(error);
    hsts(req, res, next);
  });
}

/** Everything main.ts applies to the app, shared with the end-to-end tests. */
export function configureApp(app: NestExpressApplication) {
  app.setGlobalPrefix('api');
  app.useGlobalPipes(validationPipe);
  app.useBodyParser('json', { limit: JSON_BODY_LIMIT });
  app.use(bodyParserErrors);
  app.use(jsonBodyGuard);
  app.set('trust proxy', 'loopback');
  app.disable('x-powered-by');
  app.use(securityHeaders);
  app.use(compression());
  app.enableShutdownHooks();
  if (loadAppConfig().apiDocs) {
    const document = SwaggerModule.createDocument(
      app,
      new DocumentBuilder()
        .setTitle('Meritline API')
        .setDescription('Calibration, method validation and routine batches for analytical laboratories.')
        .setVersion('1')
        .addBearerAuth()
        .addCookieAuth(
          SESSION_COOKIE,
          {
            type: 'apiKey',
            in: 'cookie',
            description: 'Set by signing in; a change (not GET) signed in by it alone also needs `X-Requested-With: meritline`.',
          },
          SESSION_COOKIE,
        )
        .build(),
    );
    SwaggerModule.setup('api/docs', app, document);
  }
  return app;
}
