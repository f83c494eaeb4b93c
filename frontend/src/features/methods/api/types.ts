import type { MethodVersionSettings, MethodVersionStatus } from '@meritline/shared';
import type { CriterionDefinition } from '@/components/study-results';

export interface MethodVersionDto {
  id: string;
  number: number;
  status: MethodVersionStatus;
  changeSummary: string;
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
