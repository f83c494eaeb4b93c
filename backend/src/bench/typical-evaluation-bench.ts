/**
 * The engine alone on the typical study (the report benchmark's): CPU µs per `evaluateStudy` and per evaluation plus
 * `JSON.stringify` of its result, in a warm loop in this process; the median of 5 loops, after 2,000 evaluations of warm-up.
 */
import { createHash } from 'node:crypto';
import { loadavg } from 'node:os';
import { evaluateStudy } from '@meritline/shared';
import { typicalStudy } from './report-bench.js';

const WARM_UP = 2000;
const LOOPS = 5;
const PER_LOOP = Number(process.argv[2] ?? 3000);

function medianMicroseconds(work: () => void): { median: number; loops: number[] } {
  const loops: number[] = [];
  for (let loop = 0; loop < LOOPS; loop++) {
    const before = process.cpuUsage();
    for (let i = 0; i < PER_LOOP; i++) work();
    const used = process.cpuUsage(before);
    loops.push((used.user + used.system) / PER_LOOP);
  }
  return { median: [...loops].sort((a, b) => a - b)[Math.floor(LOOPS / 2)], loops };
}

const print = (line: string) => process.stdout.write(`${line}\n`);

const study = typicalStudy();
for (let i = 0; i < WARM_UP; i++) JSON.stringify(evaluateStudy(study));
const evaluation = medianMicroseconds(() => evaluateStudy(study));
const withText = medianMicroseconds(() => JSON.stringify(evaluateStudy(study)));
const text = JSON.stringify(evaluateStudy(study));
const show = ({ median, loops }: { median: number; loops: number[] }) =>
  `${median.toFixed(0)} µs (loops ${loops.map((v) => v.toFixed(0)).join(', ')})`;
print(`typical study, ${PER_LOOP} evaluations per loop, load average ${loadavg()[0].toFixed(1)}`);
print(`  evaluateStudy:                  ${show(evaluation)}`);
print(`  evaluateStudy + JSON.stringify: ${show(withText)}`);
print(`  result: ${text.length} characters, SHA-256 ${createHash('sha256').update(text).digest('hex')}`);
