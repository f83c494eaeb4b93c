import { ConflictException, Inject, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import { DataSource, In, Repository } from 'typeorm';
import {
  evaluateRun,
  modelChoices,
  qcWindow,
  runContextOf,
  slopeControlChart,
  StudyValidationError,
  validationBasis,
  type EvaluationResult,
  type RunContext,
  type RunControlChartDto,
  type RunDto,
  type RunMethodChoiceDto,
  type RunMethodDto,
  type RunModel,
  type RunOptionsDto,
  type RunPageDto,
  type RunPreviewDto,
  type RunRecordedData,
  type RunResult,
} from '@meritline/shared';
import { AuditService } from '../audit/audit.service.js';
import type { AuthUser } from '../common/decorators/current-user.decorator.js';
import { appConfig, type AppConfigType } from '../config/app.config.js';
import { decodeCursor, keysetPage } from '../common/keyset.js';
import { unprocessable } from '../common/validation.js';
import { MethodVersion } from '../methods/method-version.entity.js';
import { writeTransaction } from '../database/write-transaction.js';
import { Method } from '../methods/method.entity.js';
import { approvingSignature, failsCriteria } from '../reviews/signatures.js';
import { StudySignature } from '../reviews/study-signature.entity.js';
import { ValidationStudy } from '../studies/validation-study.entity.js';
import { User } from '../users/user.entity.js';
import type { CreateRunDto } from './dto/create-run.dto.js';
import type { ExportFormat } from './dto/export-run.query.dto.js';
import type { ListRunsQueryDto } from './dto/list-runs.query.dto.js';
import { runCsv, runWorkbook } from './run-export.js';
import { runSheet } from './run-sheet.js';
import { saveCalculatedRun } from './run-record.js';
import { RunSignature } from './run-signature.entity.js';
import { Run } from './run.entity.js';

export interface RunFile {
  body: Buffer;
  contentType: string;
  filename: string;
}

const CONTENT_TYPES = {
  csv: 'text/csv; charset=utf-8',
  xlsx: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
  pdf: 'application/pdf',
} as const;

function fileName(run: RunDto, extension: string): string {
  const slug =
    run.title
      .normalize('NFKD')
      .replace(/[^\w]+/g, '-')
      .replace(/^-+|-+$/g, '')
      .toLowerCase()
      .slice(0, 60) || 'run';
  return `run-${slug}-${run.createdAt.slice(0, 10)}.${extension}`;
}

const toMethodSummary = (m: Method): RunMethodDto => ({
  id: m.id,
  name: m.name,
  analyte: m.analyte,
  matrix: m.matrix,
  xUnit: m.xUnit,
  yUnit: m.yUnit,
});

function versionLabel(version: MethodVersion): string {
  return `Version ${version.number} of ${version.method.name}`;
}

function unusableReason(version: MethodVersion, hasApproved: boolean, hasCalibration = true, fitForUse = true): string | null {
  if (version.status !== 'active')
    return `${versionLabel(version)} is ${version.status === 'draft' ? 'a draft' : 'retired'}: routine runs need an active version.`;
  if (!hasApproved) return `${versionLabel(version)} has no approved validation study, so it is not validated for routine runs.`;
  if (!fitForUse)
    return `The latest approved validation study of ${versionLabel(version).toLowerCase()} does not meet all its acceptance criteria and was approved without a written justification, so the version is not validated for routine runs.`;
  if (!hasCalibration)
    return `The approved validation study of ${versionLabel(version).toLowerCase()} has no calibration to compare a run with.`;
  return null;
}

@Injectable()
export class RunsService {
  constructor(
    @InjectRepository(Run) private readonly runs: Repository<Run>,
    @InjectRepository(MethodVersion) private readonly versions: Repository<MethodVersion>,
    @InjectRepository(ValidationStudy) private readonly studies: Repository<ValidationStudy>,
    @InjectRepository(User) private readonly users: Repository<User>,
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly audit: AuditService,
    @Inject(appConfig.KEY) private readonly config: AppConfigType,
  ) {}

  private async findVersion(id: MethodVersion['id']): Promise<MethodVersion | null> {
    return this.versions.findOne({ where: { id }, relations: { method: true } });
  }

  private approvedStudy(methodVersionId: string): Promise<ValidationStudy | null> {
    return this.studies.findOne({ where: { methodVersionId, status: 'approved' }, order: { approvedAt: 'DESC', createdAt: 'DESC' } });
  }

  /** The study meets all its criteria, or whoever approved it wrote why it is fit for use all the same. */
  private async fitForUse(studies: Pick<ValidationStudy, 'id' | 'result'>[]): Promise<Set<string>> {
    const fit = new Set(studies.filter((study) => !failsCriteria(study.result)).map((study) => study.id));
    const others = studies.filter((study) => !fit.has(study.id)).map((study) => study.id);
    if (others.length) {
      const signatures = await this.dataSource.getRepository(StudySignature).find({ where: { studyId: In(others) } });
      for (const id of others) {
        if (approvingSignature(signatures.filter((s) => s.studyId === id))?.justification) fit.add(id);
      }
    }
    return fit;
  }

  private async optionsFor(version: MethodVersion): Promise<RunOptionsDto> {
    const study = await this.approvedStudy(version.id);
    const fit = study ? (await this.fitForUse([study])).has(study.id) : false;
    const basis = study?.result
      ? validationBasis({
          id: study.id,
          title: study.title,
          approvedAt: study.approvedAt,
          result: study.result as unknown as EvaluationResult,
        })
      : null;
    const reason = unusableReason(version, study !== null, basis !== null, fit);
    const { settings } = version;
    return {
      methodVersionId: version.id,
      lockVersion: version.lockVersion,
      versionNumber: version.number,
      status: version.status,
      method: toMethodSummary(version.method),
      usable: reason === null,
      reason,
      models:
        reason === null ? modelChoices(basis, settings, version.method.yUnit) : modelChoices(null, settings).map((m) => ({ ...m, reason })),
      validationStudyId: study?.id ?? null,
      lod: basis?.lod ?? null,
      loq: basis?.loq ?? null,
      validatedRange: basis?.validatedRange ?? null,
      checkTolerancePct: settings.checkTolerancePct,
      onePointMaxInterceptPct: settings.onePointMaxInterceptPct,
      validation: basis,
      qcWindow: qcWindow(version.criteria, settings),
    };
  }

  async runOptions(methodVersionId: string): Promise<RunOptionsDto> {
    const version = await this.findVersion(methodVersionId);
    if (!version) throw new NotFoundException('Method version not found.');
    return this.optionsFor(version);
  }

  async methodChoices(): Promise<RunMethodChoiceDto[]> {
    const versions = await this.versions.find({ relations: { method: true }, order: { number: 'ASC' } });
    const approved = await this.studies.find({
      where: { status: 'approved' },
      select: { id: true, methodVersionId: true, result: true, approvedAt: true, createdAt: true },
      order: { approvedAt: 'DESC', createdAt: 'DESC' },
    });
    const latest = new Map<string, (typeof approved)[number]>();
    for (const study of approved) if (!latest.has(study.methodVersionId)) latest.set(study.methodVersionId, study);
    const fit = await this.fitForUse([...latest.values()]);
    const byMethod = new Map<string, RunMethodChoiceDto>();
    for (const version of versions) {
      const entry = byMethod.get(version.methodId) ?? { ...toMethodSummary(version.method), versions: [] };
      const study = latest.get(version.id);
      const reason = unusableReason(version, study !== undefined, true, study !== undefined && fit.has(study.id));
      entry.versions.push({ id: version.id, number: version.number, status: version.status, usable: reason === null, reason });
      byMethod.set(version.methodId, entry);
    }
    return [...byMethod.values()].sort((a, b) => a.name.localeCompare(b.name));
  }

  /** Loads what a run on the version depends on, or refuses the version with the reason. */
  private async contextFor(dto: CreateRunDto): Promise<{ version: MethodVersion; context: RunContext }> {
    const version = await this.findVersion(dto.methodVersionId);
    const refuse = (message: string) => unprocessable([{ field: 'methodVersionId', code: 'not_usable', message }], message);
    if (!version) throw refuse('No method version has this id.');
    if (dto.methodVersionLockVersion !== undefined && dto.methodVersionLockVersion !== version.lockVersion) {
      throw new ConflictException(
        `${versionLabel(version)} was changed after you opened it (for example its check tolerance); reload and try again.`,
      );
    }
    const options = await this.optionsFor(version);
    const context = options.usable ? runContextOf(options) : null;
    if (!context) throw refuse(options.reason ?? 'This version cannot be used for runs.');
    return { version, context };
  }

  private calculate(dto: CreateRunDto, context: RunContext): RunPreviewDto {
    try {
      return evaluateRun(dto.data, context);
    } catch (error) {
      if (error instanceof StudyValidationError) throw unprocessable(error.errors, 'The run cannot be calculated from these data.');
      throw error;
    }
  }

  async preview(dto: CreateRunDto): Promise<RunPreviewDto> {
    const { context } = await this.contextFor(dto);
    return this.calculate(dto, context);
  }

  async create(dto: CreateRunDto, actor: AuthUser): Promise<RunDto> {
    const { version, context } = await this.contextFor(dto);
    const evaluation = this.calculate(dto, context);
    const run = await writeTransaction(this.dataSource, (manager) =>
      saveCalculatedRun(manager, this.audit, {
        methodVersionId: version.id,
        title: dto.title.trim(),
        evaluation,
        author: actor,
        // Millisecond time keeps runs of the same second in order (the column default has whole seconds on SQLite).
        createdAt: new Date(),
      }),
    );
    return this.toDto(run, version, { id: actor.id, name: actor.name });
  }

  private toDto(run: Run, version: MethodVersion, author: { id: string; name: string }): RunDto {
    return {
      id: run.id,
      methodVersionId: run.methodVersionId,
      versionNumber: version.number,
      method: toMethodSummary(version.method),
      title: run.title,
      status: run.status,
      model: run.model as RunModel,
      data: run.data as RunRecordedData,
      result: run.result as unknown as RunResult,
      rejectionReasons: run.rejectionReasons,
      engineVersion: run.engineVersion,
      dataHash: run.dataHash,
      author,
      createdAt: run.createdAt.toISOString(),
    };
  }

  private async authorsOf(runs: Run[]): Promise<Map<string, { id: string; name: string }>> {
    const ids = [...new Set(runs.map((r) => r.authorId))];
    const users = ids.length ? await this.users.find({ where: { id: In(ids) }, select: { id: true, name: true } }) : [];
    return new Map(users.map((u) => [u.id, { id: u.id, name: u.name }]));
  }

  async findOne(id: Run['id']): Promise<RunDto> {
    const run = await this.runs.findOne({ where: { id }, relations: { methodVersion: { method: true } } });
    if (!run) throw new NotFoundException('Run not found.');
    const authors = await this.authorsOf([run]);
    return this.toDto(run, run.methodVersion, authors.get(run.authorId) ?? { id: run.authorId, name: 'Unknown user' });
  }

  async list(query: ListRunsQueryDto): Promise<RunPageDto> {
    const cursor = decodeCursor(query.cursor, 'createdAt', 'desc');
    const qb = this.runs
      .createQueryBuilder('run')
      .innerJoin('run.methodVersion', 'version')
      .innerJoin('version.method', 'method')
      .select([
        'run.id',
        'run.title',
        'run.status',
        'run.reviewStatus',
        'run.model',
        'run.methodVersionId',
        'run.authorId',
        'run.createdAt',
        'version.id',
        'version.number',
        'method.id',
        'method.name',
        'method.analyte',
      ]);
    const countQuery = this.runs.createQueryBuilder('run').select('run.id');
    for (const filtered of [qb, countQuery]) {
      if (query.methodVersionId) filtered.andWhere('run.methodVersionId = :methodVersionId', { methodVersionId: query.methodVersionId });
      if (query.status) filtered.andWhere('run.status = :status', { status: query.status });
      if (query.methodId) {
        filtered.andWhere('run.methodVersionId IN (SELECT mv.id FROM method_versions mv WHERE mv.method_id = :methodId)', {
          methodId: query.methodId,
        });
      }
    }
    const { rows: runs, ...page } = await keysetPage(qb, {
      alias: 'run',
      sortProperty: 'createdAt',
      sort: 'createdAt',
      order: 'desc',
      cursor,
      pageSize: query.pageSize,
      countQuery,
    });
    const authors = await this.authorsOf(runs);
    const results = runs.length
      ? await this.runs.find({ where: { id: In(runs.map((run) => run.id)) }, select: { id: true, result: true } })
      : [];
    const resultOf = new Map(results.map((run) => [run.id, run.result as unknown as RunResult]));
    return {
      ...page,
      pageSize: query.pageSize,
      items: runs.map((run) => {
        const result = resultOf.get(run.id);
        return {
          id: run.id,
          title: run.title,
          status: run.status,
          reviewStatus: run.reviewStatus,
          model: run.model as RunModel,
          methodVersionId: run.methodVersionId,
          versionNumber: run.methodVersion.number,
          method: { id: run.methodVersion.method.id, name: run.methodVersion.method.name, analyte: run.methodVersion.method.analyte },
          author: authors.get(run.authorId) ?? { id: run.authorId, name: 'Unknown user' },
          createdAt: run.createdAt.toISOString(),
          slope: result?.calibration?.slope ?? null,
          unknownCount: result?.unknowns.length ?? 0,
          checkCount: result?.checks.length ?? 0,
        };
      }),
    };
  }

  async controlChart(methodVersionId: string): Promise<RunControlChartDto> {
    const version = await this.findVersion(methodVersionId);
    if (!version) throw new NotFoundException('Method version not found.');
    const accepted = await this.runs.find({ where: { methodVersionId, status: 'accepted' }, order: { createdAt: 'ASC', id: 'ASC' } });
    const chart = slopeControlChart(
      accepted.flatMap((run) => {
        const slope = (run.result as unknown as RunResult).calibration?.slope;
        return typeof slope === 'number'
          ? [{ runId: run.id, title: run.title, createdAt: run.createdAt.toISOString(), model: run.model as RunModel, slope }]
          : [];
      }),
    );
    return { methodVersionId, slopeUnit: `${version.method.yUnit} per ${version.method.xUnit}`, ...chart };
  }

  async exportFile(id: Run['id'], format: ExportFormat): Promise<RunFile> {
    const run = await this.findOne(id);
    const signatures = await this.dataSource.getRepository(RunSignature).find({ where: { runId: id }, order: { signedAt: 'ASC' } });
    const body = format === 'csv' ? Buffer.from(runCsv(run, signatures), 'utf8') : await runWorkbook(run, signatures);
    return { body, contentType: CONTENT_TYPES[format], filename: fileName(run, format) };
  }

  async sheet(id: Run['id']): Promise<RunFile> {
    const run = await this.findOne(id);
    return { body: await runSheet(run, this.config.laboratoryName), contentType: CONTENT_TYPES.pdf, filename: fileName(run, 'pdf') };
  }
}
