// Everything CI runs, in order, with one summary line at the end.
import { spawn } from 'node:child_process';
import { startPostgres } from './postgres.mjs';
import { build, ensureDependencies, ensureSystemPackages, log, root } from './setup.mjs';

const steps = [
  { name: 'typecheck', cmd: ['npm', 'run', '-s', 'typecheck'] },
  { name: 'lint', cmd: ['npm', 'run', '-s', 'lint'] },
  { name: 'unit: shared engine', cmd: ['npm', 'run', '-s', 'test', '-w', 'shared'] },
  { name: 'reference checks', cmd: ['npm', 'run', '-s', 'test', '-w', 'reference-checks'] },
  { name: 'unit: backend', cmd: ['npm', 'run', '-s', 'test', '-w', 'backend'] },
  { name: 'unit: frontend', cmd: ['npm', 'run', '-s', 'test', '-w', 'frontend'] },
  { name: 'API end-to-end', cmd: ['npm', 'run', '-s', 'test:e2e', '-w', 'backend'] },
  { name: 'API end-to-end (PostgreSQL)', cmd: ['npm', 'run', '-s', 'test:e2e:postgres', '-w', 'backend'], services: () => startPostgres() },
  { name: 'browser end-to-end', cmd: ['npm', 'run', '-s', 'test:browser', '-w', 'frontend'] },
];

const strip = (text) => text.replace(/\x1b\[[0-9;]*m/g, '');

/** Test counts from vitest ("Tests  12 passed | 1 failed (13)") or Playwright ("12 passed", "1 failed"). */
function countTests(output) {
  const text = strip(output);
  const vitest = [...text.matchAll(/^\s*Tests\s+(.*)$/gm)].at(-1)?.[1];
  const source =
    vitest ??
    text
      .split('\n')
      .filter((line) => /^\s*\d+ (passed|failed|flaky)/.test(line))
      .join(' ');
  const get = (word) => Number(new RegExp(`(\\d+) ${word}`).exec(source)?.[1] ?? 0);
  return { passed: get('passed'), failed: get('failed') };
}

function runStep(step) {
  let postgres = null;
  try {
    postgres = step.services?.() ?? null;
  } catch (error) {
    log(`Could not start PostgreSQL for the API tests on PostgreSQL: ${error.message}`);
    return Promise.resolve({ ...step, ok: false, seconds: 0, passed: 0, failed: 1 });
  }
  return new Promise((resolve) => {
    const started = Date.now();
    const env = {
      ...process.env,
      FORCE_COLOR: '0',
      PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD: '1',
      E2E_SKIP_BUILD: '1',
      ...(postgres ? { TEST_POSTGRES_URL: postgres.url } : {}),
    };
    const child = spawn(step.cmd[0], step.cmd.slice(1), { cwd: root, env });
    let output = '';
    child.stdout.on('data', (chunk) => {
      output += chunk;
      process.stdout.write(chunk);
    });
    child.stderr.on('data', (chunk) => {
      output += chunk;
      process.stderr.write(chunk);
    });
    child.on('close', (code) => {
      postgres?.stop();
      resolve({ ...step, ok: code === 0, seconds: (Date.now() - started) / 1000, ...countTests(output) });
    });
  });
}

const startedAt = Date.now();
try {
  ensureDependencies();
  ensureSystemPackages([
    { name: 'chromium', binary: 'chromium' },
    { name: 'poppler-utils', binary: 'pdfsig' },
  ]);
  build();
} catch (error) {
  log(error.message);
  console.log('meritline: 0 passed, 1 failed');
  process.exit(1);
}

const results = [];
for (const step of steps) {
  log(`── ${step.name} ──`);
  results.push(await runStep(step));
}

const passed = results.reduce((sum, r) => sum + r.passed, 0);
const failed = results.reduce((sum, r) => sum + r.failed + (r.ok || r.failed ? 0 : 1), 0);
console.log(`\n${'Step'.padEnd(30)}Result   Tests   Time`);
for (const r of results) {
  console.log(`${r.name.padEnd(30)}${(r.ok ? 'ok' : 'FAILED').padEnd(9)}${String(r.passed).padStart(5)}   ${r.seconds.toFixed(1)} s`);
}
console.log(`Total time ${((Date.now() - startedAt) / 1000).toFixed(0)} s`);
console.log(`meritline: ${passed} passed, ${failed} failed`);
process.exit(results.every((r) => r.ok) ? 0 : 1);
