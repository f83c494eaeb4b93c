import { describe, expect, it } from 'vitest';
import { crashTrial } from '../src/bench/crash-trial.js';
import { signIn, startBuiltServer } from '../src/bench/built-server.js';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

// Common practice for a database-backed service: a write the client saw acknowledged survives a crash of the
// process, and a write either commits whole or not at all (atomicity, durability).
describe('the built server killed with SIGKILL under concurrent writes', () => {
  for (const [trial, killAfterMs] of [
    [1, 0],
    [2, 300],
    [3, 800],
  ] as const) {
    it(`should keep every acknowledged write and nothing half-saved, with the audit chain intact (trial ${trial})`, async () => {
      const result = await crashTrial({ trial, killAfterMs, acknowledgedBeforeKill: 3 });
      expect(result.acknowledged).toBeGreaterThan(0);
      expect(result.missing).toEqual([]);
      expect(result.halfSaved).toEqual([]);
      expect(result.refusedButSaved).toEqual([]);
      expect(result.auditOk).toBe(true);
    }, 120_000);
  }
});

describe('the built server stopped with SIGTERM', () => {
  it('should close the database and exit within the shutdown bound', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'meritline-term-'));
    try {
      const database = join(dir, 'term.sqlite');
      const server = await startBuiltServer({ NODE_ENV: 'test', DATABASE_URL: `sqlite:${database}`, DATA_DIR: dir, SMTP_URL: '' });
      await signIn(server.base, 'analyst@meritline.test', 'meritline-demo');
      expect(existsSync(`${database}-wal`)).toBe(true);
      const started = Date.now();
      const exit = await server.stop('SIGTERM');
      const stoppedMs = Date.now() - started;
      // Nest closes the app on the signal, then raises it again so the exit still names it.
      expect(exit).toEqual({ code: null, signal: 'SIGTERM' });
      // The last connection to close folds the write-ahead log into the file and removes it: the database was closed, not dropped.
      expect(existsSync(`${database}-wal`)).toBe(false);
      // main.ts forces an exit after 10 s of requests still running; an idle server must stop well within it.
      expect(stoppedMs).toBeLessThan(10_000);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  }, 120_000);
});
