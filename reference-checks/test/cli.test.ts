import { execFile } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { evaluateStudy } from '@meritline/shared';
import { afterAll, describe, expect, it } from 'vitest';
import { loadJson, standards } from './helpers.js';

const cli = fileURLToPath(new URL('../../shared/dist/cli.js', import.meta.url));
const dir = mkdtempSync(join(tmpdir(), 'meritline-cli-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function run(file: string): Promise<{ status: number | null; stdout: string; stderr: string }> {
  return new Promise((resolve) => {
    execFile(process.execPath, [cli, file], { maxBuffer: 64 * 1024 * 1024 }, (error, stdout, stderr) => {
      resolve({ status: error ? (typeof error.code === 'number' ? error.code : null) : 0, stdout, stderr });
    });
  });
}

function write(name: string, content: unknown): string {
  const path = join(dir, name);
  writeFileSync(path, typeof content === 'string' ? content : JSON.stringify(content));
  return path;
}

const norris = loadJson('nist_strd_norris.json');
const pontius = loadJson('nist_strd_pontius.json');
const noint1 = loadJson('nist_strd_noint1.json');
const miller = loadJson('calibration_miller_fluorescence.json');
const weighted = loadJson('calibration_miller_weighted.json');
const sirstv = loadJson('nist_strd_anova_sirstv.json');
const recovery = loadJson('recovery_examples.json').spike_recovery;

const studies: [string, unknown][] = [
  ['NIST StRD Norris', { standards: standards(norris.data.x, norris.data.y) }],
  ['NIST StRD Pontius', { model: 'quadratic', standards: standards(pontius.data.x, pontius.data.y) }],
  ['NIST StRD NoInt1', { model: 'linear-through-origin', standards: standards(noint1.data.x, noint1.data.y) }],
  ['Miller & Miller fluorescence', { standards: standards(miller.data.x, miller.data.y), unknowns: [{ id: 'U1', y: [13.5, 13.6] }] }],
  [
    'Miller & Miller weighted',
    {
      weighting: '1/s2',
      standards: weighted.data.x.map((x: number, i: number) => ({ x, y: weighted.data.y[i], sd: weighted.data.s[i] })),
      unknowns: [{ id: 'U1', y: [0.1] }],
    },
  ],
  ['NIST StRD SiRstv', { precision: sirstv.data.group.map((g: number, i: number) => ({ group: String(g), value: sirstv.data.value[i] })) }],
  [
    'spike recovery',
    {
      recovery: recovery.c_spiked.map((found: number, i: number) => ({
        id: `R${i}`,
        added: recovery.c_added,
        found,
        native: recovery.c_unspiked,
      })),
    },
  ],
];

describe.concurrent('CLI: node shared/dist/cli.js <study>', () => {
  it.each(studies)('%s: exit 0 and the same JSON as evaluateStudy', async (name, study) => {
    const out = await run(write(`${name.replace(/\W+/g, '-')}.json`, study));
    expect(out.stderr).toBe('');
    expect(out.status).toBe(0);
    expect(JSON.parse(out.stdout)).toEqual(JSON.parse(JSON.stringify(evaluateStudy(study))));
  });

  it('reads a CSV of standards with ; and decimal commas', async () => {
    const csv = ['x;y', ...miller.data.x.map((x: number, i: number) => `${x};${String(miller.data.y[i]).replace('.', ',')}`)].join('\n');
    const out = await run(write('fluorescence.csv', csv));
    expect(out.status).toBe(0);
    expect(JSON.parse(out.stdout)).toEqual(
      JSON.parse(JSON.stringify(evaluateStudy({ standards: standards(miller.data.x, miller.data.y) }))),
    );
  });

  it('bad input: exit 2 with the field named on stderr', async () => {
    const out = await run(
      write('bad.json', {
        standards: [
          { x: 1, y: 2 },
          { x: 'two', y: 3 },
        ],
      }),
    );
    expect(out.status).toBe(2);
    expect(out.stdout).toBe('');
    expect(out.stderr).toContain('standards[1].x');
  });

  it('not JSON, or a missing file: exit 2 with a message', async () => {
    const broken = await run(write('broken.json', '{ "standards": ['));
    expect(broken.status).toBe(2);
    expect(broken.stderr).toMatch(/not valid JSON/);
    const missing = await run(join(dir, 'nothing-here.json'));
    expect(missing.status).toBe(2);
    expect(missing.stderr).toMatch(/cannot read/);
  });
});

describe('meritline-evaluate --compare', () => {
  function runArgs(args: string[]): Promise<{ status: number | null; stdout: string; stderr: string }> {
    return new Promise((resolve) => {
      execFile(process.execPath, [cli, ...args], (error, stdout, stderr) => {
        resolve({ status: error ? (typeof error.code === 'number' ? error.code : null) : 0, stdout, stderr });
      });
    });
  }

  it('compares the Miller fluorescence line with a 10 % more sensitive copy of itself', async () => {
    const earlier = write('earlier.json', { standards: standards(miller.data.x, miller.data.y) });
    const later = write('later.json', {
      standards: standards(
        miller.data.x,
        (miller.data.y as number[]).map((y) => 1.1 * y),
      ),
    });
    const { status, stdout } = await runArgs(['--compare', earlier, later, '--margin', '3']);
    expect(status).toBe(0);
    const result = JSON.parse(stdout);
    expect(result.slope.changePct).toBeCloseTo(10, 9);
    expect(result.recoveryMarginPct).toBe(3);
    expect(result.repeatability).toEqual({ available: false, reason: expect.any(String) });
  });

  it('refuses a margin that is not a positive number', async () => {
    const file = write('one.json', { standards: standards(miller.data.x, miller.data.y) });
    const { status, stderr } = await runArgs(['--compare', file, file, '--margin', '-1']);
    expect(status).toBe(2);
    expect(stderr).toMatch(/percentage points/);
  });
});
