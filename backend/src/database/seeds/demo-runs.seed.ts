import type { EntityManager } from 'typeorm';
import { evaluateRun, Role, runContextFor, RunReviewStatus, validationBasis, type EvaluationResult } from '@meritline/shared';
import { AuditService } from '../../audit/audit.service.js';
import { MethodVersion } from '../../methods/method-version.entity.js';
import { Method } from '../../methods/method.entity.js';
import { QcBaseline } from '../../runs/qc-baseline.entity.js';
import { runContentHash, saveCalculatedRun } from '../../runs/run-record.js';
import { RunSignature } from '../../runs/run-signature.entity.js';
import { Run } from '../../runs/run.entity.js';
import { ValidationStudy } from '../../studies/validation-study.entity.js';
import { User } from '../../users/user.entity.js';
import { daysAgo, DEMO_METHODS } from './demo-methods.seed.js';

/** The invented nitrate response: y = 0.0031 + 0.1523·x µS·min per mg/L, as in the validation studies. */
const NITRATE = { intercept: 0.0031, slope: 0.1523 };

/** A repeatable wobble of about ±0.4 %, so every demo database holds the same numbers. */
const wobble = (run: number, point: number) => {
  const v = Math.sin(run * 12.9898 + point * 78.233) * 43758.5453;
  return 1 + 0.008 * (v - Math.floor(v) - 0.5);
};

const response = (x: number, sensitivity: number, run: number, point: number) =>
  Number(((NITRATE.intercept + NITRATE.slope * x) * sensitivity * wobble(run, point)).toFixed(4));

interface DemoRun {
  daysAgo: number;
  author: string;
  model: 'one-point' | 'two-point' | 'linear';
  /** Day-to-day sensitivity: the slope drifts slowly with the column and the suppressor. */
  sensitivity: number;
  /** Response of the mid check standard relative to the calibration (1 = as expected). */
  checkFactor?: number;
  samples: { id: string; x: number; dilution?: number }[];
}

const ANALYST = 'analyst@meritline.test';
const SECOND_ANALYST = 'analyst2@meritline.test';

/** A demo run in one row: day, author, calibration, the day's sensitivity, then its samples as [name, mg/L, dilution]. */
const run = (
  daysAgo: number,
  author: string,
  model: DemoRun['model'],
  sensitivity: number,
  ...samples: [id: string, x: number, dilution?: number][]
): DemoRun => ({ daysAgo, author, model, sensitivity, samples: samples.map(([id, x, dilution]) => ({ id, x, dilution })) });

const LINEAR_LEVELS = [0.5, 2.5, 10, 25, 50];

// Five days below the long-run slope, then seven above it: the chart shows the drift.
const ACTIVE_RUNS: DemoRun[] = [
  run(
    27,
    ANALYST,
    'linear',
    0.99,
    ['W-2701 tap water, Riverside', 11.8],
    ['W-2702 well, Oak Farm', 31.5],
    ['W-2703 tap water, Hill Road', 0.3],
  ),
  run(25, SECOND_ANALYST, 'linear', 0.994, ['W-2711 spring, Mill Brook', 6.2], ['W-2712 tap water, Station Square', 14.9]),
  run(23, ANALYST, 'two-point', 0.997, ['W-2720 well, Marsh Lane', 58.4, 2], ['W-2721 tap water, Riverside', 12.1]),
  run(
    21,
    ANALYST,
    'linear',
    0.992,
    ['W-2730 borehole, Ash Farm', 44.7],
    ['W-2731 tap water, Elm Court', 8.8],
    ['W-2732 well, Oak Farm', 33.2],
  ),
  run(19, SECOND_ANALYST, 'linear', 0.995, ['W-2740 tap water, Hill Road', 0.9], ['W-2741 reservoir outlet', 4.6]),
  {
    ...run(17, SECOND_ANALYST, 'linear', 1.001, ['W-2750 tap water, Riverside', 12.3], ['W-2751 well, Marsh Lane', 29.6, 2]),
    checkFactor: 0.86,
  },
  run(16, ANALYST, 'linear', 1.004, ['W-2750 tap water, Riverside (repeat)', 12.3], ['W-2751 well, Marsh Lane (repeat)', 29.6, 2]),
  run(
    14,
    ANALYST,
    'one-point',
    1.006,
    ['W-2760 tap water, Station Square', 9.7],
    ['W-2761 spring, Mill Brook', 6.0],
    ['W-2762 tap water, Elm Court', 11.4],
  ),
  run(12, SECOND_ANALYST, 'linear', 1.008, ['W-2770 well, Oak Farm', 36.1], ['W-2771 borehole, Ash Farm', 47.9]),
  run(9, ANALYST, 'linear', 1.008, ['W-2780 tap water, Riverside', 12.6], ['W-2781 new well, Birch Lane', 71.0]),
  run(7, ANALYST, 'linear', 1.007, ['W-2781 new well, Birch Lane (diluted)', 71.0, 5], ['W-2782 tap water, Hill Road', 0.4]),
  run(4, SECOND_ANALYST, 'two-point', 1.01, ['W-2790 reservoir outlet', 4.4], ['W-2791 tap water, Elm Court', 9.1]),
  run(
    2,
    ANALYST,
    'linear',
    1.012,
    ['W-2800 tap water, Station Square', 10.2],
    ['W-2801 well, Oak Farm', 34.8],
    ['W-2802 spring, Mill Brook', 5.7],
  ),
];

// Runs made on the first version while it was active (it has been retired since).
const RETIRED_RUNS: DemoRun[] = [
  run(320, SECOND_ANALYST, 'linear', 1.012, ['W-1102 tap water, Riverside', 11.2], ['W-1103 well, Oak Farm', 22.4]),
  run(190, SECOND_ANALYST, 'linear', 0.988, ['W-1530 tap water, Hill Road', 0.8], ['W-1531 well, Marsh Lane', 19.9]),
  run(75, ANALYST, 'two-point', 1.003, ['W-2210 tap water, Riverside', 12.0]),
];

