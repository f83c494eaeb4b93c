import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

const MAIN = fileURLToPath(new URL('../dist/main.js', import.meta.url));
const INDEX = new URL('../../frontend/dist/index.html', import.meta.url);

function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const server = createServer().listen(0, '127.0.0.1', () => {
      const { port } = server.address() as { port: number };
      server.close(() => resolve(port));
    });
  });
}

describe('the built frontend as the built server sends it', () => {
  let server: ChildProcess;
  let base: string;
  const dir = mkdtempSync(join(tmpdir(), 'meritline-static-'));

  beforeAll(async () => {
    const port = await freePort();
    base = `http://127.0.0.1:${port}`;
    server = spawn(process.execPath, [MAIN], {
      env: { ...process.env, NODE_ENV: 'development', PORT: String(port), DATA_DIR: dir, DATABASE_URL: `sqlite:${join(dir, 'db.sqlite')}` },
      stdio: 'ignore',
    });
    for (let attempt = 0; attempt < 120; attempt++) {
      if (
        await fetch(`${base}/api/health`)
          .then((r) => r.ok)
          .catch(() => false)
      )
        return;
      await new Promise((resolve) => setTimeout(resolve, 250));
    }
    throw new Error('The built server did not start.');
  }, 60_000);

  afterAll(() => {
    server?.kill();
    rmSync(dir, { recursive: true, force: true });
  });

  it('should send hashed files compressed and cached for a year, and index.html revalidated every time', async () => {
    const entry = /src="\/(assets\/index-[\w-]+\.js)"/.exec(readFileSync(INDEX, 'utf8'))?.[1];
    expect(entry).toBeTruthy();
    const asset = await fetch(`${base}/${entry}`, { headers: { 'Accept-Encoding': 'gzip' } });
    expect(asset.status).toBe(200);
    expect(asset.headers.get('content-encoding')).toBe('gzip');
    expect(asset.headers.get('cache-control')).toBe('public, max-age=31536000, immutable');
    const page = await fetch(`${base}/`);
    expect(page.status).toBe(200);
    expect(page.headers.get('cache-control')).toBe('no-cache');
  });
});
