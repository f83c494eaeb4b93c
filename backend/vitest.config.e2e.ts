import { defineConfig } from 'vitest/config';

// TEST_DATABASE=postgres runs every file on a database of its own on the server at TEST_POSTGRES_URL (see test/support/test-app.ts).
const onPostgres = process.env.TEST_DATABASE === 'postgres';

export default defineConfig({
  test: {
    // Entities pick their binary column type from DATABASE_URL at import time, before a test creates its database.
    env: onPostgres ? { DATABASE_URL: process.env.TEST_POSTGRES_URL ?? '' } : {},
    environment: 'node',
    include: ['test/**/*.e2e-spec.ts'],
    // Files about the SQLite file or the built server alone (static files, compose settings, crashes, SQLite backups) run once, on SQLite.
    exclude: onPostgres
      ? ['test/static-assets.e2e-spec.ts', 'test/deployment.e2e-spec.ts', 'test/durability.e2e-spec.ts', 'test/backup.e2e-spec.ts']
      : ['test/backup-postgres.e2e-spec.ts', 'test/scale-out.e2e-spec.ts'],
    testTimeout: 30_000,
    hookTimeout: 60_000,
    fileParallelism: false,
  },
});
