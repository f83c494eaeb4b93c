import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ConfigError, loadAppConfig } from './app.config.js';

const dir = mkdtempSync(join(tmpdir(), 'meritline-config-'));
const production = {
  NODE_ENV: 'production',
  DATABASE_URL: `sqlite:${join(dir, 'db.sqlite')}`,
  JWT_SECRET: 'x'.repeat(40),
  AUDIT_HMAC_KEY: 'k'.repeat(40),
  SIGNING_P12_PATH: '/etc/meritline/lab.p12',
  SMTP_URL: 'smtp://mail.example:25',
};

describe('loadAppConfig in production', () => {
  it('should never seed demo data and hide the API documentation unless asked for', () => {
    const config = loadAppConfig({ ...production, SEED_DEMO: 'true' });
    expect(config.seedDemo).toBe(false);
    expect(config.apiDocs).toBe(false);
    expect(loadAppConfig({ ...production, API_DOCS: 'true' }).apiDocs).toBe(true);
  });

  it('should refuse to start without a key for the audit checkpoints', () => {
    expect(() => loadAppConfig({ ...production, AUDIT_HMAC_KEY: '' })).toThrow(/AUDIT_HMAC_KEY/);
  });

  it('should refuse to start without a signing certificate', () => {
    expect(() => loadAppConfig({ ...production, SIGNING_P12_PATH: '' })).toThrow(ConfigError);
    expect(() => loadAppConfig({ ...production, SIGNING_P12_PATH: '' })).toThrow(/SIGNING_P12_PATH/);
  });

  it('should refuse to start without an SMTP URL unless mail is disabled explicitly', () => {
    expect(() => loadAppConfig({ ...production, SMTP_URL: '' })).toThrow(/SMTP_URL/);
    expect(() => loadAppConfig({ ...production, SMTP_URL: '', MAIL_DISABLED: 'yes' })).toThrow(/SMTP_URL/);
    expect(loadAppConfig({ ...production, SMTP_URL: '', MAIL_DISABLED: 'true' }).mail.disabled).toBe(true);
  });
});

describe('loadAppConfig in development and test', () => {
  it('should seed demo data and serve the documentation without a certificate or SMTP', () => {
    for (const NODE_ENV of ['development', 'test']) {
      const config = loadAppConfig({ NODE_ENV, DATABASE_URL: `sqlite:${join(dir, 'dev.sqlite')}` });
      expect(config.seedDemo).toBe(true);
      expect(config.apiDocs).toBe(true);
    }
    expect(loadAppConfig({ DATABASE_URL: `sqlite:${join(dir, 'dev.sqlite')}`, SEED_DEMO: 'false' }).seedDemo).toBe(false);
  });
});
