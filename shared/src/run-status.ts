import type { QueueEntryBase, QueueItemDto } from './api/reviews.js';
import type { Role } from './roles.js';

/** A run's check-standard verdict. */
export type RunStatus = 'accepted' | 'rejected';

/** Where a routine run stands in its second-person release (its check-standard verdict is separate: accepted or rejected). */
export enum RunReviewStatus {
  Calculated = 'calculated',
  Submitted = 'submitted',
  Returned = 'returned',
  Released = 'released',
  Superseded = 'superseded',
}

export const RUN_REVIEW_STATUSES = Object.values(RunReviewStatus);

export const RUN_REVIEW_STATUS_LABELS: Record<RunReviewStatus, string> = {
  [RunReviewStatus.Calculated]: 'Calculated',
  [RunReviewStatus.Submitted]: 'Submitted for review',
  [RunReviewStatus.Returned]: 'Returned for changes',
  [RunReviewStatus.Released]: 'Reviewed and released',
  [RunReviewStatus.Superseded]: 'Replaced by a correction',
};

export type RunSignatureMeaning = 'performed' | 'reviewed-and-released';

export const RUN_SIGNATURE_MEANING_LABELS: Record<RunSignatureMeaning, string> = {
  performed: 'Performed',
  'reviewed-and-released': 'Reviewed and released',
};

export interface RunSignatureDto {
  id: string;
  signerId: string;
  signerName: string;
  signerRole: Role;
  meaning: RunSignatureMeaning;
  signedAt: string;
  contentHash: string;
  /** The signed content still matches the run as stored. */
  valid: boolean;
}

export interface RunReviewDto {
  runId: string;
  reviewStatus: RunReviewStatus;
  lockVersion: number;
  authorId: string;
  submittedAt: string | null;
  releasedAt: string | null;
  returnComment: string | null;
  supersedesId: string | null;
  supersededById: string | null;
  /** Why the correction run replaced the released one (kept on both). */
  supersedeReason: string | null;
  signatures: RunSignatureDto[];
}

export interface RunQueueItemDto extends QueueEntryBase {
  kind: 'run';
  status: RunReviewStatus;
  /** The check-standard verdict. */
  verdict: 'accepted' | 'rejected';
}

export type ReviewQueueKind = 'study' | 'run';

export type ReviewQueueEntryDto = (QueueItemDto & { kind: 'study' }) | RunQueueItemDto;
