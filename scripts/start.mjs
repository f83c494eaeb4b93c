import { build, ensureDependencies, log, root, run } from './setup.mjs';

try {
  ensureDependencies();
  build();
  log(`Starting Meritline on port ${process.env.PORT ?? 3000} (database ${process.env.DATABASE_URL ?? 'sqlite:./data/meritline.sqlite'})…`);
  run('node', ['backend/dist/main.js'], { cwd: root });
} catch (error) {
  log(error.message);
  process.exit(1);
}
