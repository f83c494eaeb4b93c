import type {
  BlankSdLimits,
  DetectionApproach,
  DetectionResult,
  EpaMdlResult,
  ExcludedRow,
  HubauxVosLimits,
  Iso11843Limits,
  LimitPair,
} from '../result.js';
import {
  lowSpikeExclusion,
  mdlBlankValue,
  usedBlanks,
  usedLowSpikes,
  type Blank,
  type Criterion,
  type LowSpikes,
  type MdlBlank,
  type Spike,
} from '../study.js';
import { refitRows, type CalibrationFit } from './calibration.js';
import { detectionDelta, studentQuantile } from './distributions.js';
import { fitLine, type RegressionCore } from './regression.js';
import { mean, sd } from './stats.js';
import type { Warn } from './warnings.js';

/** ICH Q2(R2) factors: DL = 3.3 σ/S, QL = 10 σ/S. */
const ICH_LOD = 3.3;
const ICH_LOQ = 10;

/** The unweighted straight line over the standards: the fit the zero-concentration approaches need. */
function unweightedLine(fit: CalibrationFit, warn: Warn): RegressionCore | null {
  if (fit.model === 'linear' && fit.weighting === 'none' && fit.core) return fit.core;
  if (!fit.core || fit.xs.length < 3 || fit.levels.keys.length < 2) return null;
  const which = fit.weighting === 'none' ? 'iso11843 and hubauxVos use' : 'sdResidual, iso11843 and hubauxVos use';
  const basis = fit.weighting === 'none' ? fit.model : `${fit.weighting}-weighted ${fit.model}`;
  warn('detection', 'unweighted_line', `${which} the unweighted straight line over the same standards, not the ${basis} fit`);
  const rows = refitRows(fit, null);
  return fitLine(rows.x, rows.y, rows.w, undefined, rows.pooled);
}

function sdResidual(fit: CalibrationFit, line: RegressionCore | null): LimitPair | null {
  const core = fit.model === 'quadratic' && fit.weighting === 'none' ? fit.core : fit.model === 'linear-through-origin' ? fit.core : line;
  if (!core || core.df < 1) return null;
  const slope = Math.abs(core.b);
  return { sigma: core.s, slope, lod: (ICH_LOD * core.s) / slope, loq: (ICH_LOQ * core.s) / slope };
}

function sdIntercept(fit: CalibrationFit): LimitPair | null {
  const core = fit.core;
  if (!core || core.seA === null || core.df < 1) return null;
  const slope = Math.abs(core.b);
  return { sigma: core.seA, slope, lod: (ICH_LOD * core.seA) / slope, loq: (ICH_LOQ * core.seA) / slope };
}

/** Intercept and slope near zero concentration: the linear coefficient, or the lowest bracket. */
function lowEndLine(fit: CalibrationFit): { a: number; b: number } {
  if (fit.core) return { a: fit.core.a, b: fit.core.b };
  if (fit.segments) return { a: fit.segments[0].intercept, b: fit.segments[0].slope };
  return { a: fit.calibration.intercept, b: fit.calibration.slope };
}

function blankSd(fit: CalibrationFit, blanks: readonly number[] | undefined, warn: Warn): BlankSdLimits | null {
  if (!blanks || blanks.length === 0) return null;
  const sB = sd(blanks);
  if (sB === null) {
    warn('detection', 'too_few_blanks', 'the blank standard deviation needs at least 2 blanks');
    return null;
  }
  const { a, b } = lowEndLine(fit);
  const slope = Math.abs(b);
  const yB = mean(blanks);
  // A falling response detects the analyte below the blank, not above it.
  const direction = Math.sign(b);
  const responseLod = yB + direction * 3 * sB;
  const responseLoq = yB + direction * 10 * sB;
  return {
    n: blanks.length,
    mean: yB,
    sigma: sB,
    slope,
    lod: (ICH_LOD * sB) / slope,
    loq: (ICH_LOQ * sB) / slope,
    responseLod,
    responseLoq,
    responseLodX: (responseLod - a) / b,
    responseLoqX: (responseLoq - a) / b,
  };
}

/** ISO 11843-2 critical value and minimum detectable value, K = 1 reading of the test sample. */
function iso11843(line: RegressionCore | null, alpha: number): Iso11843Limits | null {
  if (!line || line.df < 1) return null;
  const K = 1;
  const q = Math.sqrt(1 / K + 1 / line.n + (line.xMean * line.xMean) / line.sxx);
  const tc = studentQuantile(1 - alpha, line.df);
  const delta = detectionDelta(line.df, alpha, alpha);
  const slope = Math.abs(line.b);
  return {
    K,
    df: line.df,
    criticalResponse: line.a + Math.sign(line.b) * tc * line.s * q,
    criticalX: (tc * line.s * q) / slope,
    detectableX: (delta * line.s * q) / slope,
    delta,
  };
}

