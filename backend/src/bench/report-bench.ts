import { createHash } from 'node:crypto';
import { mkdirSync, writeFileSync } from 'node:fs';
import { cpus, loadavg } from 'node:os';
import { fileURLToPath } from 'node:url';
import { canonicalJson, ENGINE_VERSION, evaluateStudy, Role, type StudyInput } from '@meritline/shared';
import type { ReportContent } from '../reports/report-content.js';
import { createSelfSignedP12 } from '../reports/signing/self-signed-certificate.js';
import { signPdf } from '../reports/signing/sign-pdf.js';
import { renderValidationReport } from '../reports/validation-report.document.js';

/** Invented numbers, reproducible: a small linear congruential generator instead of Math.random. */
function noise(seed: number): () => number {
  let state = seed;
  return () => {
    state = (state * 1664525 + 1013904223) % 2 ** 32;
    return state / 2 ** 32 - 0.5;
  };
}

/** A typical study: 7 levels × 3 replicates, 10 blanks, 9 spikes at 3 levels, 15 precision results in 3 series. */
export function typicalStudy(): StudyInput {
  const n = noise(20261201);
  const levels = [0.5, 1, 2, 5, 10, 20, 50];
  const standards = levels.flatMap((x) =>
    [0, 1, 2].map(() => ({ x, y: Number((4.1 + 212.7 * x * (1 + 0.02 * n()) + 3 * n()).toFixed(2)) })),
  );
  standards[10] = { ...standards[10], excluded: { reason: 'injection error noted in the instrument log' } } as (typeof standards)[number];
  return {
    units: { x: 'µg/L', y: 'peak area' },
    model: 'linear',
    weighting: 'none',
    standards,
    blanks: Array.from({ length: 10 }, () => Number((4 + 2.5 * n()).toFixed(2))),
    recovery: ['low', 'mid', 'high'].flatMap((level, i) =>
      [1, 2, 3].map((k) => {
        const added = [1, 10, 40][i];
        return { id: `S${i * 3 + k}`, level, added, found: Number((added * (0.99 + 0.06 * n())).toFixed(3)) };
      }),
    ),
    precision: ['day 1', 'day 2', 'day 3'].flatMap((group, d) =>
      Array.from({ length: 5 }, () => ({ group, value: Number((10 + 0.1 * d + 0.2 * n()).toFixed(3)) })),
    ),
    lowSpikes: {
      spiked: Array.from({ length: 7 }, () => Number((0.2 + 0.05 * n()).toFixed(3))),
      blanks: [0.01, 0.02, null, 0.015, 0.01, 0.02, 0.012],
    },
    massFraction: 1e-8,
    unknowns: [{ id: 'RW-0412', y: [1480.2, 1492.6] }],
    criteria: [
      { figure: 'calibration.r2', op: '>=', value: 0.995 },
      { figure: 'range.rePct', op: 'abs<=', value: 15 },
      { figure: 'recovery.overall.meanPct', op: 'between', value: [90, 110] },
      { figure: 'precision.rsdR', op: '<=', value: 5 },
      { figure: 'detection.blankSd.lod', op: '<=', value: 0.5 },
    ],
  };
}

