import { cpus, loadavg } from 'node:os';
import { crashTrial, type CrashTrialResult } from './crash-trial.js';

/** 20 SIGKILL trials, killed 0–1.9 s after the first acknowledged write; figures go to docs/performance.md. */
const TRIALS = 20;
const print = (line: string) => process.stdout.write(`${line}\n`);

const results: CrashTrialResult[] = [];
for (let trial = 1; trial <= TRIALS; trial++) {
  const killAfterMs = ((trial * 7) % TRIALS) * 100;
  const r = await crashTrial({ trial, killAfterMs });
  results.push(r);
  print(
    `trial ${String(trial).padStart(2)}: killed after ${r.killAfterMs} ms, ${r.acknowledged} acknowledged, ${r.refused} refused, ` +
      `${r.cutOff} cut off; missing ${r.missing.length}, half-saved ${r.halfSaved.length}, refused but saved ${r.refusedButSaved.length}; ` +
      `audit ${r.auditOk ? 'intact' : 'BROKEN'} (${r.auditRows} entries); restart ${r.restartMs} ms`,
  );
}
const sum = (pick: (r: CrashTrialResult) => number) => results.reduce((total, r) => total + pick(r), 0);
const restarts = results.map((r) => r.restartMs).sort((a, b) => a - b);
const lost = sum((r) => r.missing.length + r.halfSaved.length + r.refusedButSaved.length) + results.filter((r) => !r.auditOk).length;
print(
  `${TRIALS} trials (Node ${process.version}, ${cpus().length} cores, load ${loadavg()[0].toFixed(1)}): ` +
    `${sum((r) => r.acknowledged)} acknowledged writes, ${sum((r) => r.refused)} refused, ${sum((r) => r.cutOff)} cut off; ` +
    `${lost} lost, half-saved or broken; restart median ${restarts[Math.floor(TRIALS / 2)]} ms, max ${restarts.at(-1)} ms`,
);
if (lost) process.exitCode = 1;
