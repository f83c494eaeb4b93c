import 'reflect-metadata';
import { Logger } from '@nestjs/common';
import { NestFactory } from '@nestjs/core';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { AppModule } from './app.module.js';
import { ConfigError, loadAppConfig } from './config/app.config.js';
import { configureApp } from './configure-app.js';

try {
  // The demo seeder reads SEED_DEMO; production never gets demo accounts.
  if (!loadAppConfig().seedDemo) process.env.SEED_DEMO = 'false';
} catch (error) {
  if (error instanceof ConfigError) {
    console.error(`Meritline cannot start: ${error.message}`);
    process.exit(1);
  }
  throw error;
}

const app = configureApp(await NestFactory.create<NestExpressApplication>(AppModule, { bodyParser: false }));
const port = loadAppConfig().port;
await app.listen(port);
// enableShutdownHooks closes the server (no new connections, in-flight requests finish) and the database on SIGTERM;
// a request that hangs must not keep the process alive past this bound.
const SHUTDOWN_GRACE_MS = 10_000;
for (const signal of ['SIGTERM', 'SIGINT'] as const) {
  process.once(signal, () => {
    setTimeout(() => {
      new Logger('Meritline').warn(`Requests still running after ${SHUTDOWN_GRACE_MS / 1000} s; stopping anyway.`);
      process.exit(1);
    }, SHUTDOWN_GRACE_MS).unref();
  });
}
new Logger('Meritline').log(`Serving on http://localhost:${port} (API under /api, documentation at /api/docs)`);
