// A throwaway PostgreSQL cluster on loopback for the scale-out tests (Debian's postgresql package).
import { spawnSync } from 'node:child_process';
import { chmodSync, existsSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { ensureSystemPackages, log } from './setup.mjs';

// A random port keeps parallel runs (and a cluster left over from an interrupted run) apart.
const PORT = 55000 + Math.floor(Math.random() * 4000);

function pgBin(name) {
  const base = '/usr/lib/postgresql';
  const version = existsSync(base) ? readdirSync(base).sort((a, b) => Number(b) - Number(a))[0] : undefined;
  return version ? join(base, version, 'bin', name) : null;
}

function asPostgres(command) {
  const asRoot = process.getuid?.() === 0;
  const result = asRoot
    ? spawnSync('su', ['postgres', '-c', command], { encoding: 'utf8' })
    : spawnSync('sh', ['-c', command], { encoding: 'utf8' });
  if (result.status !== 0) throw new Error(`${command}: ${result.stderr || result.stdout}`);
}

/** Starts a cluster and returns { url, stop }; throws when PostgreSQL cannot be installed or started. */
export function startPostgres() {
  if (!pgBin('initdb') || !existsSync(pgBin('initdb'))) {
    ensureSystemPackages([{ name: 'postgresql', binary: '/usr/lib/postgresql/*/bin/initdb' }]);
  }
  const dir = mkdtempSync(join(tmpdir(), 'meritline-pg-'));
  chmodSync(dir, 0o777);
  const data = join(dir, 'data');
  asPostgres(`${pgBin('initdb')} -D ${data} -A trust -U postgres --no-sync > /dev/null`);
  asPostgres(
    `${pgBin('pg_ctl')} -D ${data} -o "-c listen_addresses=127.0.0.1 -p ${PORT} -k ${dir} -c fsync=off" -l ${dir}/server.log -w start > /dev/null`,
  );
  log(`PostgreSQL test cluster on 127.0.0.1:${PORT}`);
  return {
    url: `postgres://postgres@127.0.0.1:${PORT}/postgres`,
    stop() {
      try {
        asPostgres(`${pgBin('pg_ctl')} -D ${data} -m fast -w stop > /dev/null`);
      } finally {
        rmSync(dir, { recursive: true, force: true });
      }
    },
  };
}
