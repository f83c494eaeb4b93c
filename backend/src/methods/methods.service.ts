import { ConflictException, ForbiddenException, Injectable, NotFoundException, UnauthorizedException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, In, type EntityManager } from 'typeorm';
import {
  canonicalJson,
  DEFAULT_RECOVERY_EQUIVALENCE_MARGIN_PCT,
  hasAnyRole,
  MIN_JUSTIFICATION_LENGTH,
  REVALIDATION_FAMILIES,
  REVALIDATION_FAMILY_LABELS,
  REVALIDATION_FAMILY_SECTIONS,
  Role,
  type MethodVersionSettings,
  type MethodVersionStatus,
  type RevalidationFamily,
} from '@meritline/shared';
import type { FieldChanges } from '../audit/audit-entry.entity.js';
import { createdFields, AuditService } from '../audit/audit.service.js';
import { AuthService } from '../auth/auth.service.js';
import { unprocessable } from '../common/validation.js';
import type { AuthUser } from '../common/decorators/current-user.decorator.js';
import { ValidationStudy } from '../studies/validation-study.entity.js';
import { User } from '../users/user.entity.js';
import { CRITERIA_TEMPLATES, findTemplate, type CriteriaTemplate } from './criteria-templates.js';
import type { CreateMethodVersionDto } from './dto/create-method-version.dto.js';
import type { CreateMethodDto } from './dto/create-method.dto.js';
import type { CriterionDto } from './dto/criterion.dto.js';
import type { MethodDto, MethodSummaryDto, MethodVersionDetailDto, MethodVersionDto, RevalidationCoverageDto } from './dto/method.dto.js';
import type { MethodVersionSettingsDto } from './dto/method-version-settings.dto.js';
import type { UpdateMethodVersionDto } from './dto/update-method-version.dto.js';
import { MethodVersion, type CriteriaSet } from './method-version.entity.js';
import { Method } from './method.entity.js';
import { writeTransaction } from '../database/write-transaction.js';

const ALLOWED_TRANSITIONS: Record<MethodVersionStatus, MethodVersionStatus[]> = { draft: ['active'], active: ['retired'], retired: [] };
const TRANSITION_REFUSALS: Record<MethodVersionStatus, string> = {
  draft: 'A draft version can only be activated.',
  active: 'An active version can only be retired.',
  retired: 'A retired version never comes back; create a new version.',
};
const FROZEN_MESSAGES: Record<MethodVersionStatus, string> = {
  draft: '',
  active: 'An active version is frozen; create a new version.',
  retired: 'A retired version is frozen; create a new version.',
};

/** Plain criteria objects, without the empty optional fields a DTO instance carries. */
export function toCriteriaSet(criteria: CriterionDto[]): CriteriaSet {
  return criteria.map(({ figure, op, value, level, label }) => ({
    figure,
    op,
    value: Array.isArray(value) ? [value[0], value[1]] : value,
    ...(level !== undefined ? { level } : {}),
    ...(label ? { label } : {}),
  }));
}

function mergeSettings(base: MethodVersionSettings, update: MethodVersionSettingsDto | undefined): MethodVersionSettings {
  const defined = Object.entries(update ?? {}).filter(([, value]) => value !== undefined);
  return { ...base, ...Object.fromEntries(defined) };
}

function changed(from: unknown, to: unknown): boolean {
  return canonicalJson(from) !== canonicalJson(to);
}

export const WRONG_ACTIVATION_PASSWORD = 'Password not correct; the version was not activated.';

type ApprovedResult = { id: string; methodVersionId: string; result: Record<string, unknown> | null };

/** The first approved study that holds the result sections of every family in scope, or the families none shows. */
export function revalidationCoverage(scope: readonly RevalidationFamily[], approved: readonly ApprovedResult[]): RevalidationCoverageDto {
  const shows = (study: ApprovedResult, family: RevalidationFamily) =>
    REVALIDATION_FAMILY_SECTIONS[family].every((section) => study.result?.[section] != null);
  if (scope.length === 0) return { covered: true, missing: [], studyId: approved[0]?.id ?? null };
  const covering = approved.find((study) => scope.every((family) => shows(study, family)));
  if (covering) return { covered: true, missing: [], studyId: covering.id };
  const best = approved.length ? Math.min(...approved.map((study) => scope.filter((f) => !shows(study, f)).length)) : scope.length;
  const study = approved.find((candidate) => scope.filter((f) => !shows(candidate, f)).length === best);
  return { covered: false, missing: scope.filter((family) => !study || !shows(study, family)), studyId: null };
}

function uncoveredReason(coverage: RevalidationCoverageDto): string {
  const words = coverage.missing.map((family) => REVALIDATION_FAMILY_LABELS[family].toLowerCase()).join(', ');
  return `No approved validation study of this version shows again what the change puts in question (missing: ${words}). Approve a study covering it, or have a quality manager activate with a written justification.`;
}

