import { ConflictException, ForbiddenException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, type EntityManager, type SelectQueryBuilder } from 'typeorm';
import type { QueryDeepPartialEntity } from 'typeorm/query-builder/QueryPartialEntity.js';
import { canonicalJson, Role, type FieldError, type ImportSection, type StudyMeta } from '@meritline/shared';
import type { FieldChanges } from '../audit/audit-entry.entity.js';
import { AuditService, type AuditRecord } from '../audit/audit.service.js';
import type { AuthUser } from '../common/decorators/current-user.decorator.js';
import { decodeCursor, keysetPage } from '../common/keyset.js';
import { unprocessable } from '../common/validation.js';
import type { CriterionDto } from '../methods/dto/criterion.dto.js';
import { MethodVersion } from '../methods/method-version.entity.js';
import { writeTransaction } from '../database/write-transaction.js';
import type { CreateStudyDto } from './dto/create-study.dto.js';
import type { ImportStudyDto } from './dto/import-study.dto.js';
import type { ListStudiesQueryDto } from './dto/list-studies.query.dto.js';
import type { StudyMetaDto } from './dto/study-meta.dto.js';
import type { ImportPreviewDto, StudyDto, StudyPageDto, StudySummaryDto } from './dto/study.dto.js';
import type { ReassignStudyDto } from './dto/reassign-study.dto.js';
import type { UpdateStudyDto } from './dto/update-study.dto.js';
import { PreparationsService } from '../preparations/preparations.service.js';
import { dataChangeEntries, diffStudyMeta } from '../reviews/study-diff.js';
import { User } from '../users/user.entity.js';
import { WorkerPoolService } from '../workers/worker-pool.service.js';
import { withMethodDefaults, type StudyData } from './study-evaluation.js';
import { importSection } from './study-import.js';
import { saveNewStudy } from './study-record.js';
import { newDraftFields, ValidationStudy } from './validation-study.entity.js';

const LOCKED_STATUSES = ['submitted', 'approved'];
const DAY_MS = 86_400_000;

type StudyPatch = Partial<
  Pick<ValidationStudy, 'title' | 'meta' | 'data' | 'result' | 'resultErrors' | 'engineVersion' | 'dataHash' | 'editorIds' | 'authorId'>
>;

const iso = (date: Date | null) => date?.toISOString() ?? null;

export function toStudySummary(study: ValidationStudy): StudySummaryDto {
  const { methodVersion: version, author } = study;
  const { id, name, analyte, matrix, technique, xUnit, yUnit } = version.method;
  return {
    id: study.id,
    title: study.title,
    status: study.status,
    methodVersionId: study.methodVersionId,
    method: { id, name, analyte, matrix, technique, xUnit, yUnit },
    methodVersion: {
      id: version.id,
      number: version.number,
      status: version.status,
      criteria: version.criteria as CriterionDto[],
      settings: version.settings,
    },
    resultErrors: study.resultErrors,
    engineVersion: study.engineVersion,
    dataHash: study.dataHash,
    meta: study.meta,
    author: { id: author.id, name: author.name },
    editorIds: study.editorIds,
    copiedFromId: study.copiedFromId,
    lockVersion: study.lockVersion,
    createdAt: study.createdAt.toISOString(),
    updatedAt: study.updatedAt.toISOString(),
    submittedAt: iso(study.submittedAt),
    approvedAt: iso(study.approvedAt),
    verdictPass: verdictOf(study.result),
  };
}

const verdictOf = (result: Record<string, unknown> | null | undefined): boolean | null =>
  (result as { verdict?: { pass?: boolean | null } } | null | undefined)?.verdict?.pass ?? null;

export function toStudyDto(study: ValidationStudy): StudyDto {
  const { verdictPass: _verdictPass, ...summary } = toStudySummary(study);
  return { ...summary, data: study.data, result: study.result };
}

/** Meta fields given replace the stored ones; an empty or null field clears it. */
function mergeMeta(current: StudyMeta, update: StudyMetaDto | undefined): StudyMeta {
  const merged: Record<string, unknown> = { ...current };
  for (const [key, value] of Object.entries(update ?? {})) {
    if (value === undefined) continue;
    if (value === null || value === '') delete merged[key];
    else merged[key] = value;
  }
  if (merged.startedOn && merged.finishedOn && String(merged.finishedOn) < String(merged.startedOn)) {
    throw unprocessable([{ field: 'meta.finishedOn', code: 'before_start', message: 'The study cannot finish before it starts.' }]);
  }
  return merged as StudyMeta;
}

