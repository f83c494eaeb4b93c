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
new Logger('Meritline').log(`Serving on http://localhost:${port} (API under /api, documentation at /api/docs)`);
