import type { MethodChangeKind, RevalidationFamily } from '../method-change.js';
import type { CriterionOp } from '../study.js';
import type { UserRef } from './common.js';

export type MethodVersionStatus = 'draft' | 'active' | 'retired';
export const METHOD_VERSION_STATUSES: readonly MethodVersionStatus[] = ['draft', 'active', 'retired'];

export interface MethodVersionSettings {
  /** A quality manager must release the study after the reviewer's approval. */
  requiresQualityRelease: boolean;
  /** Check standards in a routine run must recover within 100 ± this %. */
  checkTolerancePct: number;
  /** One-point calibration is allowed only when |intercept| is at most this % of the top response. */
  onePointMaxInterceptPct: number;
  /** Mean recoveries of two versions within this many percentage points count as equivalent (default 5). */
  recoveryEquivalenceMarginPct?: number;
  /** β of the accuracy profile's tolerance limits (0.80 unless set; 0.95 is the stricter common choice). */
  accuracyBeta?: number;
  /** Acceptance limits of the accuracy profile, ±λ % (10 unless set). */
  accuracyLambdaPct?: number;
  /** Coverage factor k of the expanded uncertainty (2 unless set). */
  coverageFactor?: number;
}

/** An acceptance criterion as a method version states it; `label` names it for people. */
export interface CriterionDefinition {
  figure: string;
  op: CriterionOp;
  value: number | [number, number];
  level?: string | number;
  label?: string;
}

export interface RevalidationCoverage {
  /** An approved study of this version shows every family in scope again (always true for an empty scope). */
  covered: boolean;
  /** Families in scope that no approved study of this version shows. */
  missing: RevalidationFamily[];
  /** The approved study that covers the scope. */
  studyId: string | null;
}

export interface MethodVersionDto {
  id: string;
  number: number;
  status: MethodVersionStatus;
  changeSummary: string;
  /** Null for the first version of a method. */
  changeKind: MethodChangeKind | null;
  revalidationScope: RevalidationFamily[];
  coverage: RevalidationCoverage;
  /** Why a quality manager activated the version without a covering study. */
  activationJustification: string | null;
  criteria: CriterionDefinition[];
  settings: MethodVersionSettings;
  lockVersion: number;
  createdAt: string;
  createdBy: UserRef;
  /** Validation studies on this version, and how many of them are approved. */
  studyCount: number;
  approvedStudyCount: number;
}

export interface MethodSummaryDto {
  id: string;
  name: string;
  analyte: string;
  matrix: string;
  technique: string;
  xUnit: string;
  yUnit: string;
  /** Key of the criteria template the method started from. */
  purpose: string;
}

export interface MethodDto extends MethodSummaryDto {
  createdAt: string;
  /** Sorted by number. */
  versions: MethodVersionDto[];
}

export interface MethodVersionDetailDto extends MethodVersionDto {
  method: MethodSummaryDto;
}

export interface CriteriaTemplateDto {
  key: string;
  name: string;
  description: string;
  criteria: CriterionDefinition[];
  /** Typical settings for this purpose. */
  settings: MethodVersionSettings;
  /** Where the thresholds come from (common practice) and the cautions that go with them. */
  note: string;
}
