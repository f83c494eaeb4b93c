import type { EvaluationResult } from '../result.js';
import type { FieldError, KeysetPage, UserRef } from './common.js';
import type { CriterionDefinition, MethodSummaryDto, MethodVersionSettings, MethodVersionStatus } from './methods.js';

export type StudyStatus = 'draft' | 'submitted' | 'returned' | 'approved';
export const STUDY_STATUSES: readonly StudyStatus[] = ['draft', 'submitted', 'returned', 'approved'];

export type StudySection = 'setup' | 'standards' | 'blanks' | 'recovery' | 'precision' | 'results' | 'conclusion';
export const STUDY_SECTIONS: readonly StudySection[] = ['setup', 'standards', 'blanks', 'recovery', 'precision', 'results', 'conclusion'];

export interface StudyMeta {
  instrument?: string;
  startedOn?: string;
  finishedOn?: string;
  conclusion?: string;
}

export type StudyMethod = Omit<MethodSummaryDto, 'purpose'>;

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
  /** The engine's result for exactly `data`; null while the data cannot be evaluated yet. */
  result: EvaluationResult | null;
  /** Why `data` cannot be evaluated yet. */
  resultErrors: FieldError[] | null;
  engineVersion: string;
  /** SHA-256 (hex) of the canonical JSON of `data`. */
  dataHash: string;
  meta: StudyMeta;
  author: UserRef;
  /** Everyone who changed the data. */
  editorIds: string[];
  copiedFromId: string | null;
  lockVersion: number;
  createdAt: string;
  updatedAt: string;
  submittedAt: string | null;
  approvedAt: string | null;
}

export type StudySummaryDto = Omit<StudyDto, 'data' | 'result'> & {
  /** The verdict on the criteria; null without a result or criteria. */
  verdictPass: boolean | null;
};

/** Paged by `cursor` (keyset); the list rows carry no data or result. */
export type StudyPageDto = KeysetPage<StudySummaryDto>;

export const STUDY_SORTS = ['updatedAt', 'createdAt', 'title', 'status'] as const;
export type StudySort = (typeof STUDY_SORTS)[number];

export const IMPORT_SECTIONS = ['standards', 'blanks', 'recovery', 'precision', 'accuracy', 'unknowns', 'lowSpikes'] as const;
export type ImportSection = (typeof IMPORT_SECTIONS)[number];

export interface ImportPreviewDto {
  section: ImportSection;
  /** Column headers of the file. */
  columns: string[];
  /** Target field → column header, as the server used it. */
  mapping: Record<string, string>;
  /** The section in the study format (lowSpikes: one object). */
  rows: unknown[];
  /** Per row and column, e.g. rows[3].y; a real import with any error saves nothing. */
  errors: FieldError[];
  /** Data rows read from the file. */
  rowCount: number;
}
