import { loadavg } from 'node:os';
import { Bench } from 'tinybench';
import { fitCalibration } from '../engine/calibration.js';
import { fitLine } from '../engine/regression.js';
import { evaluateStudy } from '../evaluate.js';
import type { StandardPoint } from '../study.js';

/** A typical validation study: 7 levels × 3 replicates, 10 blanks, 9 spikes, 15 precision results. */
const typicalStudy = {
  standards: [0.5, 1, 2, 5, 10, 20, 40].flatMap((x, level) =>
    [0, 1, 2].map((r) => ({ x, y: 0.012 + 0.2051 * x * (1 + 0.004 * Math.sin(3 * level + r)) + 0.0021 * Math.cos(7 * level + 2 * r) })),
  ),
  blanks: [0.011, 0.013, 0.0095, 0.0122, 0.0108, 0.0131, 0.0117, 0.0099, 0.0126, 0.0114],
  unknowns: [
    { id: 'S1', y: [2.071, 2.083] },
    { id: 'S2', y: [6.52, 6.49, 6.55], dilution: 2 },
  ],
  recovery: [0.982, 1.011, 0.994, 10.12, 9.87, 10.05, 30.4, 29.7, 30.2].map((found, i) => ({
    id: `R${i}`,
    level: ['low', 'mid', 'high'][Math.floor(i / 3)],
    added: [1, 10, 30][Math.floor(i / 3)],
    found,
  })),
  precision: [5.02, 4.98, 5.05, 5.01, 4.99, 5.07, 5.04, 5.1, 5.06, 5.03, 4.97, 5.0, 4.95, 5.02, 4.98].map((value, i) => ({
    group: `day ${Math.floor(i / 5) + 1}`,
    value,
  })),
  lowSpikes: { spiked: [0.21, 0.18, 0.24, 0.2, 0.17, 0.22, 0.19, 0.23, 0.2], blanks: [0.02, 0.01, 0.03, 0.01, 0.02, 0.02, 0.04] },
  massFraction: 5e-6,
  criteria: [
    { figure: 'calibration.r2', op: '>=', value: 0.995 },
    { figure: 'range.rePct', op: 'abs<=', value: 15 },
  ],
};

function line(n: number): StandardPoint[] {
  return Array.from({ length: n }, (_, i) => {
    const x = 1 + (i % 1000) / 10;
    return { x, y: 0.5 + 2 * x + 0.01 * Math.sin(i) };
  });
}

interface Case {
  name: string;
  points: number;
  run: () => void;
}

function cases(): Case[] {
  const list: Case[] = [{ name: 'typical study, full evaluation', points: 21, run: () => void evaluateStudy(typicalStudy) }];
  for (const n of [100, 10_000, 1_000_000]) {
    const data = line(n);
    const xs = data.map((p) => p.x);
    const ys = data.map((p) => p.y);
    const ones = new Float64Array(n).fill(1);
    const size = n.toLocaleString('en');
    list.push({ name: `least-squares line, n = ${size}`, points: n, run: () => void fitLine(xs, ys, ones) });
    list.push({ name: `full linear calibration, n = ${size}`, points: n, run: () => void fitCalibration(data) });
  }
  return list;
}

/** CPU time (user + system, all threads, GC included) per call over a loop of about `budgetMs`. */
function cpuPerCall(run: () => void, budgetMs: number): number {
  const probe = process.cpuUsage();
  run();
  const once = Math.max(1e-3, (process.cpuUsage(probe).user + process.cpuUsage(probe).system) / 2000);
  const calls = Math.max(3, Math.min(200_000, Math.round(budgetMs / once)));
  const start = process.cpuUsage();
  for (let i = 0; i < calls; i++) run();
  const used = process.cpuUsage(start);
  return (used.user + used.system) / 1000 / calls;
}

const fmt = (v: number) => (v < 0.1 ? v.toFixed(4) : v < 10 ? v.toFixed(3) : v.toFixed(1));

async function main(): Promise<void> {
  const firstStart = performance.now();
  evaluateStudy(typicalStudy);
  const firstMs = performance.now() - firstStart;
  const list = cases();

  const quick = new Bench({ time: 1500, warmupTime: 200 });
  const big = new Bench({ time: 0, iterations: 6, warmupIterations: 1 });
  for (const c of list) (c.points >= 1_000_000 ? big : quick).add(c.name, c.run);
  await quick.run();
  await big.run();
  const wall = new Map([...quick.tasks, ...big.tasks].map((t) => [t.name, t.result]));

  console.log(`node ${process.version}, ${process.platform}/${process.arch}, load average ${loadavg()[0].toFixed(1)}`);
  console.log(`first evaluation of the typical study (cold caches, JIT warm-up): ${fmt(firstMs)} ms`);
  console.log('task | wall median ms | CPU ms per call | points/s (CPU)');
  for (const c of list) {
    const result = wall.get(c.name);
    const median = result && result.state === 'completed' ? fmt(result.latency.p50) : (result?.state ?? 'missing');
    const cpu = cpuPerCall(c.run, c.points >= 1_000_000 ? 3000 : 1500);
    console.log(`${c.name} | ${median} | ${fmt(cpu)} | ${Math.round((c.points / cpu) * 1000).toLocaleString('en')}`);
  }
}

void main();
