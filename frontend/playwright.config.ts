import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { defineConfig } from '@playwright/test';

process.env.PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD ??= '1';

const PORT = Number(process.env.E2E_PORT ?? 4310);
const BASE_URL = `http://127.0.0.1:${PORT}`;

// The config is read again by each worker; the variable keeps one fresh database per run.
process.env.MERITLINE_E2E_DATA ??= mkdtempSync(join(tmpdir(), 'meritline-e2e-'));
const dataDir = process.env.MERITLINE_E2E_DATA;

export default defineConfig({
  testDir: './e2e',
  outputDir: './test-output/results',
  workers: 1,
  fullyParallel: false,
  reporter: 'list',
  // Generous: the machine running the tests may be busy with builds of its own.
  timeout: 120_000,
  expect: { timeout: 10_000 },
  use: {
    baseURL: BASE_URL,
    browserName: 'chromium',
    headless: true,
    viewport: { width: 1360, height: 860 },
    // Traces on request only: the runner's tracing has failed a passing test with a missing trace file after a worker restart.
    trace: process.env.E2E_TRACE ? 'retain-on-failure' : 'off',
    screenshot: 'only-on-failure',
    launchOptions: {
      executablePath: '/usr/bin/chromium',
      args: [
        '--no-sandbox',
        '--disable-gpu',
        '--disable-quic',
        '--no-first-run',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
      ],
    },
  },
  webServer: {
    // The backend serves the built frontend, as in production; build first so the tests see the current code.
    // `npm test` has just built everything and sets E2E_SKIP_BUILD.
    command: process.env.E2E_SKIP_BUILD ? 'node ../backend/dist/main.js' : 'npx vite build --logLevel warn && node ../backend/dist/main.js',
    url: `${BASE_URL}/api/health`,
    reuseExistingServer: false,
    timeout: 120_000,
    stdout: 'ignore',
    stderr: 'pipe',
    env: {
      PORT: String(PORT),
      DATABASE_URL: `sqlite:${join(dataDir, 'meritline.sqlite')}`,
      DATA_DIR: dataDir,
      NODE_ENV: 'test',
      PUBLIC_URL: BASE_URL,
    },
  },
});