/** Hubaux & Vos (1970): x_D where the lower prediction limit of the line meets y_C. */
function hubauxVos(line: RegressionCore | null, alpha: number, warn: Warn): HubauxVosLimits | null {
  if (!line || line.df < 1) return null;
  const K = 1;
  const base = 1 / K + 1 / line.n;
  const t = studentQuantile(1 - alpha, line.df);
  const B = Math.abs(line.b);
  const D = t * line.s * Math.sqrt(base + (line.xMean * line.xMean) / line.sxx);
  const ts2 = t * t * line.s * line.s;
  const a2 = B * B - ts2 / line.sxx;
  const a1 = -2 * B * D + (2 * ts2 * line.xMean) / line.sxx;
  const a0 = D * D - ts2 * (base + (line.xMean * line.xMean) / line.sxx);
  if (a2 <= 0) {
    warn('detection', 'slope_not_significant', 'the slope is too uncertain for a Hubaux-Vos detection limit');
    return null;
  }
  const disc = Math.max(0, a1 * a1 - 4 * a2 * a0);
  const detectableX = (-a1 + Math.sqrt(disc)) / (2 * a2);
  return {
    df: line.df,
    criticalResponse: line.a + Math.sign(line.b) * D,
    criticalX: D / B,
    detectableX,
  };
}

/** "(6 given)", or with exclusions "(6 used, 1 excluded)": a count rule judged on the rows used. */
const countNote = (used: number, excluded: number) => (excluded > 0 ? `${used} used, ${excluded} excluded` : `${used} given`);

/** 40 CFR Part 136 Appendix B Rev. 2: MDL from spiked samples and from method blanks; excluded rows enter neither. */
export function epaMdl(lowSpikes: LowSpikes | undefined, warn: Warn): EpaMdlResult | null {
  if (!lowSpikes) return null;
  const { spiked, blanks } = usedLowSpikes(lowSpikes);
  const spikedOut = lowSpikes.spiked.length - spiked.length;
  const blanksOut = (lowSpikes.blanks?.length ?? 0) - blanks.length;
  let mdlSpiked: number | null = null;
  if (spiked.length >= 2) {
    if (spiked.length < 7)
      warn('detection', 'too_few_spikes', `the MDL procedure asks for at least 7 spiked samples (${countNote(spiked.length, spikedOut)})`);
    mdlSpiked = studentQuantile(0.99, spiked.length - 1) * (sd(spiked) ?? 0);
  } else if (spiked.length > 0 || spikedOut > 0) {
    warn(
      'detection',
      'too_few_spikes',
      `MDL_s needs at least 2 spiked samples${spikedOut > 0 ? ` (${countNote(spiked.length, spikedOut)})` : ''}`,
    );
  }
  let mdlBlank: number | null = null;
  let blankRule: EpaMdlResult['blankRule'] = null;
  const numeric = blanks.filter((b): b is number => b !== null);
  if (blanks.length > 0) {
    if (numeric.length === 0) {
      blankRule = 'none-numeric';
    } else if (numeric.length < blanks.length) {
      if (blanks.length < 100) {
        blankRule = 'highest';
        mdlBlank = numeric.reduce((a, b) => Math.max(a, b));
      } else {
        blankRule = 'rank';
        const ranked = [...blanks].sort((p, q) => (p ?? -Infinity) - (q ?? -Infinity));
        mdlBlank = ranked[Math.round(0.99 * blanks.length) - 1] ?? null;
      }
    } else if (numeric.length >= 2) {
      blankRule = 'mean-plus-t-sd';
      mdlBlank = Math.max(mean(numeric), 0) + studentQuantile(0.99, numeric.length - 1) * (sd(numeric) ?? 0);
    } else {
      warn(
        'detection',
        'too_few_blanks',
        `MDL_b from numerical blanks needs at least 2 method blanks${blanksOut > 0 ? ` (${countNote(blanks.length, blanksOut)})` : ''}`,
      );
    }
  } else if (blanksOut > 0) {
    warn('detection', 'too_few_blanks', `MDL_b needs method blanks (${countNote(0, blanksOut)})`);
  }
  if (mdlSpiked === null && mdlBlank === null) return null;
  const governing = mdlBlank !== null && (mdlSpiked === null || mdlBlank > mdlSpiked) ? 'blank' : 'spiked';
  return {
    nSpiked: spiked.length,
    nBlanks: blanks.length,
    mdlSpiked,
    mdlBlank,
    blankRule,
    mdl: governing === 'blank' ? (mdlBlank as number) : (mdlSpiked as number),
    governing,
  };
}

const APPROACHES: DetectionApproach[] = ['sdResidual', 'sdIntercept', 'blankSd', 'iso11843', 'hubauxVos', 'epaMdl'];

