import 'reflect-metadata';
import { Test } from '@nestjs/testing';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import pg from 'pg';
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

/** The PostgreSQL server the suite runs on (`TEST_DATABASE=postgres` with `TEST_POSTGRES_URL`), or undefined for SQLite. */
export const postgresServerUrl = process.env.TEST_DATABASE === 'postgres' ? process.env.TEST_POSTGRES_URL : undefined;
if (process.env.TEST_DATABASE === 'postgres' && !postgresServerUrl) throw new Error('TEST_DATABASE=postgres needs TEST_POSTGRES_URL.');

export interface TestApp {
  app: NestExpressApplication;
  http: () => ReturnType<typeof request>;
  /** `sqlite:<file>` or `postgres://…/<database>`: the database behind the app, for tests that reach it directly. */
  databaseUrl: string;
  /** The app's data folder (audit key, checkpoints, certificates). */
  dataDir: string;
  tokenFor: (email: string, password?: string) => Promise<string>;
  close: () => Promise<void>;
}

async function onServer(sql: string) {
  const admin = new pg.Client({ connectionString: postgresServerUrl });
  await admin.connect();
  try {
    await admin.query(sql);
  } finally {
    await admin.end();
  }
}

/** A fresh database of its own on the test server; dropped again by the returned function. */
export async function createPostgresDatabase(): Promise<{ url: string; drop: () => Promise<void> }> {
  const name = `meritline_e2e_${process.pid}_${Date.now()}_${Math.floor(Math.random() * 1e6)}`;
  await onServer(`CREATE DATABASE ${name}`);
  const url = new URL(postgresServerUrl!);
  url.pathname = `/${name}`;
  return { url: url.toString(), drop: () => onServer(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`) };
}

/**
 * A real app in-process on a fresh database built by the real migrations and seeded with the demo data:
 * a SQLite file, or a PostgreSQL database of its own when the suite runs on PostgreSQL.
 */
export async function createTestApp(env: Record<string, string> = {}): Promise<TestApp> {
  const dir = mkdtempSync(join(tmpdir(), 'meritline-e2e-'));
  const postgres = postgresServerUrl ? await createPostgresDatabase() : null;
  const databaseUrl = postgres?.url ?? `sqlite:${join(dir, 'test.sqlite')}`;
  const cleanUp = async () => {
    for (const key of Object.keys(env)) delete process.env[key];
    rmSync(dir, { recursive: true, force: true });
    await postgres?.drop();
  };
  Object.assign(process.env, { NODE_ENV: 'test', DATABASE_URL: databaseUrl, DATA_DIR: dir, SMTP_URL: '', ...env });
  let app: NestExpressApplication;
  try {
    const moduleRef = await Test.createTestingModule({ imports: [AppModule] }).compile();
    app = configureApp(moduleRef.createNestApplication<NestExpressApplication>({ bodyParser: false, logger: ['error'] }));
    await app.init();
  } catch (error) {
    await cleanUp();
    throw error;
  }
  const server = app.getHttpServer() as App;
  const tokens = new Map<string, string>();
  return {
    app,
    databaseUrl,
    dataDir: dir,
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
      await cleanUp();
    },
  };
}
