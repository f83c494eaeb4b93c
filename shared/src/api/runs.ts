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
