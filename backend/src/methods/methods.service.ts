import { ConflictException, ForbiddenException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, In, type EntityManager } from 'typeorm';
import { canonicalJson, hasAnyRole, Role, type MethodVersionSettings, type MethodVersionStatus } from '@meritline/shared';
import type { FieldChanges } from '../audit/audit-entry.entity.js';
import { AuditService } from '../audit/audit.service.js';
import type { AuthUser } from '../common/decorators/current-user.decorator.js';
import { ValidationStudy } from '../studies/validation-study.entity.js';
import { User } from '../users/user.entity.js';
import { CRITERIA_TEMPLATES, findTemplate, type CriteriaTemplate } from './criteria-templates.js';
import type { CreateMethodVersionDto } from './dto/create-method-version.dto.js';
import type { CreateMethodDto } from './dto/create-method.dto.js';
import type { CriterionDto } from './dto/criterion.dto.js';
import type { MethodDto, MethodSummaryDto, MethodVersionDetailDto, MethodVersionDto } from './dto/method.dto.js';
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

export function toMethodSummary(method: Method): MethodSummaryDto {
  const { id, name, analyte, matrix, technique, xUnit, yUnit, purpose } = method;
  return { id, name, analyte, matrix, technique, xUnit, yUnit, purpose };
}

@Injectable()
export class MethodsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly audit: AuditService,
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
          changes: { name: { from: null, to: name }, purpose: { from: null, to: purpose } },
        },
        manager,
      );
      await this.insertVersion(manager, actor, method.id, 1, {
        changeSummary: dto.changeSummary ?? 'First version.',
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
        criteria: dto.criteria ? toCriteriaSet(dto.criteria) : latest.criteria,
        settings: mergeSettings(latest.settings, dto.settings),
      });
    });
    return this.findVersion(versionId);
  }

  async updateVersion(id: MethodVersion['id'], dto: UpdateMethodVersionDto, actor: AuthUser): Promise<MethodVersionDetailDto> {
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
        criteria: dto.criteria ? toCriteriaSet(dto.criteria) : version.criteria,
        settings: mergeSettings(version.settings, dto.settings),
      };
      const changes: FieldChanges = {};
      for (const key of ['changeSummary', 'criteria', 'settings'] as const) {
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
      if (Object.keys(changes).length === 0 && status === version.status) return;

      if (status === 'active') await this.retireActiveVersions(manager, actor, version);
      const updated = await manager.update(
        MethodVersion,
        { id, lockVersion: dto.lockVersion },
        { ...next, status, lockVersion: dto.lockVersion + 1 },
      );
      if (!updated.affected) throw staleVersion();

      const entry = { actor, entity: 'method-version', entityId: id };
      if (changes.criteria)
        await this.audit.record({ ...entry, action: 'method-version.criteria-changed', changes: { criteria: changes.criteria } }, manager);
      const { criteria: _criteria, ...otherChanges } = changes;
      if (Object.keys(otherChanges).length > 0)
        await this.audit.record({ ...entry, action: 'method-version.updated', changes: otherChanges }, manager);
      if (status !== version.status) {
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
    content: Pick<MethodVersion, 'changeSummary' | 'criteria' | 'settings'>,
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
    const [creators, counts] = await Promise.all([
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
    ]);
    return versions.map((version) => {
      const count = counts.find((row) => row.versionId === version.id);
      return {
        id: version.id,
        number: version.number,
        status: version.status,
        changeSummary: version.changeSummary,
        criteria: version.criteria as CriterionDto[],
        settings: version.settings,
        lockVersion: version.lockVersion,
        createdAt: version.createdAt.toISOString(),
        createdBy: { id: version.createdById, name: creators.find((user) => user.id === version.createdById)?.name ?? 'Unknown user' },
        studyCount: Number(count?.total ?? 0),
        approvedStudyCount: Number(count?.approved ?? 0),
      };
    });
  }
}

function staleVersion() {
  return new ConflictException('Someone else changed this version; reload it and try again.');
}
