import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { load } from 'js-yaml';
import { afterAll, describe, expect, it } from 'vitest';
import { freePort, refusedStart, startBuiltServer } from '../src/bench/built-server.js';
import { loadAppConfig } from '../src/config/app.config.js';
import { createSelfSignedP12 } from '../src/reports/signing/self-signed-certificate.js';

// No container engine runs on the test machine: the compose file and Dockerfile are checked as text here,
// and the built server is started with the settings the compose file gives it.
const root = new URL('../../', import.meta.url);
const read = (file: string) => readFileSync(new URL(file, root), 'utf8');

interface Service {
  image?: string;
  build?: unknown;
  environment?: Record<string, string | number>;
  ports?: string[];
  healthcheck?: { test: string[] | string };
  depends_on?: Record<string, { condition: string }>;
}
const compose = load(read('docker-compose.yml')) as { services: Record<string, Service> };
const app = compose.services.app;

/** What an operator's .env gives for the ${NAME:?…} settings compose insists on. */
const operatorEnv: Record<string, string> = {
  POSTGRES_PASSWORD: 'p'.repeat(24),
  JWT_SECRET: 'j'.repeat(48),
  AUDIT_HMAC_KEY: 'a'.repeat(48),
};

/** Compose interpolation: ${NAME:?message} must be given, ${NAME:-default} falls back. */
function interpolate(value: string | number): string {
  return String(value).replace(/\$\{(\w+)(?::([?-])([^}]*))?\}/g, (_, name: string, kind?: string, rest?: string) => {
    if (operatorEnv[name] !== undefined) return operatorEnv[name];
    if (kind === '?') throw new Error(`${name} is required by the compose file and not given`);
    return rest ?? '';
  });
}

const appEnv = Object.fromEntries(Object.entries(app.environment ?? {}).map(([k, v]) => [k, interpolate(v)]));

/** Every variable the configuration reads, found in its source, and those production refuses to start without. */
const configSource = read('backend/src/config/app.config.ts');
const configNames = [...new Set([...configSource.matchAll(/env\.([A-Z][A-Z0-9_]+)/g)].map((m) => m[1]))];
const requiredInProduction = configNames.filter((name) => {
  const env: Record<string, string> = { ...appEnv };
  delete env[name];
  try {
    loadAppConfig(env);
    return false;
  } catch {
    return true;
  }
});

describe('docker-compose.yml', () => {
  it('should run the app, PostgreSQL and a mail sink', () => {
    expect(Object.keys(compose.services).sort()).toEqual(['app', 'db', 'mail']);
    expect(compose.services.db.image).toMatch(/^postgres:15/);
  });

  it('should publish ports on the loopback interface only', () => {
    const published = Object.values(compose.services).flatMap((s) => s.ports ?? []);
    expect(published.length).toBeGreaterThan(0);
    for (const port of published) expect(port).toMatch(/^127\.0\.0\.1:\d+:\d+$/);
    expect(compose.services.db.ports).toBeUndefined();
  });

  it('should run the app in production mode without demo data', () => {
    expect(appEnv.NODE_ENV).toBe('production');
    expect(appEnv.SEED_DEMO).toBe('false');
    expect(loadAppConfig(appEnv)).toMatchObject({ env: 'production', seedDemo: false, apiDocs: false });
  });

  it('should give every setting production refuses to start without, secrets from the operator and not from the file', () => {
    expect(requiredInProduction.sort()).toEqual(['AUDIT_HMAC_KEY', 'JWT_SECRET', 'SIGNING_P12_PATH', 'SMTP_URL']);
    for (const name of requiredInProduction) expect(app.environment).toHaveProperty(name);
    for (const secret of ['JWT_SECRET', 'AUDIT_HMAC_KEY'])
      expect(String(app.environment?.[secret])).toMatch(new RegExp(`^\\$\\{${secret}:\\?`));
    expect(String(app.environment?.DATABASE_URL)).toContain('${POSTGRES_PASSWORD:?');
    expect(appEnv.DATABASE_URL).toMatch(/^postgres:\/\/meritline:.+@db:5432\/meritline$/);
    expect(appEnv.SMTP_URL).toBe('smtp://mail:1025');
  });

  it('should check the health of every service and start the app only once the database is healthy', () => {
    for (const [name, service] of Object.entries(compose.services)) expect(service.healthcheck?.test, name).toBeTruthy();
    expect(String(app.healthcheck?.test)).toContain('/api/health');
    expect(app.depends_on?.db.condition).toBe('service_healthy');
  });

  it('should keep the data folder (audit checkpoints) on a volume', () => {
    expect(appEnv.DATA_DIR).toBe('/var/lib/meritline');
    expect(read('docker-compose.yml')).toMatch(/app-data:\/var\/lib\/meritline/);
  });
});

describe('Dockerfile', () => {
  const dockerfile = read('Dockerfile');
  const runtime = dockerfile.slice(dockerfile.lastIndexOf('FROM '));

  it('should build in one stage and run the pruned build as an unprivileged user in production mode', () => {
    expect(dockerfile).toMatch(/npm ci .*&& npm run build && npm prune --omit=dev/);
    expect(runtime).toMatch(/ENV NODE_ENV=production/);
    expect(runtime).toMatch(/^USER node$/m);
    expect(runtime).toMatch(/CMD \["node", "backend\/dist\/main\.js"\]/);
    expect(runtime).toMatch(/postgresql-client/);
    const ignored = read('.dockerignore').split('\n');
    for (const entry of ['node_modules', 'data', '.git']) expect(ignored).toContain(entry);
  });
});

describe('the built server with the compose settings (SQLite in place of PostgreSQL)', () => {
  const dir = mkdtempSync(join(tmpdir(), 'meritline-production-'));
  const certificate = join(dir, 'lab-certificate.p12');
  writeFileSync(certificate, createSelfSignedP12('Production trial laboratory', 'trial-passphrase'));
  const production = async (): Promise<Record<string, string>> => ({
    ...appEnv,
    DATABASE_URL: `sqlite:${join(dir, 'production.sqlite')}`,
    DATA_DIR: dir,
    SIGNING_P12_PATH: certificate,
    SIGNING_P12_PASSPHRASE: 'trial-passphrase',
    SMTP_URL: `smtp://127.0.0.1:${await freePort()}`,
    PORT: String(await freePort()),
  });

  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('should start in production mode, with no demo accounts and no API documentation', async () => {
    const server = await startBuiltServer(await production());
    try {
      expect((await fetch(`${server.base}/api/health`)).status).toBe(200);
      const demo = await fetch(`${server.base}/api/auth/login`, {
        method: 'POST',
        headers: { 'Content-Type': 'application/json' },
        body: JSON.stringify({ email: 'analyst@meritline.test', password: 'meritline-demo' }),
      });
      expect(demo.status).toBe(401);
      expect((await fetch(`${server.base}/api/docs`)).status).toBe(404);
    } finally {
      await server.stop();
    }
  }, 90_000);

  it('should refuse to start without each setting production requires, naming it', async () => {
    for (const name of requiredInProduction) {
      const env = await production();
      delete env[name];
      const result = await refusedStart(env);
      expect(result.code, name).toBe(1);
      expect(result.output).toContain(`Meritline cannot start: ${name}`);
    }
  }, 90_000);
});