function runData(run: DemoRun, model: DemoRun['model'], index: number, topLevel: number) {
  const levels = model === 'linear' ? LINEAR_LEVELS.filter((x) => x <= topLevel) : model === 'two-point' ? [1, topLevel] : [10];
  const measure = (x: number, point: number, factor = 1) => response(x, run.sensitivity * factor, index, point);
  return {
    model,
    standards: levels.map((x, i) => ({ x, y: measure(x, i) })),
    checks: [
      { id: 'CCV 10 mg/L', nominal: 10, y: [measure(10, 20, run.checkFactor)] },
      { id: 'Low check 1 mg/L', nominal: 1, y: [measure(1, 21)] },
    ],
    unknowns: run.samples.map((s, i) => {
      const dilution = s.dilution ?? 1;
      return { id: s.id, y: [measure(s.x / dilution, 30 + i), measure(s.x / dilution, 40 + i)], ...(dilution !== 1 ? { dilution } : {}) };
    }),
  };
}

/** The oldest runs of the active version are released and set the control-chart baseline; the later ones drift above it. */
const BASELINE_RUNS = 5;

async function releaseAsBaseline(manager: EntityManager, version: MethodVersion, runs: Run[]) {
  const reviewer = await manager.findOneByOrFail(User, { email: 'reviewer@meritline.test' });
  const quality = await manager.findOneByOrFail(User, { email: 'quality@meritline.test' });
  const audit = new AuditService(manager.connection);
  for (const run of runs) {
    const author = await manager.findOneByOrFail(User, { id: run.authorId });
    const hash = runContentHash(run);
    const submittedAt = new Date(run.createdAt.getTime() + 3_600_000);
    const releasedAt = new Date(run.createdAt.getTime() + 7_200_000);
    await manager.update(Run, { id: run.id }, { reviewStatus: RunReviewStatus.Released, submittedAt, releasedAt, lockVersion: 3 });
    await manager.save(RunSignature, [
      {
        runId: run.id,
        signerId: author.id,
        signerName: author.name,
        signerRole: Role.Analyst,
        meaning: 'performed',
        signedAt: submittedAt,
        contentHash: hash,
      },
      {
        runId: run.id,
        signerId: reviewer.id,
        signerName: reviewer.name,
        signerRole: Role.Reviewer,
        meaning: 'reviewed-and-released',
        signedAt: releasedAt,
        contentHash: hash,
      },
    ]);
  }
  const reason = 'Demo: the first released runs after the column change, with the instrument in control';
  await manager.insert(QcBaseline, {
    methodVersionId: version.id,
    runIds: runs.map((r) => r.id),
    chosenById: quality.id,
    chosenByName: quality.name,
    chosenAt: new Date(runs[runs.length - 1].createdAt.getTime() + 86_400_000),
    reason,
    lockVersion: 1,
  });
  await audit.record(
    {
      actor: quality,
      action: 'qc-baseline.chosen',
      entity: 'method-version',
      entityId: version.id,
      changes: { qcBaselineRunIds: { from: null, to: runs.map((r) => r.id) } },
      reason,
    },
    manager,
  );
}

async function seedVersionRuns(manager: EntityManager, version: MethodVersion, runs: DemoRun[], firstIndex: number): Promise<Run[]> {
  const study = await manager.findOne(ValidationStudy, {
    where: { methodVersionId: version.id, status: 'approved' },
    order: { approvedAt: 'DESC' },
  });
  const basis = study?.result ? validationBasis({ ...study, result: study.result as unknown as EvaluationResult }) : null;
  if (!basis) return [];
  const saved: Run[] = [];
  const method = await manager.findOneByOrFail(Method, { id: version.methodId });
  const context = runContextFor(basis, version, { x: method.xUnit, y: method.yUnit });
  const audit = new AuditService(manager.connection);
  for (const [i, demo] of runs.entries()) {
    const author = await manager.findOneByOrFail(User, { email: demo.author });
    // A model the validation does not justify falls back to the straight line, as an analyst would.
    const model = context.choices.find((c) => c.model === demo.model)?.allowed ? demo.model : 'linear';
    const evaluation = evaluateRun(runData(demo, model, firstIndex + i, basis.validatedRange?.high ?? 50), context);
    const date = daysAgo(demo.daysAgo, 15 - (i % 5));
    saved.push(
      await saveCalculatedRun(manager, audit, {
        methodVersionId: version.id,
        title: `Nitrate in drinking water, batch ${date.toISOString().slice(0, 10)}`,
        evaluation,
        author,
        createdAt: date,
      }),
    );
  }
  return saved;
}

/** Routine batches on the validated nitrate method: a month on the active version and a few from the retired one. */
export async function seedDemoRuns(manager: EntityManager) {
  const method = await manager.findOneBy(Method, { name: DEMO_METHODS.nitrate });
  if (!method) return;
  const versions = await manager.find(MethodVersion, { where: { methodId: method.id }, order: { number: 'ASC' } });
  const retired = versions.find((v) => v.status === 'retired');
  const active = versions.find((v) => v.status === 'active');
  if (retired) await seedVersionRuns(manager, retired, RETIRED_RUNS, 100);
  if (active) {
    const runs = await seedVersionRuns(manager, active, ACTIVE_RUNS, 0);
    const baseline = runs.filter((r) => r.status === 'accepted').slice(0, BASELINE_RUNS);
    if (baseline.length === BASELINE_RUNS) await releaseAsBaseline(manager, active, baseline);
  }
}
