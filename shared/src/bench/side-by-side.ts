/**
 * The engine beside an independent numpy/scipy calculation (`shared/bench/calibration_numpy.py`) on the same
 * generated standards: medians of 5 runs after a warm-up of 3 to 20 runs, each side in its own child process so that its
 * peak resident memory can be read. Installs python3-numpy and python3-scipy with apt-get when they are missing.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { loadavg } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { fitCalibration } from '../engine/calibration.js';
import { detection } from '../engine/detection.js';
import { lackOfFit } from '../engine/linearity.js';
import { collectWarnings } from '../engine/warnings.js';
import { evaluateParsedStudy } from '../evaluate.js';
import type { StandardColumns } from '../engine/calibration.js';
import type { StandardPoint, Study } from '../study.js';
import { parseStudy } from '../validate.js';

const SIZES = [1_000, 10_000, 100_000, 1_000_000];
/** Every x distinct: each level holds one standard, so the evaluation keeps its per-standard fits. */
const DISTINCT_SIZE = 100_000;
const RUNS = 5;
/**
 * Before the warm-up at the measured size, evaluations of a 2,000-standard study, as a server has made before a large one:
 * the compiler then has type feedback for every path (a few runs at 1e6 leave functions compiled mid-loop and deoptimised).
 */
const SMALL_WARM_UP = { standards: 2_000, runs: 200 };
/** Runs before the measured ones on each side: at least 3, then up to 20 within 2 s (the JIT compiler settles after some 15 runs). */
const WARM_UP = { minRuns: 3, maxRuns: 20, ms: 2000 };
const here = dirname(fileURLToPath(import.meta.url));
const pythonScript = join(here, '../../bench/calibration_numpy.py');

interface Measured {
  times: number[];
  /** Process CPU time (user + system, every thread) of each run. */
  cpu: number[];
  /** CPU time of JSON.stringify of the result of each run (engine modes only; the per-standard tables are built there). */
  serialiseCpu?: number[];
  /** Peak resident memory after the timed runs, and after the serialisation runs (engine modes). */
  maxRssKb: number;
  serialisedMaxRssKb?: number;
  figures: Record<string, number | null>;
}

/** The same standards as the Python side: 1,000 levels, replicated from 2,000 standards on (or every x distinct). */
function standardColumns(n: number, distinct = false): StandardColumns {
  const x = new Float64Array(n);
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    x[i] = distinct ? 1 + i / 10 : 1 + (i % 1000) / 10;
    y[i] = 0.5 + 2 * x[i] + 0.01 * Math.sin(i);
  }
  return { x, y };
}

function standards(n: number): StandardPoint[] {
  const { x, y } = standardColumns(n);
  return Array.from({ length: n }, (_, i) => ({ x: x[i], y: y[i] }));
}

/**
 * Child mode: `side-by-side.js engine|columns|distinct|calibration N RUNS` prints one JSON line like the Python script.
 * `engine` evaluates the study with one object per standard (as parsed from a request); `columns` the same study
 * with its standards passed as two Float64Arrays, as the Python side holds them; `distinct` by columns with every x
 * distinct (no level holds two standards, so the fits stay per standard).
 */
function child(what: string, n: number, runs: number): void {
  const parsed = parseStudy({ standards: standards(3) });
  const byColumns = what === 'columns' || what === 'distinct';
  const columns = byColumns ? standardColumns(n, what === 'distinct') : null;
  const study = byColumns ? parsed : { ...parsed, standards: standards(n) };
  const { warn } = collectWarnings();
  const runner = (study: Study, columns: StandardColumns | null) => {
    const calibrationOnly = () => {
      const fit = fitCalibration(study.standards ?? [], { rows: 'levels-when-large' });
      return { fit, lackOfFit: lackOfFit(fit, warn), detection: detection(fit, undefined, undefined, study.alpha, [], warn) };
    };
    const evaluateStudy = () => (columns ? evaluateParsedStudy(study, columns) : evaluateParsedStudy(study));
    return what === 'calibration' ? calibrationOnly : evaluateStudy;
  };
  const run = runner(study, columns);
  const evaluateStudy = () => (columns ? evaluateParsedStudy(study, columns) : evaluateParsedStudy(study));
  const small = SMALL_WARM_UP.standards;
  const warmUpSmall = runner(byColumns ? parsed : { ...parsed, standards: standards(small) }, byColumns ? standardColumns(small) : null);
  for (let r = 0; r < SMALL_WARM_UP.runs; r++) warmUpSmall();
  const warmUpStart = performance.now();
  for (let r = 0; r < WARM_UP.maxRuns && (r < WARM_UP.minRuns || performance.now() - warmUpStart < WARM_UP.ms); r++) run();
  const times: number[] = [];
  const cpu: number[] = [];
  const serialiseCpu: number[] = [];
  const cpuSince = (start: NodeJS.CpuUsage) => {
    const used = process.cpuUsage(start);
    return (used.user + used.system) / 1000;
  };
  for (let r = 0; r < runs; r++) {
    const start = performance.now();
    const startCpu = process.cpuUsage();
    run();
    times.push(performance.now() - start);
    cpu.push(cpuSince(startCpu));
  }
  const maxRssKb = process.resourceUsage().maxRSS;
  // Apart from the runs above, so that no run starts with a previous result's tables in the heap.
  for (let r = 0; r < runs && what !== 'calibration'; r++) {
    const outcome = run();
    const start = process.cpuUsage();
    JSON.stringify(outcome);
    serialiseCpu.push(cpuSince(start));
  }
  const result = evaluateStudy();
  const sdResidual = result.detection?.sdResidual as { lod: number } | null | undefined;
  const figures = {
    slope: result.calibration?.slope ?? null,
    intercept: result.calibration?.intercept ?? null,
    sYX: result.calibration?.sYX ?? null,
    ssPureError: result.lackOfFit?.ssPureError ?? null,
    lod: sdResidual?.lod ?? null,
    level0RePct: result.calibration?.levels[0].rePct ?? null,
  };
  console.log(JSON.stringify({ times, cpu, serialiseCpu, maxRssKb, serialisedMaxRssKb: process.resourceUsage().maxRSS, figures }));
}

