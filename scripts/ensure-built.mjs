import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { ensureDependencies, root, run } from './setup.mjs';

ensureDependencies();
if (!existsSync(join(root, 'shared', 'dist', 'cli.js'))) run('npm', ['run', '-s', 'build', '-w', 'shared'], { stdio: ['ignore', 2, 2] });