export function toMethodSummary(method: Method): MethodSummaryDto {
  const { id, name, analyte, matrix, technique, xUnit, yUnit, purpose } = method;
  return { id, name, analyte, matrix, technique, xUnit, yUnit, purpose };
}

@Injectable()
export class MethodsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly audit: AuditService,
    private readonly auth: AuthService,
  ) {}

  templates(): readonly CriteriaTemplate[] {
    return CRITERIA_TEMPLATES;
  }

  async findAll(): Promise<MethodDto[]> {
    const methods = await this.dataSource.getRepository(Method).find({ relations: { versions: true }, order: { name: 'ASC' } });
    return this.toMethodDtos(methods);
  }

  async findOne(id: Method['id']): Promise<MethodDto> {
    const method = await this.dataSource.getRepository(Method).findOne({ where: { id }, relations: { versions: true } });
    if (!method) throw new NotFoundException('Method not found.');
    const [dto] = await this.toMethodDtos([method]);
    return dto;
  }

  async findVersion(id: MethodVersion['id']): Promise<MethodVersionDetailDto> {
    const version = await this.dataSource.getRepository(MethodVersion).findOne({ where: { id }, relations: { method: true } });
    if (!version) throw new NotFoundException('Method version not found.');
    const [dto] = await this.toVersionDtos([version]);
    return { ...dto, method: toMethodSummary(version.method) };
  }

  async create(dto: CreateMethodDto, actor: AuthUser): Promise<MethodDto> {
    const template = findTemplate(dto.purpose) as CriteriaTemplate;
    const methodId = await writeTransaction(this.dataSource, async (manager) => {
      await this.assertNameFree(manager, dto.name);
      const { name, analyte, matrix, technique, xUnit, yUnit, purpose } = dto;
      const method = await manager.save(
        manager.create(Method, { name, analyte, matrix, technique, xUnit, yUnit, purpose, createdById: actor.id }),
      );
      await this.audit.record(
        {
          actor,
          action: 'method.created',
          entity: 'method',
          entityId: method.id,
          changes: createdFields({ name, purpose }),
        },
        manager,
      );
      await this.insertVersion(manager, actor, method.id, 1, {
        changeSummary: dto.changeSummary ?? 'First version.',
        changeKind: null,
        revalidationScope: [],
        criteria: dto.criteria ? toCriteriaSet(dto.criteria) : template.criteria,
        settings: mergeSettings(template.settings, dto.settings),
      });
      return method.id;
    });
    return this.findOne(methodId);
  }

  async createVersion(methodId: Method['id'], dto: CreateMethodVersionDto, actor: AuthUser): Promise<MethodVersionDetailDto> {
    const versionId = await writeTransaction(this.dataSource, async (manager) => {
      const latest = await manager.findOne(MethodVersion, { where: { methodId }, order: { number: 'DESC' } });
      if (!latest) throw new NotFoundException('Method not found.');
      return this.insertVersion(manager, actor, methodId, latest.number + 1, {
        changeSummary: dto.changeSummary,
        changeKind: dto.changeKind,
        revalidationScope: orderedScope(dto.revalidationScope ?? []),
        criteria: dto.criteria ? toCriteriaSet(dto.criteria) : latest.criteria,
        settings: mergeSettings(latest.settings, dto.settings),
      });
    });
    return this.findVersion(versionId);
  }

  async updateVersion(id: MethodVersion['id'], dto: UpdateMethodVersionDto, actor: AuthUser): Promise<MethodVersionDetailDto> {
    const justification = dto.activationJustification?.trim() || null;
    if (justification !== null) await this.assertActivationSigner(id, dto, actor, justification);
    await writeTransaction(this.dataSource, async (manager) => {
      const version = await manager.findOneBy(MethodVersion, { id });
      if (!version) throw new NotFoundException('Method version not found.');
      const status = dto.status ?? version.status;
      if (!hasAnyRole(actor.roles, [Role.QualityManager, Role.Admin])) {
        if (status !== version.status)
          throw new ForbiddenException('Only quality managers and administrators change the status of a version.');
        if (version.createdById !== actor.id || version.status !== 'draft') {
          throw new ForbiddenException('Analysts may edit only the draft versions they proposed.');
        }
      }
      if (dto.lockVersion !== version.lockVersion) throw staleVersion();

      const next = {
        changeSummary: dto.changeSummary ?? version.changeSummary,
        changeKind: version.changeKind === null ? null : (dto.changeKind ?? version.changeKind),
        revalidationScope: dto.revalidationScope ? orderedScope(dto.revalidationScope) : (version.revalidationScope ?? []),
        criteria: dto.criteria ? toCriteriaSet(dto.criteria) : version.criteria,
        settings: mergeSettings(version.settings, dto.settings),
      };
      const changes: FieldChanges = {};
      for (const key of ['changeSummary', 'changeKind', 'revalidationScope', 'criteria', 'settings'] as const) {
        if (changed(version[key], next[key])) changes[key] = { from: version[key], to: next[key] };
      }
      if (Object.keys(changes).length > 0 && version.status !== 'draft') {
        throw new ConflictException({
          statusCode: 409,
          message: FROZEN_MESSAGES[version.status],
          errors: Object.keys(changes).map((field) => ({ field, code: 'frozen', message: FROZEN_MESSAGES[version.status] })),
        });
      }
      if (status !== version.status && !ALLOWED_TRANSITIONS[version.status].includes(status)) {
        throw new ConflictException({
          statusCode: 409,
          message: TRANSITION_REFUSALS[version.status],
          errors: [{ field: 'status', code: 'transition', message: TRANSITION_REFUSALS[version.status] }],
        });
      }
      const activating = status === 'active' && version.status !== 'active';
      if (justification !== null && !activating) {
        const message = 'A justification is given only when activating a draft version.';
        throw unprocessable([{ field: 'activationJustification', code: 'not_activating', message }], message);
      }
      if (Object.keys(changes).length === 0 && status === version.status) return;

      let justified = false;
      if (activating) {
        const coverage = revalidationCoverage(next.revalidationScope, await this.approvedResults(manager, [id]));
        if (!coverage.covered && justification === null) {
          const message = uncoveredReason(coverage);
          throw unprocessable([{ field: 'status', code: 'not_covered', message }], message);
        }
        justified = !coverage.covered;
      }

      if (activating) await this.retireActiveVersions(manager, actor, version);
      const updated = await manager.update(
        MethodVersion,
        { id, lockVersion: dto.lockVersion },
        { ...next, status, lockVersion: dto.lockVersion + 1, ...(justified ? { activationJustification: justification } : {}) },
      );
      if (!updated.affected) throw staleVersion();

      const entry = { actor, entity: 'method-version', entityId: id };
      if (changes.criteria)
        await this.audit.record({ ...entry, action: 'method-version.criteria-changed', changes: { criteria: changes.criteria } }, manager);
      const { criteria: _criteria, ...otherChanges } = changes;
      if (Object.keys(otherChanges).length > 0)
        await this.audit.record({ ...entry, action: 'method-version.updated', changes: otherChanges }, manager);
      if (justified) {
        await this.audit.record(
          {
            ...entry,
            action: 'method-version.activated-with-justification',
            changes: {
              status: { from: version.status, to: status },
              signatureMeaning: { from: null, to: 'activated with justification' },
              signerRole: { from: null, to: Role.QualityManager },
              activationJustification: { from: null, to: justification },
            },
            reason: justification,
          },
          manager,
        );
      } else if (status !== version.status) {
        await this.audit.record(
          {
            ...entry,
            action: `method-version.${status === 'active' ? 'activated' : 'retired'}`,
            changes: { status: { from: version.status, to: status } },
          },
          manager,
        );
      }
    });
    return this.findVersion(id);
  }

  /** Activation with justification is an e-signature of a quality manager: role, wording and password, checked before anything changes. */
  private async assertActivationSigner(id: MethodVersion['id'], dto: UpdateMethodVersionDto, actor: AuthUser, justification: string) {
    if (!actor.roles.includes(Role.QualityManager)) {
      throw new ForbiddenException('Only a quality manager may activate a version with a justification.');
    }
    const errors = [];
    if (justification.length < MIN_JUSTIFICATION_LENGTH) {
      errors.push({
        field: 'activationJustification',
        code: 'too_short',
        message: `Write why the version may be used all the same (at least ${MIN_JUSTIFICATION_LENGTH} characters).`,
      });
    }
    if (!dto.password) errors.push({ field: 'password', code: 'required', message: 'Enter your password to sign the activation.' });
    if (errors.length) throw unprocessable(errors, 'The activation with justification is incomplete.');
    if (!(await this.auth.verifyPassword(actor.id, dto.password as string))) {
      await this.audit.signatureRefused(actor, { entity: 'method-version', entityId: id, meaning: 'activated with justification' });
      throw new UnauthorizedException(WRONG_ACTIVATION_PASSWORD);
    }
  }

  private approvedResults(manager: EntityManager | null, versionIds: string[]): Promise<ApprovedResult[]> {
    if (versionIds.length === 0) return Promise.resolve([]);
    const repo = (manager ?? this.dataSource.manager).getRepository(ValidationStudy);
    return repo.find({
      where: { methodVersionId: In(versionIds), status: 'approved' },
      select: { id: true, methodVersionId: true, result: true, approvedAt: true },
      order: { approvedAt: 'DESC' },
    });
  }

  private async retireActiveVersions(manager: EntityManager, actor: AuthUser, activated: MethodVersion) {
    const active = await manager.findBy(MethodVersion, { methodId: activated.methodId, status: 'active' });
    for (const previous of active) {
      await manager.update(MethodVersion, { id: previous.id }, { status: 'retired', lockVersion: previous.lockVersion + 1 });
      await this.audit.record(
        {
          actor,
          action: 'method-version.retired',
          entity: 'method-version',
          entityId: previous.id,
          changes: { status: { from: 'active', to: 'retired' } },
          reason: `Superseded by version ${activated.number}.`,
        },
        manager,
      );
    }
  }

  private async insertVersion(
    manager: EntityManager,
    actor: AuthUser,
    methodId: Method['id'],
    number: number,
    content: Pick<MethodVersion, 'changeSummary' | 'changeKind' | 'revalidationScope' | 'criteria' | 'settings'>,
  ): Promise<MethodVersion['id']> {
    const version = await manager.save(
      manager.create(MethodVersion, { ...content, methodId, number, status: 'draft', createdById: actor.id }),
    );
    await this.audit.record(
      {
        actor,
        action: 'method-version.created',
        entity: 'method-version',
        entityId: version.id,
        changes: {
          number: { from: null, to: number },
          ...(content.changeKind
            ? { changeKind: { from: null, to: content.changeKind }, revalidationScope: { from: null, to: content.revalidationScope } }
            : {}),
          criteria: { from: null, to: content.criteria },
          settings: { from: null, to: content.settings },
        },
        reason: content.changeSummary,
      },
      manager,
    );
    return version.id;
  }

  private async assertNameFree(manager: EntityManager, name: string) {
    const taken = await manager
      .getRepository(Method)
      .createQueryBuilder('method')
      .where('LOWER(method.name) = LOWER(:name)', { name })
      .getExists();
    if (taken) {
      const message = 'A method with this name already exists.';
      throw new ConflictException({ statusCode: 409, message, errors: [{ field: 'name', code: 'exists', message }] });
    }
  }

  private async toMethodDtos(methods: Method[]): Promise<MethodDto[]> {
    const versions = new Map((await this.toVersionDtos(methods.flatMap((method) => method.versions))).map((dto) => [dto.id, dto]));
    return methods.map((method) => ({
      ...toMethodSummary(method),
      createdAt: method.createdAt.toISOString(),
      versions: method.versions.map((version) => versions.get(version.id) as MethodVersionDto).sort((a, b) => a.number - b.number),
    }));
  }

  private async toVersionDtos(versions: MethodVersion[]): Promise<MethodVersionDto[]> {
    if (versions.length === 0) return [];
    const creatorIds = [...new Set(versions.map((version) => version.createdById))];
    const [creators, counts, approved] = await Promise.all([
      this.dataSource.getRepository(User).find({ where: { id: In(creatorIds) }, select: { id: true, name: true } }),
      this.dataSource
        .getRepository(ValidationStudy)
        .createQueryBuilder('study')
        .select('study.methodVersionId', 'versionId')
        .addSelect('COUNT(*)', 'total')
        .addSelect(`SUM(CASE WHEN study.status = 'approved' THEN 1 ELSE 0 END)`, 'approved')
        .where('study.methodVersionId IN (:...ids)', { ids: versions.map((version) => version.id) })
        .groupBy('study.methodVersionId')
        .getRawMany<{ versionId: string; total: string | number; approved: string | number | null }>(),
      this.approvedResults(
        null,
        versions.map((version) => version.id),
      ),
    ]);
    return versions.map((version) => {
      const count = counts.find((row) => row.versionId === version.id);
      return {
        id: version.id,
        number: version.number,
        status: version.status,
        changeSummary: version.changeSummary,
        changeKind: version.changeKind,
        revalidationScope: version.revalidationScope ?? [],
        coverage: revalidationCoverage(
          version.revalidationScope ?? [],
          approved.filter((study) => study.methodVersionId === version.id),
        ),
        activationJustification: version.activationJustification,
        criteria: version.criteria as CriterionDto[],
        settings: { recoveryEquivalenceMarginPct: DEFAULT_RECOVERY_EQUIVALENCE_MARGIN_PCT, ...version.settings },
        lockVersion: version.lockVersion,
        createdAt: version.createdAt.toISOString(),
        createdBy: { id: version.createdById, name: creators.find((user) => user.id === version.createdById)?.name ?? 'Unknown user' },
        studyCount: Number(count?.total ?? 0),
        approvedStudyCount: Number(count?.approved ?? 0),
      };
    });
  }
}

function orderedScope(scope: readonly RevalidationFamily[]): RevalidationFamily[] {
  return REVALIDATION_FAMILIES.filter((family) => scope.includes(family));
}

function staleVersion() {
  return new ConflictException('Someone else changed this version; reload it and try again.');
}