function ensureNumpy(): void {
  const probe = spawnSync('python3', ['-c', 'import numpy, scipy'], { stdio: 'ignore' });
  if (probe.status === 0) return;
  if (process.getuid?.() !== 0) throw new Error('python3-numpy and python3-scipy are missing: apt-get install python3-numpy python3-scipy');
  console.log('Installing python3-numpy and python3-scipy…');
  execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit' });
  execFileSync('apt-get', ['install', '-y', '-qq', '--no-install-recommends', 'python3-numpy', 'python3-scipy'], {
    stdio: 'inherit',
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  });
}

function measure(command: string, args: string[], env: NodeJS.ProcessEnv = process.env): Measured {
  const out = execFileSync(command, args, { encoding: 'utf8', maxBuffer: 1 << 20, env });
  return JSON.parse(out.trim().split('\n').pop() as string) as Measured;
}

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];
const ms = (v: number) => (v < 10 ? v.toFixed(2) : v.toFixed(0));
const mb = (kb: number) => `${Math.round(kb / 1024)} MB`;

function main(): void {
  ensureNumpy();
  const script = fileURLToPath(import.meta.url);
  const node = [...process.execArgv, script];
  console.log(
    `node ${process.version}, load average ${loadavg()
      .map((l) => l.toFixed(1))
      .join(
        ' ',
      )}; medians of ${RUNS} runs after a warm-up of ${WARM_UP.minRuns} to ${WARM_UP.maxRuns} runs (at most ${WARM_UP.ms / 1000} s)`,
  );
  console.log(
    'wall-clock median ms (CPU median ms); engine: full evaluation from one object per standard, the same from two columns, ' +
      'and its calibration + lack of fit + limits alone; then the CPU of JSON.stringify of the result (objects, columns)',
  );
  console.log(
    'standards | engine, full, objects | engine, full, columns | engine, calibration part | numpy/scipy | numpy/scipy, one BLAS thread | ' +
      'full ÷ numpy one thread, CPU (objects, columns) | CPU µs per standard (objects, columns) | serialise CPU | ' +
      'peak RSS objects / columns / numpy | peak RSS once serialised, objects / columns',
  );
  for (const n of SIZES) {
    const engine = measure(process.execPath, [...node, 'engine', String(n), String(RUNS)]);
    const columns = measure(process.execPath, [...node, 'columns', String(n), String(RUNS)]);
    const calibration = measure(process.execPath, [...node, 'calibration', String(n), String(RUNS)]);
    const numpy = measure('python3', [pythonScript, String(n), String(RUNS)]);
    // OpenBLAS's worker threads wait for work by spinning, which counts as CPU time of the process; one thread shows the
    // calculation's own CPU time (the engine runs on one thread).
    const numpyOneThread = measure('python3', [pythonScript, String(n), String(RUNS)], {
      ...process.env,
      OPENBLAS_NUM_THREADS: '1',
      OMP_NUM_THREADS: '1',
    });
    for (const [side, ours] of [
      ['objects', engine],
      ['columns', columns],
    ] as const) {
      for (const [key, value] of Object.entries(numpy.figures)) {
        const figure = ours.figures[key];
        if (value !== null && (figure === null || Math.abs(figure - value) > 1e-8 * Math.max(1, Math.abs(value)))) {
          console.log(`  ${key} differs at ${n} (${side}): engine ${figure}, numpy ${value}`);
        }
      }
    }
    const both = (m: Measured) => `${ms(median(m.times))} (${ms(median(m.cpu))})`;
    const ratio = (a: number[], b: number[]) => (median(a) / median(b)).toFixed(2);
    const perStandard = (m: Measured) => ((1000 * median(m.cpu)) / n).toFixed(2);
    console.log(
      `${n.toLocaleString('en')} | ${both(engine)} | ${both(columns)} | ${both(calibration)} | ${both(numpy)} | ${both(numpyOneThread)} | ` +
        `${ratio(engine.cpu, numpyOneThread.cpu)}×, ${ratio(columns.cpu, numpyOneThread.cpu)}× | ` +
        `${perStandard(engine)}, ${perStandard(columns)} | ` +
        `${ms(median(engine.serialiseCpu ?? [NaN]))}, ${ms(median(columns.serialiseCpu ?? [NaN]))} | ` +
        `${mb(engine.maxRssKb)} / ${mb(columns.maxRssKb)} / ${mb(numpy.maxRssKb)} | ` +
        `${mb(engine.serialisedMaxRssKb ?? NaN)} / ${mb(columns.serialisedMaxRssKb ?? NaN)}`,
    );
  }
  const distinct = measure(process.execPath, [...node, 'distinct', String(DISTINCT_SIZE), String(RUNS)]);
  console.log(
    `every x distinct, ${DISTINCT_SIZE.toLocaleString('en')} standards from columns: ${ms(median(distinct.times))} (${ms(median(distinct.cpu))}), ` +
      `peak RSS ${mb(distinct.maxRssKb)}`,
  );
}

const [mode, size, runs] = process.argv.slice(2);
if (mode) child(mode, Number(size), Number(runs));
else main();
