// Set-up shared by `npm start` and `npm test`: dependencies, system packages, build.
import { execSync, spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

export const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const lockStamp = join(root, 'node_modules', '.meritline-lock-hash');

export function log(message) {
  process.stderr.write(`\x1b[36m[meritline]\x1b[0m ${message}\n`);
}

export function run(command, args, options = {}) {
  const result = spawnSync(command, args, { cwd: root, stdio: 'inherit', ...options, env: { ...process.env, ...options.env } });
  if (result.status !== 0) throw new Error(`${command} ${args.join(' ')} failed (exit ${result.status ?? result.signal})`);
}

function lockHash() {
  return createHash('sha256')
    .update(readFileSync(join(root, 'package-lock.json')))
    .digest('hex');
}

/** `npm ci` when node_modules is absent or was installed from another lockfile. */
export function ensureDependencies() {
  const wanted = lockHash();
  if (existsSync(lockStamp) && readFileSync(lockStamp, 'utf8') === wanted) return;
  log('Installing dependencies with npm ci (the first time takes a few minutes: better-sqlite3 compiles)…');
  run('npm', ['ci', '--no-audit', '--no-fund'], { stdio: ['ignore', 2, 2], env: { PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD: '1' } });
  writeFileSync(lockStamp, wanted);
}

function missing(binary) {
  return spawnSync('sh', ['-c', `command -v ${binary}`], { stdio: 'ignore' }).status !== 0;
}

/** Debian packages the tests need (Chromium for the browser tests, poppler-utils for pdfsig/pdftotext). */
export function ensureSystemPackages(packages) {
  const needed = packages.filter(({ binary }) => missing(binary)).map(({ name }) => name);
  if (!needed.length) return;
  const isRoot = process.getuid?.() === 0;
  if (!isRoot || missing('apt-get')) {
    throw new Error(
      `Missing system packages: ${needed.join(', ')}. Install them (Debian: apt-get install ${needed.join(' ')}) and run again.`,
    );
  }
  log(`Installing Debian packages: ${needed.join(', ')}…`);
  run('apt-get', ['update', '-qq']);
  run('apt-get', ['install', '-y', '-qq', '--no-install-recommends', ...needed], { env: { DEBIAN_FRONTEND: 'noninteractive' } });
}

export function build() {
  log('Building shared, backend and frontend…');
  run('npm', ['run', '-s', 'build']);
}

export function gitRevision() {
  try {
    return execSync('git rev-parse --short HEAD', { cwd: root, stdio: ['ignore', 'pipe', 'ignore'] })
      .toString()
      .trim();
  } catch {
    return 'unknown';
  }
}
