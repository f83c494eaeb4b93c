/** The kinds of record whose audit trail can be opened on its own. */
export const AUDIT_RECORD_KINDS = ['study', 'method-version', 'run', 'user', 'report'] as const;
export type AuditRecordKind = (typeof AUDIT_RECORD_KINDS)[number];

export const AUDIT_PAGE_SIZE_MAX = 200;
export const AUDIT_EXPORT_MAX_ENTRIES = 20_000;
export const AUDIT_TEXT_QUERY_MAX = 100;

/** One audit entry as the review screen and exports show it: every code already put into words. */
export interface AuditTrailEntryDto {
  seq: number;
  /** ISO 8601 with its zone (UTC). */
  at: string;
  actorId: string | null;
  /** The printed name of the person (or of the service) that acted. */
  actorName: string;
  action: string;
  actionText: string;
  entity: string;
  entityId: string | null;
  /** What kind of record the entry is about, in words. */
  recordText: string;
  /** The stored changes, field by field, for programs. */
  changes: Record<string, { from: unknown; to: unknown }> | null;
  /** The same changes in words: what was there before and after. */
  changesInWords: { field: string; from: string; to: string }[];
  reason: string | null;
}

export interface AuditTrailPageDto {
  items: AuditTrailEntryDto[];
  /** Entries matching the filters over every page, counted up to LIST_COUNT_CAP; when `totalIsCapped`, at least this many. */
  total: number;
  totalIsCapped: boolean;
  /** Pass as `cursor` for the next (older) page; null on the last page. */
  nextCursor: number | null;
  page: number | null;
  pageSize: number;
  /** The record filtered on, with its printable name. */
  record: { kind: AuditRecordKind; id: string; name: string } | null;
}

/** A person who appears in the trail the reader may see, for the person filter. */
export interface AuditPersonDto {
  id: string;
  name: string;
}

export interface AuditBreakDto {
  seq: number;
  reason: string;
}

export type AuditVerificationDto =
  { ok: true; rows: number } | { ok: false; rows: number; brokenAt: number; reason: string; broken: AuditBreakDto[] };

export type AuditReviewScope = 'period' | 'record';

export interface AuditReviewDto {
  id: string;
  scope: AuditReviewScope;
  /** For a period: the first and last day reviewed (inclusive, YYYY-MM-DD). */
  periodFrom: string | null;
  periodTo: string | null;
  recordKind: AuditRecordKind | null;
  recordId: string | null;
  /** Words for what was reviewed, e.g. "Entries of 1 to 30 November 2026". */
  subject: string;
  reviewerId: string;
  reviewerName: string;
  reviewedAt: string;
  comment: string | null;
  /** The newest entry that existed when the review was signed. */
  lastSeq: number;
  entries: number;
  /** Whether the chain checked intact at signing. */
  chainIntact: boolean;
}

export interface CreateAuditReviewRequest {
  scope: AuditReviewScope;
  periodFrom?: string;
  periodTo?: string;
  record?: string;
  comment?: string;
  password: string;
}
