import type { MethodChangeKind, MethodVersionSettings, MethodVersionStatus, RevalidationFamily } from '@meritline/shared';
import type { CriterionDefinition } from '@/components/study-results';

export interface MethodVersionDto {
  id: string;
  number: number;
  status: MethodVersionStatus;
  changeSummary: string;
  /** Null for the first version of a method. */
  changeKind: MethodChangeKind | null;
  revalidationScope: RevalidationFamily[];
  /** Whether an approved study of this version shows every family in scope again, and which it lacks. */
  coverage: { covered: boolean; missing: RevalidationFamily[]; studyId: string | null };
  activationJustification: string | null;
  criteria: CriterionDefinition[];
  settings: MethodVersionSettings;
  lockVersion: number;
  createdAt: string;
  createdBy: { id: string; name: string };
  studyCount: number;
  approvedStudyCount: number;
}

export interface MethodDto {
  id: string;
  name: string;
  analyte: string;
  matrix: string;
  technique: string;
  xUnit: string;
  yUnit: string;
  purpose: string;
  createdAt: string;
  versions: MethodVersionDto[];
}

export interface CriteriaTemplateDto {
  key: string;
  name: string;
  description: string;
  criteria: CriterionDefinition[];
  note: string;
}
