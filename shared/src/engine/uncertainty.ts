import { StudyValidationError } from '../errors.js';
import type {
  BiasEstimate,
  ReferenceMaterialInput,
  TopDownLevel,
  TopDownLevelResult,
  TopDownOptions,
  TruenessResult,
  UncertaintyResult,
} from '../uncertainty-types.js';
import { DEFAULT_COVERAGE_FACTOR } from '../version-options.js';
import { mean, sd } from './stats.js';

/** Root mean square of the bias values. */
export function rmsBias(biases: readonly number[]): number {
  return biases.length === 0 ? 0 : Math.sqrt(biases.reduce((s, b) => s + b * b, 0) / biases.length);
}

/** Nordtest TR 537 (from memory): u(bias) = √(RMS_bias² + u(C_ref)²). */
export function biasUncertainty(estimate: BiasEstimate): number {
  return Math.hypot(rmsBias(estimate.biases), estimate.uReference);
}

/** Nordtest TR 537, one CRM (from memory): u(bias) = √(bias² + (s/√n)² + u(C_ref)²). */
export function crmBiasUncertainty(results: readonly number[], certified: number, uCertified: number): number {
  const s = sd(results) ?? 0;
  return Math.sqrt((mean(results) - certified) ** 2 + (s * s) / results.length + uCertified ** 2);
}

/** u_c = √(u(R_w)² + u(bias)²), U = k·u_c. */
export function combineTopDown(uRw: number, uBias: number, coverageFactor = 2): { uc: number; U: number } {
  const uc = Math.hypot(uRw, uBias);
  return { uc, U: coverageFactor * uc };
}

/** Top-down uncertainty per level; U stated absolute below `relativeAbove` and relative at and above it. */
export function topDownUncertainty(levels: readonly TopDownLevel[], options: TopDownOptions = {}): UncertaintyResult {
  const k = options.coverageFactor ?? DEFAULT_COVERAGE_FACTOR;
  if (!(k > 0))
    throw StudyValidationError.single('uncertainty.coverageFactor', 'not_positive', 'the coverage factor must be greater than zero');
  const relativeAbove = options.relativeAbove ?? null;
  const byLevel: TopDownLevelResult[] = levels.map((l) => {
    const uRwPct = (100 * l.sRw) / l.concentration;
    const rms = rmsBias(l.biasPct);
    const uBiasPct = Math.hypot(rms, l.uReferencePct);
    const ucPct = Math.hypot(uRwPct, uBiasPct);
    const uc = (ucPct * l.concentration) / 100;
    return {
      level: l.level,
      concentration: l.concentration,
      uRw: l.sRw,
      uRwPct,
      rmsBiasPct: rms,
      uBias: (uBiasPct * l.concentration) / 100,
      uBiasPct,
      uc,
      ucPct,
      U: k * uc,
      UPct: k * ucPct,
      expressedAs: relativeAbove !== null && l.concentration < relativeAbove ? 'absolute' : 'relative',
    };
  });
  const abs = byLevel.filter((l) => l.expressedAs === 'absolute');
  const rel = byLevel.filter((l) => l.expressedAs === 'relative');
  const largest = (list: TopDownLevelResult[], key: 'uc' | 'ucPct') => list.reduce((a, b) => (b[key] > a[key] ? b : a));
  const a = abs.length > 0 ? largest(abs, 'uc') : null;
  const r = rel.length > 0 ? largest(rel, 'ucPct') : null;
  return {
    coverageFactor: k,
    relativeAbove,
    byLevel,
    absolute: a ? { U: a.U, uc: a.uc, below: relativeAbove } : null,
    relative: r ? { UPct: r.UPct, ucPct: r.ucPct, from: relativeAbove } : null,
  };
}

/**
 * Trueness against a certified reference material: |x̄ − C_cert| compared with
 * U_Δ = 2·√(s²/n + u_cert²) (common practice, e.g. ERM application note 1, from memory).
 */
export function truenessVersusReference(rm: ReferenceMaterialInput): TruenessResult {
  if (rm.results.length < 2)
    throw StudyValidationError.single(
      'referenceMaterial.results',
      'too_few',
      'trueness needs at least 2 results on the reference material',
    );
  if (!(rm.certified > 0))
    throw StudyValidationError.single('referenceMaterial.certified', 'not_positive', 'the certified value must be greater than zero');
  if (!(rm.uCertified >= 0))
    throw StudyValidationError.single(
      'referenceMaterial.uCertified',
      'negative',
      'the uncertainty of the certified value must not be negative',
    );
  const n = rm.results.length;
  const m = mean(rm.results);
  const s = sd(rm.results) ?? 0;
  const difference = m - rm.certified;
  const uDifference = Math.sqrt((s * s) / n + rm.uCertified ** 2);
  const UDifference = 2 * uDifference;
  const significant = Math.abs(difference) > UDifference;
  const fmt = (v: number) => Number(v.toPrecision(3)).toString();
  const conclusion = significant
    ? `The mean found (${fmt(m)}) differs from the certified value (${fmt(rm.certified)}) by ${fmt(difference)}, more than the expanded uncertainty of the difference (${fmt(UDifference)}): the method shows a bias on this material.`
    : `The mean found (${fmt(m)}) differs from the certified value (${fmt(rm.certified)}) by ${fmt(difference)}, within the expanded uncertainty of the difference (${fmt(UDifference)}): no bias is shown on this material.`;
  return {
    n,
    mean: m,
    sd: s,
    certified: rm.certified,
    uCertified: rm.uCertified,
    difference,
    differencePct: (100 * difference) / rm.certified,
    uDifference,
    UDifference,
    significant,
    conclusion,
  };
}
