import type { MethodVersionStatus } from './methods.js';
import type { StudyStatus } from './studies.js';
import type {
  ComparisonVerdict,
  DetectionComparison,
  EquivalenceTest,
  FigureComparison,
  LineParameterComparison,
  MeanComparison,
  RangeComparison,
  Unavailable,
  VarianceComparison,
} from '../comparison-types.js';
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

export interface VersionComparisonTests {
  slope: LineParameterComparison | Unavailable;
  intercept: LineParameterComparison | Unavailable;
  residualSd: VarianceComparison | Unavailable;
  repeatability: VarianceComparison | Unavailable;
  intermediatePrecision: VarianceComparison | Unavailable;
  recovery: { welch: MeanComparison | Unavailable; tost: EquivalenceTest | Unavailable; verdict: ComparisonVerdict };
}

export interface VersionComparisonResponse {
  method: { id: string; name: string; xUnit: string; yUnit: string };
  from: ComparedVersion;
  to: ComparedVersion;
  /** Significance level of the tests: the later study's α. */
  alpha: number;
  /** Equivalence margin of the mean recoveries, percentage points. */
  recoveryMarginPct: number;
  changes: VersionChangeRow[];
  figures: FigureComparison[];
  tests: VersionComparisonTests;
  detection: DetectionComparison[];
  range: RangeComparison | Unavailable;
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
