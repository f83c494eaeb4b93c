// Builds the shared package once, quietly, when its output is missing.
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
if (!existsSync(join(root, 'shared', 'dist', 'cli.js'))) {
  const result = spawnSync('npm', ['run', 'build', '-w', 'shared'], {
    cwd: root,
    stdio: ['ignore', process.stderr, process.stderr],
  });
  if (result.status !== 0) process.exit(result.status ?? 1);
}
