import { Injectable } from '@nestjs/common';
import {
  describeStudyChange,
  STUDY_SECTION_LABELS,
  type FieldChanges,
  type HistoryItemDto,
  type SignatureMeaning,
  type StudyDiffDto,
} from '@meritline/shared';
import { AuditService } from '../audit/audit.service.js';
import { CommentsService } from './comments.service.js';
import { ReviewsService } from './reviews.service.js';
import { toSignatureDtos } from './signatures.js';
import { diffStudyData, diffStudyMeta } from './study-diff.js';

const ACTION_WORDS: Record<string, string> = {
  'study.created': 'Study created',
  'study.updated': 'Study changed',
  'study.point-excluded': 'Point excluded from the calculations',
  'study.point-included': 'Point included in the calculations again',
  'study.imported': 'Section imported from a file',
  'study.reassigned': 'Assigned to another analyst',
  'study.submitted': 'Submitted for review',
  'study.returned': 'Returned to the author for changes',
  'study.review-approved': 'Reviewed and approved; awaiting release by a quality manager',
  'study.approved': 'Approved',
  'study.released': 'Released by a quality manager; approved',
  'signature.failed': 'Signature refused: password not correct',
};

const MEANING_WORDS: Record<SignatureMeaning, string> = {
  authored: 'Signed as author',
  'reviewed-and-approved': 'Signed as reviewer: reviewed and approved',
  released: 'Signed as quality manager: released',
};

const UNSAID = new Set(['status', 'dataHash', 'meta', 'authorId', 'methodVersionId', 'copiedFromId']);

/** The entry's changes in words; the whole-record `meta` pair of older entries is told field by field. */
function changeLines(changes: FieldChanges | null): string[] {
  if (!changes) return [];
  const entries = Object.entries(changes);
  const meta = changes.meta;
  const metaEntries =
    isRecord(meta?.from) || isRecord(meta?.to)
      ? diffStudyMeta(isRecord(meta.from) ? meta.from : {}, isRecord(meta.to) ? meta.to : {}).map((m) => [`meta.${m.field}`, m] as const)
      : [];
  return [...entries.filter(([path]) => !UNSAID.has(path)), ...metaEntries].flatMap(([path, change]) => {
    const line = describeStudyChange(path, change.from, change.to);
    return line ? [line] : [];
  });
}

const isRecord = (value: unknown): value is Record<string, unknown> => typeof value === 'object' && value !== null && !Array.isArray(value);

@Injectable()
export class StudyHistoryService {
  constructor(
    private readonly reviews: ReviewsService,
    private readonly comments: CommentsService,
    private readonly audit: AuditService,
  ) {}

  /** States, signatures, comments and the study's own audit entries on one time line, oldest first. */
  async history(studyId: string): Promise<HistoryItemDto[]> {
    const study = await this.reviews.findStudy(studyId);
    const [entries, signatures, comments] = await Promise.all([
      this.audit.list({ entity: 'study', entityId: study.id, limit: 5000 }),
      this.reviews.signaturesOf(study.id),
      this.comments.find(study.id),
    ]);
    const items: HistoryItemDto[] = [
      // Oldest first, so that entries written in the same millisecond keep the order they were made in.
      ...[...entries].reverse().map((entry): HistoryItemDto => ({
        id: `audit-${entry.seq}`,
        at: entry.at.toISOString(),
        kind: entry.changes?.status ? 'status' : 'record',
        action: entry.action,
        actorName: entry.actorName,
        summary: ACTION_WORDS[entry.action] ?? entry.action.replace(/[.-]/g, ' '),
        detail: entry.reason,
        changes: entry.changes,
        lines: changeLines(entry.changes),
      })),
      ...toSignatureDtos(signatures, study).map((signature): HistoryItemDto => ({
        id: `signature-${signature.id}`,
        at: signature.signedAt,
        kind: 'signature',
        action: `signature.${signature.meaning}`,
        actorName: signature.signerName,
        summary: MEANING_WORDS[signature.meaning],
        detail: signature.comment,
        changes: null,
        valid: signature.valid,
      })),
      ...comments.map((comment): HistoryItemDto => ({
        id: `comment-${comment.id}`,
        at: comment.createdAt.toISOString(),
        kind: 'comment',
        action: comment.threadId ? 'comment.reply' : 'comment.created',
        actorName: comment.authorName,
        summary: `${comment.threadId ? 'Reply' : 'Comment'} on ${STUDY_SECTION_LABELS[comment.section] ?? comment.section}`,
        detail: comment.body,
        changes: null,
      })),
    ];
    return items.sort((a, b) => a.at.localeCompare(b.at));
  }

  /** The data of the last two submissions compared; null until the study has been submitted twice. */
  async diff(studyId: string): Promise<StudyDiffDto | null> {
    const study = await this.reviews.findStudy(studyId);
    const submissions = (await this.reviews.signaturesOf(study.id)).filter((s) => s.meaning === 'authored' && s.dataSnapshot);
    if (submissions.length < 2) return null;
    const [before, after] = submissions.slice(-2);
    return {
      from: { signatureId: before.id, signedAt: before.signedAt.toISOString() },
      to: { signatureId: after.id, signedAt: after.signedAt.toISOString() },
      ...diffStudyData(before.dataSnapshot!, after.dataSnapshot!),
      meta: before.metaSnapshot && after.metaSnapshot ? diffStudyMeta(before.metaSnapshot, after.metaSnapshot) : [],
    };
  }
}