const changed = (from: unknown, to: unknown) => canonicalJson(from) !== canonicalJson(to);

type ExcludableRow = { excluded?: { reason?: string } };
const EXCLUDABLE_SECTIONS = ['standards', 'blanks', 'recovery', 'precision', 'lowSpikes.spiked', 'lowSpikes.blanks'] as const;
/** The rows of a section by its path (`lowSpikes.spiked`); plain numbers and nulls are rows without an exclusion. */
const rowsOf = (data: StudyData, section: string): (ExcludableRow | number | null)[] => {
  const rows = section.split('.').reduce<unknown>((value, key) => (value as Record<string, unknown> | undefined)?.[key], data);
  return Array.isArray(rows) ? (rows as (ExcludableRow | number | null)[]) : [];
};
const exclusionOf = (row: ExcludableRow | number | null | undefined) =>
  row !== null && typeof row === 'object' ? row.excluded : undefined;

/** One audit entry per row newly excluded (with its reason) or included again, by section and position. */
function exclusionEntries(before: StudyData, after: StudyData, actor: AuthUser, studyId: string): AuditRecord[] {
  return EXCLUDABLE_SECTIONS.flatMap((section) => {
    const old = rowsOf(before, section);
    return rowsOf(after, section).flatMap((row, i): AuditRecord[] => {
      const was = exclusionOf(old[i]);
      const is = exclusionOf(row);
      const entry = { actor, entity: 'study', entityId: studyId };
      const path = `${section}[${i}].excluded`;
      if (is?.reason && !was?.reason)
        return [{ ...entry, action: 'study.point-excluded', changes: { [path]: { from: null, to: is } }, reason: is.reason }];
      if (was?.reason && !is?.reason) return [{ ...entry, action: 'study.point-included', changes: { [path]: { from: was, to: null } } }];
      return [];
    });
  });
}

/** The reason a returned study's change needs: refused with 422 when missing. */
function reasonForReturned(study: ValidationStudy, reason: string | undefined): string | null {
  const text = reason?.trim() ?? '';
  if (study.status === 'returned' && !text) {
    throw unprocessable([
      {
        field: 'reason',
        code: 'required',
        message: 'Say why the study changes after it was returned; the reason is kept with the change.',
      },
    ]);
  }
  return text || null;
}

function replaceSection(data: StudyData, section: ImportSection, rows: unknown[]): StudyData {
  return { ...data, [section]: section === 'lowSpikes' ? rows[0] : rows };
}

function sectionSize(data: StudyData, section: ImportSection): number {
  const value = data[section];
  if (Array.isArray(value)) return value.length;
  return (value as { spiked?: unknown[] } | undefined)?.spiked?.length ?? 0;
}

function parseMapping(text: string | undefined): Record<string, string | null> | undefined {
  if (text === undefined || text.trim() === '') return undefined;
  const refuse = () =>
    unprocessable([{ field: 'mapping', code: 'invalid', message: 'The mapping must be a JSON object of field names to column headers.' }]);
  let mapping: unknown;
  try {
    mapping = JSON.parse(text);
  } catch {
    throw refuse();
  }
  if (typeof mapping !== 'object' || mapping === null || Array.isArray(mapping)) throw refuse();
  if (!Object.values(mapping).every((value) => value === null || typeof value === 'string')) throw refuse();
  return mapping as Record<string, string | null>;
}

function staleStudy() {
  return new ConflictException('Someone else changed this study; reload it and try again.');
}