/** Method blanks the analyst left out, warned with their count and reasons. */
function excludedBlanks(blanks: readonly Blank[] | undefined, warn: Warn): ExcludedRow[] {
  const excluded = (blanks ?? []).flatMap((b, index) =>
    typeof b !== 'number' && b.excluded ? [{ index, label: `blank ${index + 1}`, value: b.value, reason: b.excluded.reason }] : [],
  );
  if (excluded.length > 0) {
    const reasons = [...new Set(excluded.map((row) => row.reason))].join('; ');
    warn('detection', 'excluded', `${excluded.length} method blank${excluded.length === 1 ? '' : 's'} excluded by the analyst: ${reasons}`);
    if (excluded.length === blanks?.length) warn('detection', 'all_excluded', 'every method blank is excluded');
  }
  return excluded;
}

/** Low-level spike results and MDL blanks the analyst left out, warned with their count and reasons like the blanks. */
function excludedLowSpikes(lowSpikes: LowSpikes | undefined, warn: Warn): Pick<DetectionResult, 'excludedSpikes' | 'excludedMdlBlanks'> {
  if (!lowSpikes) return {};
  const rows = <T extends Spike | MdlBlank>(list: readonly T[], noun: string) =>
    list.flatMap((entry, index) => {
      const excluded = lowSpikeExclusion(entry);
      return excluded ? [{ index, label: `${noun} ${index + 1}`, value: mdlBlankValue(entry), reason: excluded.reason }] : [];
    });
  const spikes = rows(lowSpikes.spiked, 'spike') as ExcludedRow[];
  const blanks = rows(lowSpikes.blanks ?? [], 'method blank');
  const report = (count: number, total: number, noun: string, reasons: string[]) => {
    if (count === 0) return;
    const plural = count === 1 ? '' : 's';
    warn('detection', 'excluded', `${count} ${noun}${plural} excluded by the analyst: ${[...new Set(reasons)].join('; ')}`);
    if (count === total) warn('detection', 'all_excluded', `every ${noun} is excluded`);
  };
  report(
    spikes.length,
    lowSpikes.spiked.length,
    'low-level spike result',
    spikes.map((row) => row.reason),
  );
  report(
    blanks.length,
    lowSpikes.blanks?.length ?? 0,
    'method blank of the MDL',
    blanks.map((row) => row.reason),
  );
  // Present only when rows are excluded, so results of studies without exclusions keep their exact shape.
  return { ...(spikes.length ? { excludedSpikes: spikes } : {}), ...(blanks.length ? { excludedMdlBlanks: blanks } : {}) };
}

export function detection(
  fit: CalibrationFit | null,
  allBlanks: readonly Blank[] | undefined,
  lowSpikes: LowSpikes | undefined,
  alpha: number,
  criteria: readonly Criterion[],
  warn: Warn,
): DetectionResult | null {
  const excluded = excludedBlanks(allBlanks, warn);
  const excludedLowSpikeRows = excludedLowSpikes(lowSpikes, warn);
  const blanks = usedBlanks(allBlanks);
  const line = fit?.core ? unweightedLine(fit, warn) : null;
  if (!fit && blanks && blanks.length > 0) warn('detection', 'no_calibration', 'blank-based limits need a calibration slope');
  const result: DetectionResult = {
    sdResidual: fit ? sdResidual(fit, line) : null,
    sdIntercept: fit ? sdIntercept(fit) : null,
    blankSd: fit ? blankSd(fit, blanks, warn) : null,
    iso11843: iso11843(line, alpha),
    hubauxVos: hubauxVos(line, alpha, warn),
    epaMdl: epaMdl(lowSpikes, warn),
    flagBasis: null,
    excludedBlanks: excluded,
    ...excludedLowSpikeRows,
  };
  const named = criteria
    .map((c) => c.figure.split('.'))
    .find((parts) => parts[0] === 'detection' && APPROACHES.includes(parts[1] as DetectionApproach))?.[1] as DetectionApproach | undefined;
  result.flagBasis = [named, ...APPROACHES].find((a) => a !== undefined && result[a] !== null) ?? null;
  if (result.flagBasis === null) {
    warn('detection', 'no_inputs', 'no detection limit could be computed from the inputs given');
    return null;
  }
  return result;
}

/** LOD and LOQ (x units) of the approach the unknowns are flagged against. */
export function flagLimits(result: DetectionResult | null): { lod: number | null; loq: number | null } {
  if (!result || !result.flagBasis) return { lod: null, loq: null };
  switch (result.flagBasis) {
    case 'sdResidual':
    case 'sdIntercept':
    case 'blankSd': {
      const limits = result[result.flagBasis] as LimitPair;
      return { lod: limits.lod, loq: limits.loq };
    }
    case 'iso11843':
    case 'hubauxVos':
      return { lod: (result[result.flagBasis] as Iso11843Limits | HubauxVosLimits).detectableX, loq: null };
    case 'epaMdl':
      return { lod: (result.epaMdl as EpaMdlResult).mdl, loq: null };
  }
}
