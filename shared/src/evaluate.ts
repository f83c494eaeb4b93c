import { StudyValidationError } from './errors.js';
import { fitCalibration } from './engine/calibration.js';
import { detection, flagLimits } from './engine/detection.js';
import { homoscedasticity } from './engine/homoscedasticity.js';
import { interceptTest, throughOrigin } from './engine/intercept.js';
import { predictUnknown } from './engine/inverse.js';
import { lackOfFit, mandel } from './engine/linearity.js';
import { outliers } from './engine/outliers.js';
import { precision } from './engine/precision.js';
import { recovery } from './engine/recovery.js';
import { verdict, workingRange } from './engine/criteria.js';
import { collectWarnings, type Warn } from './engine/warnings.js';
import type { CheckResult, EvaluationResult, UnknownResult } from './result.js';
import type { Study } from './study.js';
import { parseStudy } from './validate.js';
import { ENGINE_VERSION } from './version.js';

/** Replaces any non-finite number by null and says where; JSON would print null silently. */
function guardFinite(value: unknown, path: string, warn: Warn): unknown {
  if (typeof value === 'number') {
    if (Number.isFinite(value)) return value;
    warn('engine', 'non_finite', `${path} could not be computed (non-finite) and is reported as null`);
    return null;
  }
  if (Array.isArray(value)) return value.map((v, i) => guardFinite(v, `${path}[${i}]`, warn));
  if (typeof value === 'object' && value !== null) {
    const out: Record<string, unknown> = {};
    for (const [key, v] of Object.entries(value)) out[key] = guardFinite(v, path ? `${path}.${key}` : key, warn);
    return out;
  }
  return value;
}

function isStudy(input: unknown): input is Study {
  return (
    typeof input === 'object' &&
    input !== null &&
    'model' in input &&
    'weighting' in input &&
    'confidence' in input &&
    'alpha' in input
  );
}

/** Parses (unless given a parsed study) and computes every section of the evaluation. */
export function evaluateStudy(input: unknown): EvaluationResult {
  const study = parseStudy(isStudy(input) ? { ...input } : input);
  const { warnings, warn } = collectWarnings();
  const fit = fitCalibration(study.standards, {
    model: study.model,
    weighting: study.weighting,
    confidence: study.confidence,
    twoPoint: study.twoPoint,
  });

  const predictions = (study.unknowns ?? []).map((u, i) => ({
    id: u.id,
    ...predictUnknown(fit, u.y, u.dilution ?? 1, `unknowns[${i}]`),
  }));
  const checks: CheckResult[] | null = study.checks
    ? study.checks.map((c, i) => {
        const found = predictUnknown(fit, c.y, 1, `checks[${i}]`).x0;
        return { id: c.id, nominal: c.nominal, found, recoveryPct: (100 * found) / c.nominal };
      })
    : null;

  const detectionResult = detection(fit, study.blanks, study.lowSpikes, study.alpha, study.criteria ?? [], warn);
  const { lod, loq } = flagLimits(detectionResult);
  const unknowns: (UnknownResult & { yMean: number })[] = predictions.map((p) => {
    const flags = [...p.flags];
    if (lod !== null && p.x0Undiluted < lod) flags.push('belowLod');
    if (loq !== null && p.x0Undiluted < loq) flags.push('belowLoq');
    return { id: p.id, m: p.m, yMean: p.yMean, dilution: p.dilution, x0: p.x0, sX0: p.sX0, ci: p.ci, flags };
  });
  if (unknowns.length === 0) warn('unknowns', 'no_inputs', 'no unknowns in the study');

  const recoveryResult = recovery(study.recovery, study.confidence, warn);
  const partial: EvaluationResult = {
    engineVersion: ENGINE_VERSION,
    model: study.model,
    weighting: study.weighting,
    confidence: study.confidence,
    alpha: study.alpha,
    units: study.units ?? {},
    calibration: fit.calibration,
    lackOfFit: lackOfFit(fit, warn),
    mandel: mandel(fit, warn),
    interceptTest: interceptTest(fit, warn),
    throughOrigin: throughOrigin(fit, unknowns, warn),
    homoscedasticity: homoscedasticity(fit, study.standards, warn),
    unknowns: unknowns.length > 0 ? unknowns : null,
    checks,
    detection: detectionResult,
    recovery: recoveryResult,
    precision: precision(study.precision, study.massFraction, warn),
    outliers: outliers(study, fit, recoveryResult ? recoveryResult.items.map((i) => i.pct) : null, warn),
    range: null,
    verdict: { criteria: [], pass: null },
    warnings,
  };
  partial.range = workingRange(partial, study.criteria ?? [], study.recovery, warn);
  partial.verdict = verdict(partial, study.criteria ?? []);
  return guardFinite(partial, '', warn) as EvaluationResult;
}

export { StudyValidationError };
