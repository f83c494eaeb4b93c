import type { ModelChoice, RunQcWindow, RunSettings, ValidatedRange, ValidationBasis } from '../api/runs.js';
import type { DetectionApproach, DetectionResult, EvaluationResult } from '../result.js';
import { formatRunSignificant } from './reported-numbers.js';

const STRAIGHT_LINE_MODELS = ['linear', 'linear-through-origin'];

/** LOD and LOQ (x units) of a detection approach; approaches without an LOQ give null. */
function limitsOf(detection: DetectionResult, approach: DetectionApproach): { lod: number | null; loq: number | null } {
  switch (approach) {
    case 'sdResidual':
    case 'sdIntercept':
    case 'blankSd': {
      const limits = detection[approach];
      return { lod: limits?.lod ?? null, loq: limits?.loq ?? null };
    }
    case 'iso11843':
    case 'hubauxVos':
      return { lod: detection[approach]?.detectableX ?? null, loq: null };
    case 'epaMdl':
      return { lod: detection.epaMdl?.mdl ?? null, loq: null };
  }
}

/**
 * LOD and LOQ from the approach the validation's criteria name (the engine's flag basis), else the
 * residual SD of the calibration (ICH Q2(R2): 3.3 σ/S and 10 σ/S).
 */
function detectionLimits(detection: DetectionResult | null) {
  if (!detection) return { lod: null, loq: null, lodBasis: null, loqBasis: null };
  const basis: DetectionApproach = detection.flagBasis ?? 'sdResidual';
  const own = limitsOf(detection, basis);
  const fallback = limitsOf(detection, 'sdResidual');
  const lod = own.lod ?? fallback.lod;
  const loq = own.loq ?? fallback.loq;
  return {
    lod,
    loq,
    lodBasis: lod === null ? null : own.lod !== null ? basis : 'sdResidual',
    loqBasis: loq === null ? null : own.loq !== null ? basis : 'sdResidual',
  } as const;
}

function validatedRange(result: EvaluationResult): ValidatedRange | null {
  if (result.range) return { low: result.range.low, high: result.range.high, basis: 'range' };
  if (result.calibration) return { low: result.calibration.xMin, high: result.calibration.xMax, basis: 'standards' };
  return null;
}

export interface ApprovedStudy {
  id: string;
  title: string;
  approvedAt: Date | null;
  result: EvaluationResult;
}

/** The figures of the approved validation study a routine run depends on. */
export function validationBasis(study: ApprovedStudy): ValidationBasis | null {
  const { result } = study;
  const calibration = result.calibration;
  if (!calibration) return null;
  const test = result.interceptTest;
  return {
    studyId: study.id,
    studyTitle: study.title,
    approvedAt: study.approvedAt?.toISOString() ?? null,
    model: result.model,
    weighting: result.weighting,
    confidence: result.confidence ?? 0.95,
    slope: calibration.slope,
    intercept: calibration.intercept,
    curvature: calibration.curvature ?? null,
    ...detectionLimits(result.detection),
    validatedRange: validatedRange(result),
    interceptTest: test
      ? { intercept: test.intercept, p: test.p, significant: test.significant, interceptPctOfTopResponse: test.interceptPctOfTopResponse }
      : null,
    uncertainty: result.uncertainty
      ? {
          coverageFactor: result.uncertainty.coverageFactor,
          relativeAbove: result.uncertainty.relativeAbove,
          absolute: result.uncertainty.absolute,
          relative: result.uncertainty.relative,
        }
      : null,
  };
}

function onePointChoice(basis: ValidationBasis, settings: RunSettings, yUnit: string): ModelChoice {
  const refuse = (reason: string): ModelChoice => ({ model: 'one-point', allowed: false, reason });
  if (!STRAIGHT_LINE_MODELS.includes(basis.model)) {
    return refuse('The validation calibrated with a curve: a single standard and the origin cannot describe it.');
  }
  const test = basis.interceptTest;
  if (!test) {
    return refuse(
      'The validation has no intercept test (it needs at least 3 standards at 2 or more concentrations), so a line through the origin is not justified.',
    );
  }
  const intercept = `${formatRunSignificant(test.intercept, 3)}${yUnit ? ` ${yUnit}` : ''}`;
  if (test.significant) {
    return refuse(
      `The validation's intercept (${intercept}) differs significantly from zero (p = ${formatRunSignificant(test.p, 2)}): a line forced through the origin would bias the results.`,
    );
  }
  const pct = Math.abs(test.interceptPctOfTopResponse);
  if (pct > settings.onePointMaxInterceptPct) {
    return refuse(
      `The validation's intercept is ${formatRunSignificant(pct, 2)} % of the top standard's response, above this version's limit of ${settings.onePointMaxInterceptPct} %.`,
    );
  }
  return { model: 'one-point', allowed: true };
}

/** Which calibration models a run on this version may use, and in words why not. */
export function modelChoices(basis: ValidationBasis | null, settings: RunSettings, yUnit = ''): ModelChoice[] {
  if (!basis) {
    const reason = 'This version has no approved validation study with a calibration.';
    return (['one-point', 'two-point', 'linear', 'quadratic'] as const).map((model) => ({ model, allowed: false, reason }));
  }
  const straight = STRAIGHT_LINE_MODELS.includes(basis.model);
  const curved = 'The validated response is curved (quadratic): a straight line was not validated for this version.';
  return [
    onePointChoice(basis, settings, yUnit),
    straight
      ? { model: 'two-point', allowed: true }
      : { model: 'two-point', allowed: false, reason: `${curved} A line through two standards would misread the samples between them.` },
    straight
      ? { model: 'linear', allowed: true, weighting: basis.model === 'linear' ? basis.weighting : 'none' }
      : { model: 'linear', allowed: false, reason: curved },
    basis.model === 'quadratic'
      ? { model: 'quadratic', allowed: true, weighting: basis.weighting }
      : {
          model: 'quadratic',
          allowed: false,
          reason: 'The validation showed a straight line; a quadratic calibration was not validated for this version.',
        },
  ];
}

/**
 * The recovery window of QC samples of known value: the version's criterion on the mean recovery
 * when it gives one as a range, else the check standards' window.
 */
export function qcWindow(criteria: { figure: string; op: string; value: number | [number, number] }[], settings: RunSettings): RunQcWindow {
  const recovery = criteria.find((c) => c.figure === 'recovery.overall.meanPct' && c.op === 'between' && Array.isArray(c.value));
  if (recovery) {
    const [low, high] = recovery.value as [number, number];
    return { low, high, basis: 'the mean-recovery criterion of this method version' };
  }
  const t = settings.checkTolerancePct;
  return { low: 100 - t, high: 100 + t, basis: 'the check-standard window of this method version, as it sets no recovery range' };
}
