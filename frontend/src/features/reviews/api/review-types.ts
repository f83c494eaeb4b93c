import type { EvaluationResult, FieldError, MethodVersionSettings, Role, SignatureMeaning, StudyInput, StudySection, StudyStatus } from '@meritline/shared';
import type { CriterionDefinition } from '@/components/study-results';

/** The study as GET /studies/:id gives it: only what the read-only view uses. */
export interface StudyView {
  id: string;
  title: string;
  status: StudyStatus;
  method: { id: string; name: string; analyte: string; matrix: string; technique: string; xUnit: string; yUnit: string };
  methodVersion: { id: string; number: number; status: 'draft' | 'active' | 'retired'; criteria: CriterionDefinition[]; settings: MethodVersionSettings };
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

export interface Signature {
  id: string;
  signerId: string;
  signerName: string;
  signerRole: Role;
  meaning: SignatureMeaning;
  signedAt: string;
  contentHash: string;
  comment: string | null;
  valid: boolean;
  superseded: boolean;
}

export interface StudyComment {
  id: string;
  section: StudySection;
  threadId: string | null;
  authorId: string;
  authorName: string;
  body: string;
  resolved: boolean;
  createdAt: string;
}

export interface HistoryItem {
  id: string;
  at: string;
  kind: 'status' | 'signature' | 'comment' | 'record';
  action: string;
  actorName: string;
  summary: string;
  detail: string | null;
  changes: Record<string, { from: unknown; to: unknown }> | null;
  valid?: boolean;
}

export interface StudyDiff {
  from: { signatureId: string; signedAt: string };
  to: { signatureId: string; signedAt: string };
  settings: { field: string; from: unknown; to: unknown }[];
  sections: {
    section: string;
    added: { key: string; row: unknown }[];
    removed: { key: string; row: unknown }[];
    changed: { key: string; field: string; from: unknown; to: unknown }[];
  }[];
}

export type ReviewStage = 'review' | 'release';

export interface QueueItem {
  id: string;
  title: string;
  status: StudyStatus;
  stage: ReviewStage;
  methodId: string;
  methodName: string;
  methodVersionId: string;
  methodVersionNumber: number;
  authorId: string;
  authorName: string;
  submittedAt: string | null;
  lockVersion: number;
}

export interface TransitionResult {
  id: string;
  status: StudyStatus;
  stage: ReviewStage | null;
  lockVersion: number;
  signature: Signature | null;
}

export const SECTION_LABELS: Record<StudySection, string> = {
  setup: 'Setup',
  standards: 'Standards',
  blanks: 'Blanks',
  recovery: 'Recovery',
  precision: 'Precision',
  results: 'Results',
  conclusion: 'Conclusion',
};

export const STATUS_LABELS: Record<StudyStatus, string> = {
  draft: 'Draft',
  submitted: 'Awaiting review',
  returned: 'Returned for changes',
  approved: 'Approved',
};

export const MEANING_LABELS: Record<SignatureMeaning, string> = {
  authored: 'Author: submitted for review',
  'reviewed-and-approved': 'Reviewer: reviewed and approved',
  released: 'Quality manager: released',
};
