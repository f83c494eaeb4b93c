import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { evaluateStudy } from '../evaluate.js';
import { StudyValidationError } from '../errors.js';
import { validationBasis } from '../runs/calibration-choices.js';
import { evaluateRun } from '../runs/run-calculation.js';
import { runContextFor } from '../runs/run-context.js';

/*
 * Miller & Miller, Statistics and Chemometrics for Analytical Chemistry, fluorescence example (x 0–12 pg/ml):
 * the data set and the recomputed inverse predictions of reference-checks/data (its provenance says the data are
 * from memory and the figures recomputed). The check standard and its response are invented.
 */
const miller = JSON.parse(
  readFileSync(new URL('../../../reference-checks/data/calibration_miller_fluorescence.json', import.meta.url), 'utf8'),
);
const standards = (miller.data.x as number[]).map((x, i) => ({ x, y: miller.data.y[i] as number }));
const inverse = (y0: number) =>
  (miller.computed.inverse_prediction as { y0: number; m_replicates_of_unknown: number; x0: number }[]).find(
    (p) => p.y0 === y0 && p.m_replicates_of_unknown === 1,
  )!;

const study = { model: 'linear' as const, units: { x: 'pg/ml', y: 'intensity' }, standards };
const basis = validationBasis({ id: 'v', title: 'Fluorescein validation', approvedAt: null, result: evaluateStudy(study) })!;
const context = runContextFor(
  basis,
  { settings: { checkTolerancePct: 10, onePointMaxInterceptPct: 2 }, criteria: [] },
  { x: 'pg/ml', y: 'intensity' },
);
const run = (checkY: number, extra: Record<string, unknown> = {}) =>
  evaluateRun(
    { model: 'linear', standards, checks: [{ id: 'CCV-1', nominal: 6, y: [checkY] }], unknowns: [{ id: 'S-1', y: [13.5] }], ...extra },
    context,
  );

describe('routine-run calculation', () => {
  it('should read an unknown off the day’s line as Miller & Miller’s inverse prediction and accept the run', () => {
    const accepted = run(13.1);
    expect(accepted.status).toBe('accepted');
    expect(accepted.result.unknowns[0].x0).toBeCloseTo(inverse(13.5).x0, 9);
    expect(accepted.data).toMatchObject({ units: { x: 'pg/ml', y: 'intensity' }, weighting: 'none', confidence: 0.95 });
  });

  it('should reject the run when a check standard recovers outside the window, saying so in words', () => {
    const rejected = run(16);
    expect(rejected.status).toBe('rejected');
    expect(rejected.rejectionReasons[0]).toMatch(/^Check standard CCV-1 recovered .* outside the acceptance window of 90 to 110 %/);
    expect(rejected.result.unknowns[0]).toMatchObject({ reportable: false });
  });

  it('should refuse a field the run does not know with its path', () => {
    expect(() => run(13.1, { colour: 'blue' })).toThrow(StudyValidationError);
    try {
      run(13.1, { colour: 'blue' });
    } catch (error) {
      expect((error as StudyValidationError).errors).toEqual([expect.objectContaining({ field: 'data.colour', code: 'unknown_field' })]);
    }
  });
});
