import type { Role } from '../roles.js';
import type { StudySection, StudyStatus } from './studies.js';
import type { ReviewQueueEntryDto } from '../run-status.js';

export type SignatureMeaning = 'authored' | 'reviewed-and-approved' | 'released';

/** Review and sign-off answers of the API, shared by the server and the browser. */

export type FieldChanges = Record<string, { from: unknown; to: unknown }>;

export interface SignatureDto {
  id: string;
  signerId: string;
  signerName: string;
  signerRole: Role;
  meaning: SignatureMeaning;
  signedAt: string;
  contentHash: string;
  comment: string | null;
  /** Why the signer approved although the study does not meet all its criteria. */
  justification?: string | null;
  /** The content this signature covers still hashes to `contentHash`. */
  valid: boolean;
  /** Part of a submission that was returned or resubmitted: checked against the content signed then, not the current data. */
  superseded: boolean;
}

export interface CommentDto {
  id: string;
  section: StudySection;
  threadId: string | null;
  authorId: string;
  authorName: string;
  body: string;
  resolved: boolean;
  createdAt: string;
}

export type HistoryKind = 'status' | 'signature' | 'comment' | 'record';

export interface HistoryItemDto {
  id: string;
  at: string;
  kind: HistoryKind;
  action: string;
  actorName: string;
  summary: string;
  detail: string | null;
  changes: FieldChanges | null;
  /** Each change of the entry in words, before and after (data, title and record fields). */
  lines?: string[];
  valid?: boolean;
}

export interface RowChange {
  /** Row identifier: the row's own `id` (or `group`) when it has one, else its position from 1. */
  key: string;
  field: string;
  from: unknown;
  to: unknown;
}

export interface SectionDiff {
  section: string;
  added: { key: string; row: unknown }[];
  removed: { key: string; row: unknown }[];
  changed: RowChange[];
}

export interface StudyDiffDto {
  from: { signatureId: string; signedAt: string };
  to: { signatureId: string; signedAt: string };
  settings: { field: string; from: unknown; to: unknown }[];
  sections: SectionDiff[];
  /** Title, conclusion and other record fields that changed (`title`, `conclusion`, `instrument`…); empty for submissions made before they were kept. */
  meta: { field: string; from: unknown; to: unknown }[];
}

export type ReviewStage = 'review' | 'release';

/** What every entry of the review queue shows, a study or a routine run. */
export interface QueueEntryBase {
  id: string;
  title: string;
  methodId: string;
  methodName: string;
  methodVersionId: string;
  methodVersionNumber: number;
  authorId: string;
  authorName: string;
  submittedAt: string | null;
  lockVersion: number;
}

export interface QueueItemDto extends QueueEntryBase {
  status: StudyStatus;
  stage: ReviewStage;
}

export interface TransitionResultDto {
  id: string;
  status: StudyStatus;
  stage: ReviewStage | null;
  lockVersion: number;
  submittedAt: string | null;
  approvedAt: string | null;
  signature: SignatureDto | null;
}

/**
 * The caller's review queue, studies first, each kind oldest first, paged forward by cursor: who may act on an
 * entry is decided row by row, so the queue tells whether more pages follow (nextCursor) but counts nothing.
 */
export interface ReviewQueuePageDto {
  items: ReviewQueueEntryDto[];
  /** null on the last page. */
  nextCursor: string | null;
  pageSize: number;
}
