import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { ensureDependencies, root, run } from './setup.mjs';

ensureDependencies();
if (!existsSync(join(root, 'shared', 'dist', 'cli.js'))) run('npm', ['run', '-s', 'build', '-w', 'shared'], { stdio: ['ignore', 2, 2] });
// `ensure-built.mjs backend`: the backend's command-line tools (backup, restore) too.
if (process.argv.includes('backend') && !existsSync(join(root, 'backend', 'dist', 'cli', 'backup.js'))) {
  run('npm', ['run', '-s', 'build', '-w', 'backend'], { stdio: ['ignore', 2, 2] });
}