export function typicalReportContent(reportId: string | null = '3f2a9c1e-7b44-4d0e-9a51-6c2d8e0f4b17'): ReportContent {
  const data = typicalStudy();
  const at = (iso: string) => new Date(iso);
  return {
    laboratoryName: 'Riverbend Water & Food Testing Laboratory',
    verifyUrl: 'http://localhost:3000/verify',
    reportId,
    issuedAt: at('2026-11-20T09:15:00Z'),
    method: {
      name: 'Nitrate in drinking water by ion chromatography',
      analyte: 'Nitrate',
      matrix: 'Drinking water',
      technique: 'Ion chromatography',
      xUnit: 'µg/L',
      yUnit: 'peak area',
    },
    version: { number: 2, changeSummary: 'New guard column; calibration extended to 50 µg/L', criteria: [] },
    study: {
      id: '9b0c6d52-1e7f-4a3b-8c2d-5f6e7a8b9c01',
      title: 'Validation after the column change, November 2026',
      status: reportId ? 'approved' : 'submitted',
      data,
      result: evaluateStudy(data),
      resultErrors: null,
      engineVersion: ENGINE_VERSION,
      dataHash: createHash('sha256').update(canonicalJson(data)).digest('hex'),
      meta: {
        instrument: 'IC-2 (conductivity detector)',
        startedOn: '2026-11-09',
        finishedOn: '2026-11-13',
        conclusion: 'Fit for the monitoring programme between 0.5 and 50 µg/L.',
      },
      createdAt: at('2026-11-09T08:00:00Z'),
      submittedAt: at('2026-11-16T15:40:00Z'),
      approvedAt: reportId ? at('2026-11-20T09:14:00Z') : null,
    },
    signatures: [
      {
        signerName: 'Alma Ruiz',
        signerRole: Role.Analyst,
        meaning: 'authored',
        signedAt: at('2026-11-16T15:40:00Z'),
        contentHash: 'a1'.repeat(32),
        comment: null,
      },
      {
        signerName: 'Priya Nair',
        signerRole: Role.Reviewer,
        meaning: 'reviewed-and-approved',
        signedAt: at('2026-11-20T09:14:00Z'),
        contentHash: 'a1'.repeat(32),
        comment: 'Recovery at the low level checked against the bench sheets.',
      },
    ],
    comments: [
      {
        id: 'c1',
        threadId: null,
        section: 'standards',
        authorName: 'Priya Nair',
        body: 'Why is standard 11 excluded?',
        resolved: true,
        createdAt: at('2026-11-17T10:02:00Z'),
      },
      {
        id: 'c2',
        threadId: 'c1',
        section: 'standards',
        authorName: 'Alma Ruiz',
        body: 'The instrument log shows an injection error for that vial.',
        resolved: false,
        createdAt: at('2026-11-17T11:30:00Z'),
      },
    ],
    preparations: [],
    exclusions: [
      {
        at: at('2026-11-13T16:05:00Z'),
        actorName: 'Alma Ruiz',
        action: 'study.point-excluded',
        changes: { 'standards[10].excluded': { from: null, to: { reason: 'injection error noted in the instrument log' } } },
        reason: 'injection error noted in the instrument log',
      },
    ],
  };
}

const print = (line: string) => process.stdout.write(`${line}\n`);

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
}

async function main() {
  const runs = Number(process.env.BENCH_RUNS ?? 20);
  const content = typicalReportContent();
  const passphrase = 'bench-only';
  const p12 = createSelfSignedP12(content.laboratoryName, passphrase);
  const cpuMs = (since: NodeJS.CpuUsage) => {
    const used = process.cpuUsage(since);
    return (used.user + used.system) / 1000;
  };
  const issue = async () => {
    const started = performance.now();
    const cpu = process.cpuUsage();
    const pdf = await renderValidationReport(content);
    const rendered = performance.now();
    const renderCpu = cpuMs(cpu);
    const signed = await signPdf(pdf, p12, passphrase, {
      reason: 'bench',
      name: 'bench',
      location: 'bench',
      contactInfo: 'bench',
      signingTime: new Date(),
    });
    return { signed, render: rendered - started, total: performance.now() - started, renderCpu, totalCpu: cpuMs(cpu) };
  };
  const cold = await issue();
  for (let i = 0; i < 2; i++) await issue();
  const samples: { render: number; total: number; renderCpu: number; totalCpu: number }[] = [];
  let last: Buffer = Buffer.alloc(0);
  for (let i = 0; i < runs; i++) {
    const { signed, ...times } = await issue();
    samples.push(times);
    last = signed;
  }
  const draft = await renderValidationReport(typicalReportContent(null));
  const out = fileURLToPath(new URL('../../test-output/', import.meta.url));
  mkdirSync(out, { recursive: true });
  writeFileSync(`${out}report-bench.pdf`, last);
  const kb = (bytes: number) => (bytes / 1024).toFixed(1);
  print(
    `Validation report, typical study (7 levels x 3 replicates, 10 blanks, 9 spikes, 15 precision results), ${runs} runs after 3 warm-up runs`,
  );
  const ms = (pick: (s: (typeof samples)[number]) => number) => `${median(samples.map(pick)).toFixed(0)} ms`;
  print(`  render (pdfkit):        median ${ms((s) => s.render)} wall clock, ${ms((s) => s.renderCpu)} CPU`);
  print(
    `  render + sign (PKCS#7): median ${ms((s) => s.total)} wall clock, ${ms((s) => s.totalCpu)} CPU; slowest ${Math.max(...samples.map((s) => s.total)).toFixed(0)} ms`,
  );
  print(
    `  first report in a fresh process (fonts parsed, code compiled): ${cold.total.toFixed(0)} ms wall clock, ${cold.totalCpu.toFixed(0)} ms CPU`,
  );
  print(
    `  machine: ${cpus().length} cores, load average ${loadavg()[0].toFixed(1)} (other processes share the cores; CPU time is the fairer figure then)`,
  );
  print(`  signed report size:     ${kb(last.length)} KB; draft preview ${kb(draft.length)} KB`);
  print(`  written to ${out}report-bench.pdf`);
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) await main();
