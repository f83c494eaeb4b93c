import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { registerAs, type ConfigType } from '@nestjs/config';

export type DatabaseConfig = { type: 'sqlite'; path: string } | { type: 'postgres'; url: string };

export interface AppConfig {
  env: 'development' | 'production' | 'test';
  port: number;
  dataDir: string;
  database: DatabaseConfig;
  jwtSecret: string;
  /** Signs the audit checkpoints; kept outside the database so whoever can edit the database cannot forge them. */
  auditHmacKey: string;
  jwtExpiresIn: string;
  publicUrl: string;
  laboratoryName: string;
  mail: { from: string; smtpUrl: string | null; disabled: boolean };
  signing: { p12Path: string | null; p12Passphrase: string };
  throttle: { perAccount: number; perAddress: number; windowMs: number };
  /** The OpenAPI documentation at /api/docs; off in production unless API_DOCS=true. */
  apiDocs: boolean;
  /** Demo accounts and studies on an empty database; never in production. */
  seedDemo: boolean;
}

export class ConfigError extends Error {}

export function parseDatabaseUrl(url: string): DatabaseConfig {
  if (url.startsWith('postgres://') || url.startsWith('postgresql://')) return { type: 'postgres', url };
  if (url.startsWith('sqlite:')) {
    const path = url.slice('sqlite:'.length);
    if (!path) throw new ConfigError('DATABASE_URL sqlite: needs a file path, e.g. sqlite:./data/meritline.sqlite');
    return { type: 'sqlite', path: resolve(path) };
  }
  throw new ConfigError(`DATABASE_URL must start with sqlite: or postgres:// (got "${url}")`);
}

function readOrCreateSecret(file: string): string {
  if (existsSync(file)) return readFileSync(file, 'utf8').trim();
  mkdirSync(dirname(file), { recursive: true });
  const secret = randomBytes(48).toString('base64url');
  writeFileSync(file, secret, { mode: 0o600 });
  return secret;
}

function positiveInt(name: string, fallback: number, env: NodeJS.ProcessEnv): number {
  const raw = env[name];
  if (raw === undefined || raw === '') return fallback;
  const value = Number(raw);
  if (!Number.isInteger(value) || value <= 0) throw new ConfigError(`${name} must be a positive integer (got "${raw}")`);
  return value;
}

export function loadAppConfig(env: NodeJS.ProcessEnv = process.env): AppConfig {
  const nodeEnv = env.NODE_ENV === 'production' || env.NODE_ENV === 'test' ? env.NODE_ENV : 'development';
  const database = parseDatabaseUrl(env.DATABASE_URL ?? 'sqlite:./data/meritline.sqlite');
  const dataDir = resolve(env.DATA_DIR ?? (database.type === 'sqlite' ? dirname(database.path) : './data'));
  const port = positiveInt('PORT', 3000, env);

  let jwtSecret = env.JWT_SECRET ?? '';
  if (!jwtSecret) {
    if (nodeEnv === 'production') throw new ConfigError('JWT_SECRET must be set in production');
    jwtSecret = readOrCreateSecret(join(dataDir, 'jwt-secret'));
  }
  if (nodeEnv === 'production' && jwtSecret.length < 32) throw new ConfigError('JWT_SECRET must be at least 32 characters');
  if (nodeEnv === 'production' && (env.AUDIT_HMAC_KEY ?? '').length < 32)
    throw new ConfigError('AUDIT_HMAC_KEY must be set in production (at least 32 characters)');
  const auditHmacKey = env.AUDIT_HMAC_KEY || readOrCreateSecret(join(dataDir, 'audit-hmac-key'));
  const mailDisabled = env.MAIL_DISABLED === 'true';
  if (nodeEnv === 'production') {
    if (!env.SIGNING_P12_PATH) throw new ConfigError('SIGNING_P12_PATH (the laboratory signing certificate) must be set in production');
    if (!env.SMTP_URL && !mailDisabled)
      throw new ConfigError('SMTP_URL must be set in production (or MAIL_DISABLED=true to run without e-mail)');
  }

  return {
    env: nodeEnv,
    port,
    dataDir,
    database,
    jwtSecret,
    auditHmacKey,
    jwtExpiresIn: env.JWT_EXPIRES_IN ?? '8h',
    publicUrl: (env.PUBLIC_URL ?? `http://localhost:${port}`).replace(/\/$/, ''),
    laboratoryName: env.LAB_NAME ?? 'Riverbend Water & Food Testing Laboratory',
    mail: { from: env.MAIL_FROM ?? 'Meritline <no-reply@meritline.test>', smtpUrl: env.SMTP_URL || null, disabled: mailDisabled },
    signing: { p12Path: env.SIGNING_P12_PATH || null, p12Passphrase: env.SIGNING_P12_PASSPHRASE ?? '' },
    throttle: {
      perAccount: positiveInt('LOGIN_FAILURES_PER_ACCOUNT', 5, env),
      perAddress: positiveInt('LOGIN_FAILURES_PER_ADDRESS', 20, env),
      windowMs: positiveInt('LOGIN_FAILURE_WINDOW_MS', 15 * 60_000, env),
    },
    apiDocs: env.API_DOCS === undefined || env.API_DOCS === '' ? nodeEnv !== 'production' : env.API_DOCS === 'true',
    seedDemo: nodeEnv !== 'production' && env.SEED_DEMO !== 'false',
  };
}

export const appConfig = registerAs('app', () => loadAppConfig());
export type AppConfigType = ConfigType<typeof appConfig>;
