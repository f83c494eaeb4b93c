import type { RoutineUncertainty } from '../engine/routine-uncertainty.js';

export type { RoutineUncertainty };

/** The expanded uncertainty a routine result carries, and where it comes from in words. */
export interface RunResultUncertainty {
  /** Null when the validation states no uncertainty or the result is not a number to report (e.g. below the LOQ). */
  value: RoutineUncertainty | null;
  /** The basis in words, shown on screen, on the run sheet, in the report and in exports. */
  basis: string;
}

/** The answer of POST /api/reports/verify for a signed results report of a routine run. */
export interface RunReportVerificationDto {
  valid: true;
  kind: 'results-report';
  reportId: string;
  runId: string;
  runTitle: string;
  methodName: string;
  methodVersion: number;
  signedAt: string;
  sha256: string;
}

/** A method blank in a run: its reading must stay below the set limit, else below the validation's LOD. */
export interface RunBlankInput {
  id: string;
  y: number[];
  /** Upper limit in the measured solution (concentration unit); absent: the validation's LOD. */
  limit?: number;
}

/** A QC sample of known value in a run: its recovery must fall within the version's window. */
export interface RunQcSampleInput {
  id: string;
  known: number;
  y: number[];
  dilution?: number;
}

export interface RunBlankResult {
  id: string;
  yMean: number;
  /** Concentration read off the run's calibration (measured solution). */
  found: number;
  limit: number;
  limitBasis: 'set' | 'lod';
  pass: boolean;
}

export interface RunQcSampleResult {
  id: string;
  known: number;
  dilution: number;
  yMean: number;
  found: number;
  recoveryPct: number;
  pass: boolean;
}

/** The recovery window QC samples must meet, and where it comes from in words. */
export interface RunQcWindow {
  low: number;
  high: number;
  basis: string;
}
