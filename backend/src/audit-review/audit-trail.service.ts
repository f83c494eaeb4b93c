import { ForbiddenException, Injectable, NotFoundException, UnauthorizedException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { Brackets, DataSource, type SelectQueryBuilder } from 'typeorm';
import {
  AUDIT_ACTION_LABELS,
  AUDIT_EXPORT_MAX_ENTRIES,
  AUDIT_RECORD_KIND_LABELS,
  auditActionLabel,
  auditChangesInWords,
  auditEntityLabel,
  hasAnyRole,
  Role,
  type AuditPersonDto,
  type AuditRecordKind,
  type AuditReviewDto,
  type AuditTrailEntryDto,
  type AuditTrailPageDto,
} from '@meritline/shared';
import { AuditEntry } from '../audit/audit-entry.entity.js';
import { createdFields, AuditService } from '../audit/audit.service.js';
import { AuthService } from '../auth/auth.service.js';
import type { AuthUser } from '../common/decorators/current-user.decorator.js';
import { cappedCount } from '../common/keyset.js';
import { unprocessable } from '../common/validation.js';
import { writeTransaction } from '../database/write-transaction.js';
import { AuditReview } from './audit-review.entity.js';
import { RECORD_PATTERN, type AuditTrailQueryDto } from './dto/audit-trail-query.dto.js';
import type { CreateAuditReviewDto } from './dto/create-audit-review.dto.js';

export const WRONG_REVIEW_PASSWORD = 'Password not correct; nothing was signed.';
const DEFAULT_PAGE_SIZE = 50;
const DAY_MS = 86_400_000;

export interface RecordRef {
  kind: AuditRecordKind;
  id: string;
}

const RECORD_TABLES: Record<AuditRecordKind, string> = {
  study: 'validation_studies',
  'method-version': 'method_versions',
  run: 'runs',
  user: 'users',
  report: 'validation_reports',
};

const text = (column: string) => `CAST(${column} AS varchar)`;

export const isQualityOversight = (user: AuthUser) => hasAnyRole(user.roles, [Role.QualityManager, Role.Admin]);

export function parseRecord(value: string | undefined): RecordRef | null {
  const match = value ? RECORD_PATTERN.exec(value) : null;
  return match ? { kind: match[1] as AuditRecordKind, id: match[2].toLowerCase() } : null;
}

/** A calendar day (UTC) as the start of that day, or a 422 naming the field. */
function dayStart(value: string, field: string): Date {
  const date = new Date(`${value}T00:00:00.000Z`);
  if (Number.isNaN(date.getTime()) || date.toISOString().slice(0, 10) !== value) {
    throw unprocessable([{ field, code: 'invalid_date', message: 'This day does not exist.' }]);
  }
  return date;
}

export function toEntryDto(entry: AuditEntry, names: Record<string, string> = {}): AuditTrailEntryDto {
  return {
    seq: entry.seq,
    at: entry.at.toISOString(),
    actorId: entry.actorId,
    actorName: entry.actorName,
    action: entry.action,
    actionText: auditActionLabel(entry.action),
    entity: entry.entity,
    entityId: entry.entityId,
    recordText: auditEntityLabel(entry.entity),
    changes: entry.changes,
    changesInWords: auditChangesInWords(entry.changes, names),
    reason: entry.reason,
  };
}

/**
 * Reading the audit trail: filters, paging by sequence number, and the scope of each reader. Quality managers and
 * administrators read everything; analysts and reviewers only the trail of the records they can open.
 */
@Injectable()
export class AuditTrailService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly audit: AuditService,
    private readonly auth: AuthService,
  ) {}

  async page(query: AuditTrailQueryDto, user: AuthUser): Promise<AuditTrailPageDto> {
    if (query.cursor !== undefined && query.page !== undefined) {
      throw unprocessable([{ field: 'page', code: 'conflict', message: 'Page either by cursor or by page number, not both.' }]);
    }
    const pageSize = query.pageSize ?? DEFAULT_PAGE_SIZE;
    const record = parseRecord(query.record);
    const qb = await this.filtered(query, user);
    const { total, totalIsCapped } = await cappedCount(qb);
    if (query.cursor !== undefined) qb.andWhere('a.seq < :cursor', { cursor: query.cursor });
    if (query.page !== undefined) qb.skip((query.page - 1) * pageSize);
    const rows = await qb
      .orderBy('a.seq', 'DESC')
      .take(pageSize + 1)
      .getMany();
    const items = rows.slice(0, pageSize);
    const names = await this.namesOf(items);
    return {
      items: items.map((entry) => toEntryDto(entry, names)),
      total,
      totalIsCapped,
      nextCursor: rows.length > pageSize ? items[items.length - 1].seq : null,
      page: query.page ?? null,
      pageSize,
      record: record ? { ...record, name: await this.recordName(record) } : null,
    };
  }

  /** Titles and names of the studies, method versions and users that entries refer to by id, so values read as words. */
  async namesOf(entries: AuditEntry[]): Promise<Record<string, string>> {
    const ids = new Set<string>();
    for (const entry of entries) {
      for (const [field, change] of Object.entries(entry.changes ?? {})) {
        if (!/Id$/.test(field)) continue;
        for (const value of [change?.from, change?.to]) if (typeof value === 'string' && /^[0-9a-f-]{36}$/i.test(value)) ids.add(value);
      }
    }
    if (!ids.size) return {};
    const list = [...ids];
    const names: Record<string, string> = {};
    const studies = await this.dataSource
      .createQueryBuilder()
      .select(text('s.id'), 'id')
      .addSelect('s.title', 'name')
      .from('validation_studies', 's')
      .where(`${text('s.id')} IN (:...list)`, { list })
      .getRawMany<{ id: string; name: string }>();
    for (const row of studies) names[row.id] = `“${row.name}”`;
    const versions = await this.dataSource
      .createQueryBuilder()
      .select(text('v.id'), 'id')
      .addSelect(`m.name || ', version ' || ${text('v.number')}`, 'name')
      .from('method_versions', 'v')
      .innerJoin('methods', 'm', 'm.id = v.method_id')
      .where(`${text('v.id')} IN (:...list)`, { list })
      .getRawMany<{ id: string; name: string }>();
    for (const row of versions) names[row.id] = row.name;
    return names;
  }

  /** The people who acted in the part of the trail the reader may see, by name. */
  async people(user: AuthUser): Promise<AuditPersonDto[]> {
    const rows = await (
      await this.filtered({}, user)
    )
      .select('a.actor_id', 'id')
      .addSelect('MAX(a.actor_name)', 'name')
      .andWhere('a.actor_id IS NOT NULL')
      .groupBy('a.actor_id')
      .getRawMany<AuditPersonDto>();
    return rows.sort((a, b) => a.name.localeCompare(b.name));
  }

  /** Every matching entry, oldest first, for an export; refuses beyond the export bound rather than cutting silently. */
  async entriesForExport(query: AuditTrailQueryDto, user: AuthUser): Promise<AuditEntry[]> {
    const qb = await this.filtered(query, user);
    const total = await qb.clone().getCount();
    if (total > AUDIT_EXPORT_MAX_ENTRIES) {
      throw unprocessable(
        [
          {
            field: 'from',
            code: 'too_many',
            message: `Narrow the filters: ${total} entries match, an export holds at most ${AUDIT_EXPORT_MAX_ENTRIES}.`,
          },
        ],
        'Too many entries for one export.',
      );
    }
    return qb.orderBy('a.seq', 'ASC').getMany();
  }

  /** Words for the filters of an export, printed on its first page. */
  async describeFilters(query: AuditTrailQueryDto): Promise<[string, string][]> {
    const rows: [string, string][] = [];
    const record = parseRecord(query.record);
    if (record) rows.push(['Record', `${AUDIT_RECORD_KIND_LABELS[record.kind]} “${await this.recordName(record)}”`]);
    if (query.user) {
      rows.push(['Person', await this.recordName({ kind: 'user', id: query.user })]);
    }
    if (query.action) rows.push(['Action', auditActionLabel(query.action)]);
    if (query.from || query.to) rows.push(['Period (UTC)', `${query.from ?? 'the first entry'} to ${query.to ?? 'today'}`]);
    if (query.q) rows.push(['Text', `“${query.q}”`]);
    if (!rows.length) rows.push(['Filters', 'None: the whole trail']);
    return rows;
  }

  /** A printable name of a record: its title, version or name. */
  async recordName(record: RecordRef): Promise<string> {
    const qb = this.dataSource.createQueryBuilder();
    switch (record.kind) {
      case 'study':
        qb.select('r.title', 'name').from('validation_studies', 'r');
        break;
      case 'run':
        qb.select('r.title', 'name').from('runs', 'r');
        break;
      case 'user':
        qb.select('r.name', 'name').from('users', 'r');
        break;
      case 'method-version':
        qb.select(`m.name || ', version ' || ${text('r.number')}`, 'name')
          .from('method_versions', 'r')
          .innerJoin('methods', 'm', 'm.id = r.method_id');
        break;
      case 'report':
        qb.select(`'report of ' || s.title`, 'name')
          .from('validation_reports', 'r')
          .innerJoin('validation_studies', 's', 's.id = r.study_id');
        break;
    }
    const row = await qb.where(`${text('r.id')} = :id`, { id: record.id }).getRawOne<{ name: string }>();
    return row?.name ?? 'unknown record';
  }

  async assertCanRead(record: RecordRef, user: AuthUser): Promise<void> {
    const exists = await this.dataSource
      .createQueryBuilder()
      .select('1')
      .from(RECORD_TABLES[record.kind], 'r')
      .where(`${text('r.id')} = :id`, { id: record.id })
      .getRawOne();
    if (!exists) throw new NotFoundException(`${AUDIT_RECORD_KIND_LABELS[record.kind]} not found.`);
    if (isQualityOversight(user)) return;
    const params = this.scopeParams(user);
    const open = (() => {
      switch (record.kind) {
        case 'study':
          return `:id IN (${this.studiesOf(user)})`;
        case 'run':
          return `:id IN (${this.runsOf(user)})`;
        case 'report':
          return `:id IN (SELECT ${text('r.id')} FROM validation_reports r WHERE ${text('r.study_id')} IN (${this.studiesOf(user)}))`;
        case 'user':
          return ':id = :me';
        case 'method-version':
          return null;
      }
    })();
    const allowed = open
      ? await this.dataSource
          .createQueryBuilder()
          .select('1')
          .from('users', 'u')
          .where(`${text('u.id')} = :me`)
          .andWhere(open)
          .setParameters({ ...params, id: record.id })
          .getRawOne()
      : null;
    if (!allowed) throw new ForbiddenException('You can read the audit trail only of the records you work on.');
  }

  private async filtered(query: AuditTrailQueryDto, user: AuthUser): Promise<SelectQueryBuilder<AuditEntry>> {
    const qb = this.dataSource.getRepository(AuditEntry).createQueryBuilder('a');
    const record = parseRecord(query.record);
    if (record) {
      await this.assertCanRead(record, user);
      qb.andWhere(this.recordCondition(record), { recordId: record.id });
    } else if (!isQualityOversight(user)) {
      qb.andWhere(this.scopeCondition(user), this.scopeParams(user));
    }
    if (query.user) qb.andWhere('a.actor_id = :actorId', { actorId: query.user });
    if (query.action) qb.andWhere('a.action = :action', { action: query.action });
    const from = query.from ? dayStart(query.from, 'from') : null;
    const to = query.to ? dayStart(query.to, 'to') : null;
    if (from && to && from > to) {
      throw unprocessable([{ field: 'to', code: 'before_start', message: 'The last day comes before the first day.' }]);
    }
    if (from) qb.andWhere('a.at >= :from', { from });
    if (to) qb.andWhere('a.at < :until', { until: new Date(to.getTime() + DAY_MS) });
    const q = query.q?.trim().toLowerCase();
    if (q) {
      const like = `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
      const actions = Object.entries(AUDIT_ACTION_LABELS)
        .filter(([, label]) => label.toLowerCase().includes(q))
        .map(([code]) => code);
      qb.andWhere(
        new Brackets((w) => {
          w.where("LOWER(a.actor_name) LIKE :like ESCAPE '\\'", { like })
            .orWhere("LOWER(a.reason) LIKE :like ESCAPE '\\'")
            .orWhere("LOWER(a.changes) LIKE :like ESCAPE '\\'");
          if (actions.length) w.orWhere('a.action IN (:...actions)', { actions });
        }),
      );
    }
    return qb;
  }

  /** A study's trail includes its review comments, signatures and issued report. */
  private recordCondition(record: RecordRef): string {
    const entity = { study: 'study', 'method-version': 'method-version', run: 'run', user: 'user', report: 'validation-report' }[
      record.kind
    ];
    const own = `(a.entity = '${entity}' AND a.entity_id = :recordId)`;
    if (record.kind !== 'study') return own;
    const related = (table: string, entityName: string) =>
      `(a.entity = '${entityName}' AND a.entity_id IN (SELECT ${text('x.id')} FROM ${table} x WHERE ${text('x.study_id')} = :recordId))`;
    return `(${own} OR ${related('study_comments', 'study-comment')} OR ${related('study_signatures', 'study-signature')} OR ${related('validation_reports', 'validation-report')})`;
  }

  private scopeParams(user: AuthUser) {
    return { me: user.id, meLike: `%"${user.id}"%` };
  }

  /** The studies a reader can open: their own and those they edited; for a reviewer also those awaiting review and those they reviewed. */
  private studiesOf(user: AuthUser): string {
    const reviewer = user.roles.includes(Role.Reviewer)
      ? ` OR s.status = 'submitted'` +
        ` OR ${text('s.id')} IN (SELECT ${text('g.study_id')} FROM study_signatures g WHERE ${text('g.signer_id')} = :me)` +
        ` OR ${text('s.id')} IN (SELECT ${text('c.study_id')} FROM study_comments c WHERE ${text('c.author_id')} = :me)`
      : '';
    return `SELECT ${text('s.id')} FROM validation_studies s WHERE ${text('s.author_id')} = :me OR s.editor_ids LIKE :meLike${reviewer}`;
  }

  /** The runs a reader can open: their own; for a reviewer also those awaiting review and those they signed. */
  private runsOf(user: AuthUser): string {
    const reviewer = user.roles.includes(Role.Reviewer)
      ? ` OR r.review_status = 'submitted' OR ${text('r.id')} IN (SELECT ${text('g.run_id')} FROM run_signatures g WHERE ${text('g.signer_id')} = :me)`
      : '';
    return `SELECT ${text('r.id')} FROM runs r WHERE ${text('r.author_id')} = :me${reviewer}`;
  }

  private scopeCondition(user: AuthUser): string {
    const studies = this.studiesOf(user);
    const related = (table: string, entityName: string) =>
      `(a.entity = '${entityName}' AND a.entity_id IN (SELECT ${text('x.id')} FROM ${table} x WHERE ${text('x.study_id')} IN (${studies})))`;
    return [
      `(a.entity = 'study' AND a.entity_id IN (${studies}))`,
      related('study_comments', 'study-comment'),
      related('study_signatures', 'study-signature'),
      related('validation_reports', 'validation-report'),
      `(a.entity = 'run' AND a.entity_id IN (${this.runsOf(user)}))`,
      `(a.entity = 'user' AND a.entity_id = :me)`,
    ].join(' OR ');
  }

  async reviews(limit = 20): Promise<AuditReviewDto[]> {
    const rows = await this.dataSource.getRepository(AuditReview).find({ order: { reviewedAt: 'DESC' }, take: limit });
    return rows.map(toReviewDto);
  }

  /** A signed statement that a period or a record was reviewed, with the chain checked at that moment. */
  async review(dto: CreateAuditReviewDto, actor: AuthUser): Promise<AuditReviewDto> {
    const query: AuditTrailQueryDto = {};
    let subject: string;
    let record: RecordRef | null = null;
    if (dto.scope === 'period') {
      const missing = (['periodFrom', 'periodTo'] as const).filter((field) => !dto[field]);
      if (missing.length) {
        throw unprocessable(
          missing.map((field) => ({ field, code: 'required', message: 'Give the first and the last day of the period.' })),
        );
      }
      query.from = dto.periodFrom;
      query.to = dto.periodTo;
      subject = `Entries of ${dto.periodFrom} to ${dto.periodTo} (UTC)`;
    } else {
      record = parseRecord(dto.record);
      if (!record) throw unprocessable([{ field: 'record', code: 'required', message: 'Name the record that was reviewed.' }]);
      query.record = dto.record;
      subject = `${AUDIT_RECORD_KIND_LABELS[record.kind]} “${await this.recordName(record)}”`;
    }
    const matching = await (await this.filtered(query, actor)).getCount();
    if (!(await this.auth.verifyPassword(actor.id, dto.password))) {
      await this.audit.signatureRefused(actor, { entity: 'audit-review', entityId: null, meaning: 'audit trail reviewed' });
      throw new UnauthorizedException(WRONG_REVIEW_PASSWORD);
    }
    const verification = await this.audit.verify();
    return writeTransaction(this.dataSource, async (manager) => {
      const [last] = await manager.getRepository(AuditEntry).find({ order: { seq: 'DESC' }, take: 1, select: { seq: true } });
      const repo = manager.getRepository(AuditReview);
      const review = await repo.save(
        repo.create({
          scope: dto.scope,
          periodFrom: dto.scope === 'period' ? (dto.periodFrom ?? null) : null,
          periodTo: dto.scope === 'period' ? (dto.periodTo ?? null) : null,
          recordKind: record?.kind ?? null,
          recordId: record?.id ?? null,
          subject: subject.slice(0, 300),
          reviewerId: actor.id,
          reviewerName: actor.name,
          reviewedAt: new Date(),
          comment: dto.comment?.trim() || null,
          lastSeq: last?.seq ?? 0,
          entries: matching,
          chainIntact: verification.ok,
        }),
      );
      await this.audit.record(
        {
          actor,
          action: 'audit.reviewed',
          entity: 'audit-review',
          entityId: review.id,
          changes: createdFields({
            record: subject,
            entries: matching,
            lastSeq: review.lastSeq,
            chainIntact: verification.ok,
          }),
          reason: review.comment,
        },
        manager,
      );
      return toReviewDto(review);
    });
  }
}

function toReviewDto(review: AuditReview): AuditReviewDto {
  return {
    id: review.id,
    scope: review.scope,
    periodFrom: review.periodFrom,
    periodTo: review.periodTo,
    recordKind: review.recordKind,
    recordId: review.recordId,
    subject: review.subject,
    reviewerId: review.reviewerId,
    reviewerName: review.reviewerName,
    reviewedAt: review.reviewedAt.toISOString(),
    comment: review.comment,
    lastSeq: review.lastSeq,
    entries: review.entries,
    chainIntact: review.chainIntact,
  };
}
