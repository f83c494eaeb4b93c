import { fitCalibration, type CalibrationFit, type FitRowsChoice, type StandardColumns } from './engine/calibration.js';
import { verdict, workingRange } from './engine/criteria.js';
import { detection, flagLimits } from './engine/detection.js';
import { homoscedasticity } from './engine/homoscedasticity.js';
import { interceptTest, throughOrigin } from './engine/intercept.js';
import { unbuiltTables } from './engine/lazy-table.js';
import { predictUnknown } from './engine/inverse.js';
import { lackOfFit, mandel } from './engine/linearity.js';
import { outliers } from './engine/outliers.js';
import { precision } from './engine/precision.js';
import { recovery } from './engine/recovery.js';
import { collectWarnings, type Warn } from './engine/warnings.js';
import { uncertaintySections } from './evaluate-uncertainty.js';
import type { CheckResult, EvaluationResult, UnknownResult } from './result.js';
import type { Study } from './study.js';
import { parseStudy } from './validate.js';
import { ENGINE_VERSION } from './version.js';

/** Whether any number in the tree is NaN or infinite; walks without building paths, and reads tables not built yet from their columns. */
function hasNonFinite(node: object): boolean {
  if (Array.isArray(node)) {
    for (let i = 0; i < node.length; i++) {
      const value: unknown = node[i];
      if (typeof value === 'number' ? !Number.isFinite(value) : typeof value === 'object' && value !== null && hasNonFinite(value))
        return true;
    }
    return false;
  }
  const record = node as Record<string, unknown>;
  const lazy = unbuiltTables(record);
  if (!lazy) {
    // for…in rather than Object.values: no array per object (result objects are plain, their keys all own).
    for (const key in record) {
      const value = record[key];
      if (typeof value === 'number' ? !Number.isFinite(value) : typeof value === 'object' && value !== null && hasNonFinite(value))
        return true;
    }
    return false;
  }
  for (const key in record) {
    if (!Object.hasOwn(record, key)) continue;
    const table = lazy?.get(key);
    if (table && !table.built) {
      if (!table.allFinite()) return true;
      continue;
    }
    const value = record[key];
    if (typeof value === 'number' ? !Number.isFinite(value) : typeof value === 'object' && value !== null && hasNonFinite(value))
      return true;
  }
  return false;
}

/** Replaces, in place, any non-finite number by null and says where; JSON would print null silently. */
function guardFinite(node: unknown, path: string, warn: Warn): void {
  if (typeof node !== 'object' || node === null) return;
  const record = node as Record<string | number, unknown>;
  const keys: (string | number)[] = Array.isArray(node) ? node.map((_, i) => i) : Object.keys(record);
  for (const key of keys) {
    const value = record[key];
    const here = typeof key === 'number' ? `${path}[${key}]` : path ? `${path}.${key}` : key;
    if (typeof value === 'number') {
      if (!Number.isFinite(value)) {
        record[key] = null;
        warn('engine', 'non_finite', `${here} could not be computed (non-finite) and is reported as null`);
      }
    } else if (typeof value === 'object' && value !== null) {
      guardFinite(value, here, warn);
    }
  }
}

function readUnknowns(study: Study, fit: CalibrationFit | null) {
  if (!fit) return [];
  return (study.unknowns ?? []).map((u, i) => ({ id: u.id, ...predictUnknown(fit, u.y, u.dilution ?? 1, `unknowns[${i}]`) }));
}

function readChecks(study: Study, fit: CalibrationFit | null): CheckResult[] | null {
  if (!fit || !study.checks) return null;
  return study.checks.map((c, i) => {
    const found = predictUnknown(fit, c.y, 1, `checks[${i}]`).x0;
    return { id: c.id, nominal: c.nominal, found, recoveryPct: (100 * found) / c.nominal };
  });
}

/** Parses the study (defaults filled in, errors typed) and computes every section of the evaluation. */
export function evaluateStudy(input: unknown): EvaluationResult {
  return evaluateParsedStudy(parseStudy(input));
}

/**
 * Every section of the evaluation of a study `parseStudy` has accepted (the benchmark calls it beyond the list bound,
 * and may pass the standards by columns instead of the study's objects). `rows` chooses the fits' rows (a test compares
 * the per-standard and the per-level arithmetic on the same large study).
 */
export function evaluateParsedStudy(
  study: Study,
  standards: Study['standards'] | StandardColumns = study.standards,
  rows: FitRowsChoice = 'levels-when-large',
): EvaluationResult {
  const { warnings, warn } = collectWarnings();
  const criteria = study.criteria ?? [];
  const fit = standards
    ? fitCalibration(standards, {
        model: study.model,
        weighting: study.weighting,
        confidence: study.confidence,
        twoPoint: study.twoPoint,
        rows,
      })
    : null;
  if (!fit) warn('calibration', 'no_inputs', 'no standards in the study: no calibration');

  const detectionResult = detection(fit, study.blanks, study.lowSpikes, study.alpha, criteria, warn);
  const { lod, loq } = flagLimits(detectionResult);
  const unknowns: UnknownResult[] = readUnknowns(study, fit).map((p) => {
    const flags = [...p.flags];
    if (lod !== null && p.x0Undiluted < lod) flags.push('belowLod');
    if (loq !== null && p.x0Undiluted < loq) flags.push('belowLoq');
    return { id: p.id, m: p.m, yMean: p.yMean, dilution: p.dilution, x0: p.x0, sX0: p.sX0, ci: p.ci, flags };
  });
  if (fit && unknowns.length === 0) warn('unknowns', 'no_inputs', 'no unknowns in the study');

  const recoveryResult = recovery(study.recovery, study.confidence, warn);
  const result: EvaluationResult = {
    engineVersion: ENGINE_VERSION,
    model: study.model,
    weighting: study.weighting,
    confidence: study.confidence,
    alpha: study.alpha,
    units: study.units ?? {},
    calibration: fit ? fit.calibration : null,
    lackOfFit: fit ? lackOfFit(fit, warn) : null,
    mandel: fit ? mandel(fit, warn) : null,
    interceptTest: fit ? interceptTest(fit, warn) : null,
    throughOrigin: fit ? throughOrigin(fit, unknowns, warn) : null,
    homoscedasticity: fit ? homoscedasticity(fit, warn) : null,
    unknowns: unknowns.length > 0 ? unknowns : null,
    checks: readChecks(study, fit),
    detection: detectionResult,
    recovery: recoveryResult,
    precision: precision(study.precision, study.massFraction, warn),
    outliers: outliers(study, fit, recoveryResult ? recoveryResult.items.map((i) => i.pct) : null, warn),
    range: null,
    verdict: { criteria: [], pass: null },
    warnings,
  };
  // Before the verdict, so criteria can name the uncertainty, accuracy-profile and trueness figures.
  Object.assign(result, uncertaintySections(study, result, warn));
  result.range = workingRange(
    result,
    criteria,
    study.recovery?.filter((r) => !r.excluded),
    warn,
  );
  result.verdict = verdict(result, criteria);
  const guarded = { ...result, warnings: [] };
  if (hasNonFinite(guarded)) guardFinite(guarded, '', warn);
  return result;
}
