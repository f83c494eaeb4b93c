import 'reflect-metadata';
import { Test } from '@nestjs/testing';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import type { App } from 'supertest/types.js';
import { AppModule } from '../../src/app.module.js';
import { configureApp } from '../../src/configure-app.js';

export const DEMO_PASSWORD = 'meritline-demo';
export const DEMO = {
  analyst: 'analyst@meritline.test',
  analyst2: 'analyst2@meritline.test',
  reviewer: 'reviewer@meritline.test',
  quality: 'quality@meritline.test',
  admin: 'admin@meritline.test',
} as const;

export interface TestApp {
  app: NestExpressApplication;
  http: () => ReturnType<typeof request>;
  databasePath: string;
  tokenFor: (email: string, password?: string) => Promise<string>;
  close: () => Promise<void>;
}

/** A real app in-process on a fresh SQLite file built by the real migrations and seeded with the demo data. */
export async function createTestApp(env: Record<string, string> = {}): Promise<TestApp> {
  const dir = mkdtempSync(join(tmpdir(), 'meritline-e2e-'));
  const databasePath = join(dir, 'test.sqlite');
  Object.assign(process.env, { NODE_ENV: 'test', DATABASE_URL: `sqlite:${databasePath}`, DATA_DIR: dir, SMTP_URL: '', ...env });
  const moduleRef = await Test.createTestingModule({ imports: [AppModule] }).compile();
  const app = configureApp(moduleRef.createNestApplication<NestExpressApplication>({ bodyParser: false, logger: ['error'] }));
  await app.init();
  const server = app.getHttpServer() as App;
  const tokens = new Map<string, string>();
  return {
    app,
    databasePath,
    http: () => request(server),
    tokenFor: async (email, password = DEMO_PASSWORD) => {
      const cached = tokens.get(email);
      if (cached) return cached;
      const res = await request(server).post('/api/auth/login').send({ email, password }).expect(200);
      tokens.set(email, res.body.accessToken);
      return res.body.accessToken as string;
    },
    close: async () => {
      await app.close();
      for (const key of Object.keys(env)) delete process.env[key];
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
