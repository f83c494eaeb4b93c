import {
  type EvaluationResult,
  type FieldError,
  type MethodVersionSettings,
  type SignatureMeaning,
  STUDY_STATUS_LABELS,
  type StudyInput,
  type StudyStatus,
  type TransitionResultDto,
} from '@meritline/shared';
import type { CriterionDefinition } from '@/components/study-results';

/** The study as GET /studies/:id gives it: only what the read-only view uses. */
export interface StudyView {
  id: string;
  title: string;
  status: StudyStatus;
  method: { id: string; name: string; analyte: string; matrix: string; technique: string; xUnit: string; yUnit: string };
  methodVersion: {
    id: string;
    number: number;
    status: 'draft' | 'active' | 'retired';
    criteria: CriterionDefinition[];
    settings: MethodVersionSettings;
  };
  data: StudyInput;
  result: EvaluationResult | null;
  resultErrors: FieldError[] | null;
  engineVersion: string;
  meta: { instrument?: string; startedOn?: string; finishedOn?: string; conclusion?: string };
  author: { id: string; name: string };
  editorIds: string[];
  copiedFromId: string | null;
  lockVersion: number;
  submittedAt: string | null;
  approvedAt: string | null;
}

export type {
  SignatureDto as Signature,
  CommentDto as StudyComment,
  HistoryItemDto as HistoryItem,
  StudyDiffDto as StudyDiff,
  QueueItemDto as QueueItem,
  ReviewStage,
} from '@meritline/shared';
export type TransitionResult = Omit<TransitionResultDto, 'submittedAt' | 'approvedAt'>;

export interface ReviewQueueParams {
  kind?: 'study' | 'run';
  cursor?: string;
  pageSize: number;
}

export const STATUS_LABELS: Record<StudyStatus, string> = STUDY_STATUS_LABELS;

export const MEANING_LABELS: Record<SignatureMeaning, string> = {
  authored: 'Author: submitted for review',
  'reviewed-and-approved': 'Reviewer: reviewed and approved',
  released: 'Quality manager: released',
};
