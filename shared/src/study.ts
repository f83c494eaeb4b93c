import type { AccuracyItem, AccuracyProfileOptions, ReferenceMaterialInput, UncertaintyStudyOptions } from './uncertainty-types.js';

export const MODELS = ['linear', 'linear-through-origin', 'quadratic', 'one-point', 'two-point'] as const;
export type CalibrationModel = (typeof MODELS)[number];

export const WEIGHTINGS = ['none', '1/x', '1/x2', '1/s2'] as const;
export type Weighting = (typeof WEIGHTINGS)[number];

/** The weightings judged by the homoscedasticity check (1/s2 needs the lab's own SDs). */
export const CANDIDATE_WEIGHTINGS = ['none', '1/x', '1/x2'] as const;
export type CandidateWeighting = (typeof CANDIDATE_WEIGHTINGS)[number];

/** Bounds on one study: a list (standards, replicates, unknowns…) holds at most `rows` entries. */
export const STUDY_LIMITS = { rows: 5000 } as const;

export const CRITERION_OPS = ['>=', '<=', '>', '<', 'between', 'abs<='] as const;
export type CriterionOp = (typeof CRITERION_OPS)[number];

export interface Units {
  x?: string;
  y?: string;
}

export interface Exclusion {
  reason: string;
  /** The outlier test that prompted the exclusion, if one did. */
  test?: string;
  [key: string]: unknown;
}

export interface StandardPoint {
  x: number;
  y: number;
  id?: string;
  /** Standard deviation of the response, for 1/s2 weighting. */
  sd?: number;
  excluded?: Exclusion;
  /** The saved standard preparation this standard was made from (traceability; not used in the calculation). */
  preparationId?: string;
}

export interface UnknownSample {
  id: string;
  y: number[];
  /** Multiplies the reported concentration; default 1. */
  dilution?: number;
}

export interface RecoveryItem {
  id: string;
  level?: string;
  added: number;
  found: number;
  /** Amount already present before spiking; default 0. */
  native?: number;
  excluded?: Exclusion;
}

export interface PrecisionResult {
  group: string;
  value: number;
  excluded?: Exclusion;
}

/** A method blank: a plain response, or the response with the analyst's reason for leaving it out. */
export interface BlankResult {
  value: number;
  excluded?: Exclusion;
}
export type Blank = number | BlankResult;

export function blankValue(blank: Blank): number {
  return typeof blank === 'number' ? blank : blank.value;
}

/** The blank responses that enter the figures. */
export function usedBlanks(blanks: readonly Blank[] | undefined): number[] | undefined {
  return blanks?.flatMap((b) => (typeof b === 'number' ? [b] : b.excluded ? [] : [b.value]));
}

/** A low-level spike result: a plain number, or the result with the analyst's reason for leaving it out. */
export interface SpikeResult {
  value: number;
  excluded?: Exclusion;
}
export type Spike = number | SpikeResult;

/** A method blank of the MDL procedure (x units; null = no numerical result), plain or with a reason for leaving it out. */
export interface MdlBlankResult {
  value: number | null;
  excluded?: Exclusion;
}
export type MdlBlank = number | null | MdlBlankResult;

export function spikeValue(spike: Spike): number {
  return typeof spike === 'number' ? spike : spike.value;
}

export function mdlBlankValue(blank: MdlBlank): number | null {
  return blank !== null && typeof blank === 'object' ? blank.value : blank;
}

/** The exclusion of a low-level spike or MDL blank, if the analyst left it out. */
export function lowSpikeExclusion(entry: Spike | MdlBlank): Exclusion | undefined {
  return entry !== null && typeof entry === 'object' ? entry.excluded : undefined;
}

export interface LowSpikes {
  spiked: Spike[];
  /** Method blank results in x units; null = no numerical result. */
  blanks?: MdlBlank[];
}

/** The low-level spike and MDL blank results that enter the MDL. */
export function usedLowSpikes(lowSpikes: LowSpikes): { spiked: number[]; blanks: (number | null)[] } {
  return {
    spiked: lowSpikes.spiked.filter((s) => !lowSpikeExclusion(s)).map(spikeValue),
    blanks: (lowSpikes.blanks ?? []).filter((b) => !lowSpikeExclusion(b)).map(mdlBlankValue),
  };
}

export interface Criterion {
  figure: string;
  op: CriterionOp;
  value: number | [number, number];
}

export interface CheckStandard {
  id: string;
  nominal: number;
  y: number[];
}

export interface TwoPointOptions {
  /** Read each unknown off the pair of adjacent standard levels that brackets its response. */
  bracketing: boolean;
}

export interface Study {
  units?: Units;
  model: CalibrationModel;
  weighting: Weighting;
  confidence: number;
  alpha: number;
  /** Absent: no calibration (precision, recovery or MDL studies only). */
  standards?: StandardPoint[];
  twoPoint?: TwoPointOptions;
  blanks?: Blank[];
  unknowns?: UnknownSample[];
  checks?: CheckStandard[];
  recovery?: RecoveryItem[];
  precision?: PrecisionResult[];
  lowSpikes?: LowSpikes;
  /** Analyte mass fraction (1 mg/kg = 1e-6) for the Horwitz prediction. */
  massFraction?: number;
  criteria?: Criterion[];
  accuracy?: AccuracyItem[];
  referenceMaterial?: ReferenceMaterialInput;
  uncertainty?: UncertaintyStudyOptions;
  accuracyProfile?: AccuracyProfileOptions;
}

/** What a caller may send: everything with a default may be left out. */
export type StudyInput = Omit<Study, 'model' | 'weighting' | 'confidence' | 'alpha'> &
  Partial<Pick<Study, 'model' | 'weighting' | 'confidence' | 'alpha'>>;
