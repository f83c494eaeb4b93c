import type { MethodVersionStatus } from './methods.js';
import type { StudyStatus } from './studies.js';
import type { VersionComparison } from '../comparison-types.js';
import type { Interval } from '../result.js';

/** One side of a version comparison: the version and the study whose result stands for it. */
export interface ComparedVersion {
  versionId: string;
  number: number;
  status: MethodVersionStatus;
  createdAt: string;
  /** Null when the version has no approved study (and none was picked). */
  studyId: string | null;
  studyTitle: string | null;
  studyStatus: StudyStatus | null;
  approvedAt: string | null;
}

/** One aspect of the two versions side by side, in words. */
export interface VersionChangeRow {
  aspect: string;
  from: string | null;
  to: string | null;
  changed: boolean;
}

export type VersionComparisonTests = Pick<
  VersionComparison,
  'slope' | 'intercept' | 'residualSd' | 'repeatability' | 'intermediatePrecision' | 'recovery'
>;

/** The engine's comparison of the two studies, with the versions it compares and their changes in words. `alpha` is the later study's α. */
export interface VersionComparisonResponse extends Pick<
  VersionComparison,
  'alpha' | 'recoveryMarginPct' | 'figures' | 'detection' | 'range'
> {
  method: { id: string; name: string; xUnit: string; yUnit: string };
  from: ComparedVersion;
  to: ComparedVersion;
  changes: VersionChangeRow[];
  tests: VersionComparisonTests;
  /** What the comparison lacks, in words (e.g. a version without an approved study); empty when complete. */
  missing: string[];
}

export interface MethodTrendPoint {
  versionId: string;
  number: number;
  status: MethodVersionStatus;
  createdAt: string;
  studyId: string | null;
  approvedAt: string | null;
  slope: number | null;
  slopeCi: Interval | null;
  loq: number | null;
  /** The approach the LOQ comes from. */
  loqBasis: string | null;
  rsdR: number | null;
  rsdI: number | null;
  meanRecoveryPct: number | null;
  meanRecoveryCi: Interval | null;
}

export interface MethodTrendResponse {
  method: { id: string; name: string; xUnit: string; yUnit: string };
  points: MethodTrendPoint[];
}