@Injectable()
export class StudiesService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly audit: AuditService,
    private readonly workers: WorkerPoolService,
    private readonly preparations: PreparationsService,
  ) {}

  async findPage(query: ListStudiesQueryDto, user: AuthUser): Promise<StudyPageDto> {
    const pageSize = query.pageSize ?? 20;
    const sort = query.sort ?? 'updatedAt';
    const order = query.order ?? 'desc';
    const cursor = decodeCursor(query.cursor, sort, order);
    const qb = this.dataSource
      .getRepository(ValidationStudy)
      .createQueryBuilder('study')
      .innerJoin('study.methodVersion', 'version')
      .innerJoin('version.method', 'method')
      .innerJoin('study.author', 'author')
      .select([
        'study.id',
        'study.title',
        'study.status',
        'study.methodVersionId',
        'study.resultErrors',
        'study.engineVersion',
        'study.dataHash',
        'study.meta',
        'study.authorId',
        'study.editorIds',
        'study.copiedFromId',
        'study.lockVersion',
        'study.createdAt',
        'study.updatedAt',
        'study.submittedAt',
        'study.approvedAt',
        'version.id',
        'version.number',
        'version.status',
        'version.criteria',
        'version.settings',
        'method.id',
        'method.name',
        'method.analyte',
        'method.matrix',
        'method.technique',
        'method.xUnit',
        'method.yUnit',
        'author.id',
        'author.name',
      ]);
    const countQuery = this.dataSource.getRepository(ValidationStudy).createQueryBuilder('study').select('study.id');
    for (const filtered of [qb, countQuery]) this.filterStudies(filtered, query, user);
    const { rows, ...page } = await keysetPage(qb, { alias: 'study', sortProperty: sort, sort, order, cursor, pageSize, countQuery });
    const verdicts = await this.verdictsOf(rows.map((study) => study.id));
    return { ...page, pageSize, items: rows.map((study) => ({ ...toStudySummary(study), verdictPass: verdicts.get(study.id) ?? null })) };
  }

  private filterStudies(qb: SelectQueryBuilder<ValidationStudy>, query: ListStudiesQueryDto, user: AuthUser) {
    if (query.status) qb.andWhere('study.status = :status', { status: query.status });
    if (query.methodId)
      qb.andWhere('study.methodVersionId IN (SELECT mv.id FROM method_versions mv WHERE mv.method_id = :methodId)', {
        methodId: query.methodId,
      });
    if (query.methodVersionId) qb.andWhere('study.methodVersionId = :methodVersionId', { methodVersionId: query.methodVersionId });
    const authorId = query.mine ? user.id : query.authorId;
    if (authorId) qb.andWhere('study.authorId = :authorId', { authorId });
    if (query.from) qb.andWhere('study.updatedAt >= :from', { from: new Date(query.from) });
    if (query.to) {
      const dateOnly = /^\d{4}-\d{2}-\d{2}$/.test(query.to);
      qb.andWhere(dateOnly ? 'study.updatedAt < :to' : 'study.updatedAt <= :to', {
        to: new Date(Date.parse(query.to) + (dateOnly ? DAY_MS : 0)),
      });
    }
    if (query.q) qb.andWhere(`LOWER(study.title) LIKE :q ESCAPE '\\'`, { q: `%${query.q.toLowerCase().replace(/[\\%_]/g, '\\$&')}%` });
  }

  /** The verdict lives in the result; the database extracts it for the page's rows only, without shipping the result. */
  private async verdictsOf(ids: string[]): Promise<Map<string, boolean | null>> {
    if (!ids.length) return new Map();
    const pass =
      this.dataSource.options.type === 'postgres'
        ? `CAST(study.result AS json) #>> '{verdict,pass}'`
        : `json_extract(study.result, '$.verdict.pass')`;
    const rows = await this.dataSource
      .getRepository(ValidationStudy)
      .createQueryBuilder('study')
      .select('study.id', 'id')
      .addSelect(pass, 'pass')
      .where('study.id IN (:...ids)', { ids })
      .getRawMany<{ id: string; pass: string | number | boolean | null }>();
    return new Map(rows.map((row) => [row.id, row.pass === null ? null : row.pass === true || row.pass === 1 || row.pass === 'true']));
  }

  async findOne(id: ValidationStudy['id'], manager: EntityManager = this.dataSource.manager): Promise<StudyDto> {
    return toStudyDto(await this.load(manager, id));
  }

  async create(dto: CreateStudyDto, actor: AuthUser): Promise<StudyDto> {
    const id = await writeTransaction(this.dataSource, async (manager) => {
      const version = await manager.findOne(MethodVersion, { where: { id: dto.methodVersionId }, relations: { method: true } });
      if (!version)
        throw unprocessable([{ field: 'methodVersionId', code: 'not_found', message: 'There is no method version with this id.' }]);
      if (version.status === 'retired') {
        throw unprocessable([
          {
            field: 'methodVersionId',
            code: 'retired',
            message: `Version ${version.number} of this method is retired; choose its current version.`,
          },
        ]);
      }
      const data = withMethodDefaults(dto.data, version, version.method);
      await this.assertPreparationsUsable(manager, data);
      const evaluation = await this.workers.evaluate(data);
      const study = await saveNewStudy(
        manager,
        this.audit,
        {
          methodVersionId: version.id,
          title: dto.title,
          data,
          ...evaluation,
          meta: mergeMeta({}, dto.meta),
          copiedFromId: null,
          ...newDraftFields(actor.id),
        },
        actor,
      );
      return study.id;
    });
    return this.findOne(id);
  }

  async update(id: ValidationStudy['id'], dto: UpdateStudyDto, actor: AuthUser): Promise<StudyDto> {
    return writeTransaction(this.dataSource, async (manager) => {
      const study = await this.loadEditable(manager, id, actor);
      if (dto.lockVersion !== study.lockVersion) throw staleStudy();
      const patch: StudyPatch = {};
      if (dto.title && dto.title !== study.title) patch.title = dto.title;
      const meta = mergeMeta(study.meta, dto.meta);
      if (changed(study.meta, meta)) patch.meta = meta;
      let exclusions: AuditRecord[] = [];
      if (dto.data !== undefined) {
        const data = withMethodDefaults(dto.data, study.methodVersion, study.methodVersion.method);
        if (changed(study.data, data)) {
          await this.assertPreparationsUsable(manager, data);
          Object.assign(patch, await this.dataPatch(study, data, actor));
          exclusions = exclusionEntries(study.data, data, actor, id);
        }
      }
      if (Object.keys(patch).length === 0) return toStudyDto(study);
      const reason = reasonForReturned(study, dto.reason);

      await this.save(manager, study, dto.lockVersion, patch);
      const changes: FieldChanges = {};
      if (patch.title) changes.title = { from: study.title, to: patch.title };
      if (patch.meta) {
        for (const { field, from, to } of diffStudyMeta({ ...study.meta }, { ...patch.meta })) changes[`meta.${field}`] = { from, to };
      }
      if (patch.data) Object.assign(changes, dataChangeEntries(study.data, patch.data));
      if (patch.dataHash) changes.dataHash = { from: study.dataHash, to: patch.dataHash };
      await this.audit.record({ actor, action: 'study.updated', entity: 'study', entityId: id, changes, reason }, manager);
      for (const entry of exclusions) await this.audit.record(entry, manager);
      return this.findOne(id, manager);
    });
  }

  /** An administrator hands a draft to another analyst (the author left, or is away); the old author keeps no right to edit it. */
  async reassign(id: ValidationStudy['id'], dto: ReassignStudyDto, actor: AuthUser): Promise<StudyDto> {
    return writeTransaction(this.dataSource, async (manager) => {
      const study = await this.load(manager, id);
      if (dto.lockVersion !== study.lockVersion) throw staleStudy();
      if (study.status !== 'draft') {
        throw new ConflictException(`This study is ${study.status}; only a draft can be given to another analyst.`);
      }
      const analyst = await manager.findOne(User, { where: { id: dto.authorId } });
      const refuse = (code: string, message: string) => unprocessable([{ field: 'authorId', code, message }]);
      if (!analyst || !analyst.active || !analyst.roles.includes(Role.Analyst)) {
        throw refuse('not_analyst', 'Choose an active analyst.');
      }
      if (analyst.id === study.authorId) throw refuse('same_author', `${analyst.name} already writes this study.`);
      await this.save(manager, study, dto.lockVersion, { authorId: analyst.id, editorIds: [...new Set([...study.editorIds, analyst.id])] });
      await this.audit.record(
        {
          actor,
          action: 'study.reassigned',
          entity: 'study',
          entityId: id,
          changes: { author: { from: study.author.name, to: analyst.name }, authorId: { from: study.authorId, to: analyst.id } },
          reason: dto.reason,
        },
        manager,
      );
      return this.findOne(id, manager);
    });
  }

  async remove(id: ValidationStudy['id'], actor: AuthUser): Promise<void> {
    await writeTransaction(this.dataSource, async (manager) => {
      const study = await this.loadEditable(manager, id, actor);
      if (study.status !== 'draft') throw new ConflictException('Only a draft can be deleted; a returned study stays on record.');
      await manager.delete(ValidationStudy, { id });
      await this.audit.record(
        {
          actor,
          action: 'study.deleted',
          entity: 'study',
          entityId: id,
          changes: { title: { from: study.title, to: null }, dataHash: { from: study.dataHash, to: null } },
        },
        manager,
      );
    });
  }

  async importFile(
    id: ValidationStudy['id'],
    file: Express.Multer.File | undefined,
    dto: ImportStudyDto,
    actor: AuthUser,
  ): Promise<ImportPreviewDto | StudyDto> {
    await this.loadEditable(this.dataSource.manager, id, actor);
    if (!file) throw unprocessable([{ field: 'file', code: 'required', message: 'Choose a CSV or XLSX file.' }]);
    const mapping = parseMapping(dto.mapping);
    const preview = importSection(await this.workers.readTable(file.buffer), dto.section, mapping);
    if (dto.dryRun) return preview;
    if (preview.errors.length > 0) throw unprocessable(preview.errors as FieldError[], 'The file has errors; nothing was imported.');

    return writeTransaction(this.dataSource, async (manager) => {
      const study = await this.loadEditable(manager, id, actor);
      if (dto.lockVersion !== study.lockVersion) throw staleStudy();
      const data = withMethodDefaults(
        replaceSection(study.data, dto.section, preview.rows),
        study.methodVersion,
        study.methodVersion.method,
      );
      if (!changed(study.data, data)) return toStudyDto(study);
      await this.assertPreparationsUsable(manager, data);
      const reason = reasonForReturned(study, dto.reason);
      const patch = await this.dataPatch(study, data, actor);
      await this.save(manager, study, dto.lockVersion as number, patch);
      await this.audit.record(
        {
          actor,
          action: 'study.imported',
          entity: 'study',
          entityId: id,
          changes: {
            section: { from: null, to: dto.section },
            rowCount: { from: sectionSize(study.data, dto.section), to: preview.rowCount },
            file: { from: null, to: file.originalname },
            dataHash: { from: study.dataHash, to: patch.dataHash },
          },
          reason,
        },
        manager,
      );
      return this.findOne(id, manager);
    });
  }

  /** Standards that name a preparation must name a saved one whose material is still in use. */
  private async assertPreparationsUsable(manager: EntityManager, data: StudyData) {
    const errors = await this.preparations.studyStandardErrors(manager, data);
    if (errors.length) throw unprocessable(errors, 'A standard names a preparation that cannot be used.');
  }

  /** New data and the server's result for them. */
  private async dataPatch(study: ValidationStudy, data: StudyData, actor: AuthUser): Promise<StudyPatch> {
    return { data, ...(await this.workers.evaluate(data)), editorIds: [...new Set([...study.editorIds, actor.id])] };
  }

  /** Writes only if nobody changed the study since `lockVersion` was read. */
  private async save(manager: EntityManager, study: ValidationStudy, lockVersion: number, patch: StudyPatch) {
    const result = await manager.update(ValidationStudy, { id: study.id, lockVersion }, {
      ...patch,
      lockVersion: lockVersion + 1,
      updatedAt: new Date(),
    } as QueryDeepPartialEntity<ValidationStudy>);
    if (!result.affected) throw staleStudy();
  }

  private async load(manager: EntityManager, id: ValidationStudy['id']): Promise<ValidationStudy> {
    const study = await manager.findOne(ValidationStudy, { where: { id }, relations: { methodVersion: { method: true }, author: true } });
    if (!study) throw new NotFoundException('Study not found.');
    return study;
  }

  private async loadEditable(manager: EntityManager, id: ValidationStudy['id'], actor: AuthUser): Promise<ValidationStudy> {
    const study = await this.load(manager, id);
    if (study.authorId !== actor.id) throw new ForbiddenException('Only the author of a study may change it.');
    if (LOCKED_STATUSES.includes(study.status))
      throw new ConflictException(`This study is locked while ${study.status}; it cannot be changed.`);
    return study;
  }
}
