import { defineConfig } from 'vitest/config';

// TEST_DATABASE=postgres runs every file on a database of its own on the server at TEST_POSTGRES_URL (see test/support/test-app.ts).
const onPostgres = process.env.TEST_DATABASE === 'postgres';

export default defineConfig({
  test: {
    // Entities pick their binary column type from DATABASE_URL at import time, before a test creates its database.
    env: onPostgres ? { DATABASE_URL: process.env.TEST_POSTGRES_URL ?? '' } : {},
    environment: 'node',
    include: ['test/**/*.e2e-spec.ts'],
    // Serving the built frontend does not touch the database: once, on SQLite, is enough.
    exclude: onPostgres ? ['test/static-assets.e2e-spec.ts'] : [],
    testTimeout: 30_000,
    hookTimeout: 60_000,
    fileParallelism: false,
  },
});
