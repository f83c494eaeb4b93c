import type { EvaluationResult, FieldError, MethodVersionSettings, MethodVersionStatus, StudyStatus } from '@meritline/shared';
import type { ComponentType } from 'react';
import type { CriterionDefinition } from '@/components/study-results';

export interface StudyMeta {
  instrument?: string;
  startedOn?: string;
  finishedOn?: string;
  conclusion?: string;
}

export interface StudyMethod {
  id: string;
  name: string;
  analyte: string;
  matrix: string;
  technique: string;
  xUnit: string;
  yUnit: string;
}

export interface StudyMethodVersion {
  id: string;
  number: number;
  status: MethodVersionStatus;
  criteria: CriterionDefinition[];
  settings: MethodVersionSettings;
}

export interface StudyDto {
  id: string;
  title: string;
  status: StudyStatus;
  methodVersionId: string;
  method: StudyMethod;
  methodVersion: StudyMethodVersion;
  /** The study in the engine's input format, as stored (criteria and units filled in by the server). */
  data: Record<string, unknown>;
  result: EvaluationResult | null;
  resultErrors: FieldError[] | null;
  engineVersion: string;
  dataHash: string;
  meta: StudyMeta;
  author: { id: string; name: string };
  editorIds: string[];
  copiedFromId: string | null;
  lockVersion: number;
  createdAt: string;
  updatedAt: string;
  submittedAt: string | null;
  approvedAt: string | null;
}

/** The wizard's last step, supplied by the app (the review feature signs the submission). */
export type SubmitSlot = ComponentType<{ study: StudyDto }>;

export type StudySummary = Omit<StudyDto, 'data' | 'result'> & { verdictPass: boolean | null };

export interface StudyPage {
  items: StudySummary[];
  total: number;
  page: number;
  pageSize: number;
}

export const STUDY_SORTS = ['updatedAt', 'createdAt', 'title', 'status'] as const;
export type StudySort = (typeof STUDY_SORTS)[number];

export interface StudyListParams {
  status?: StudyStatus;
  methodId?: string;
  mine?: boolean;
  from?: string;
  to?: string;
  q?: string;
  sort: StudySort;
  order: 'asc' | 'desc';
  page: number;
  pageSize: number;
}

/** The methods and versions offered when a study is set up. */
export interface MethodChoice extends StudyMethod {
  versions: (Pick<StudyMethodVersion, 'id' | 'number' | 'status' | 'criteria'> & { changeSummary: string; createdAt: string })[];
}

export const IMPORT_SECTIONS = ['standards', 'blanks', 'recovery', 'precision', 'accuracy', 'unknowns', 'lowSpikes'] as const;
export type ImportSection = (typeof IMPORT_SECTIONS)[number];

export interface ImportPreview {
  section: ImportSection;
  /** Column headers of the file. */
  columns: string[];
  /** Target field → column header, as the server used it. */
  mapping: Record<string, string>;
  /** The section in the study format (lowSpikes: one object). */
  rows: unknown[];
  errors: FieldError[];
  rowCount: number;
}
