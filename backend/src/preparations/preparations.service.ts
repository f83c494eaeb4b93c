import { Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, In, type EntityManager } from 'typeorm';
import {
  certifiedStandardUncertainty,
  ENGINE_VERSION,
  humanizePreparationErrors,
  preparationErrors,
  preparationUncertainty,
  referenceMaterialStatus,
  todayIso,
  type FieldError,
  type PreparationDto,
  type PreparationPreviewDto,
  type PreparationStep,
  type PreparationStock,
} from '@meritline/shared';
import { createdFields, AuditService } from '../audit/audit.service.js';
import type { AuthUser } from '../common/decorators/current-user.decorator.js';
import { unprocessable } from '../common/validation.js';
import { writeTransaction } from '../database/write-transaction.js';
import { ReferenceMaterial } from '../reference-materials/reference-material.entity.js';
import type { CreatePreparationDto, PreparationPreviewRequestDto } from './dto/preparation-request.dto.js';
import { StandardPreparation, type StoredPreparationInput } from './standard-preparation.entity.js';

const STATUS_REFUSALS = {
  expired: (m: ReferenceMaterial) => `${m.name}, lot ${m.lot}, expired on ${m.expiresOn}; choose a material in use.`,
  withdrawn: (m: ReferenceMaterial) => `${m.name}, lot ${m.lot}, was withdrawn; choose a material in use.`,
};

/** Why a material cannot be used for a new standard today, or null when it can. */
export function materialRefusal(material: ReferenceMaterial, today = todayIso()): FieldError | null {
  const status = referenceMaterialStatus(material, today);
  if (status !== 'in-use') return { field: 'source.materialId', code: status, message: STATUS_REFUSALS[status](material) };
  if (material.valueKind !== 'purity')
    return {
      field: 'source.materialId',
      code: 'not_purity',
      message: `${material.name} is certified for a content, not a purity; a stock weighed from it needs a purity.`,
    };
  return null;
}

export function toPreparationDto(p: StandardPreparation): PreparationDto {
  const m = p.material;
  return {
    id: p.id,
    name: p.name,
    material: m ? { id: m.id, name: m.name, lot: m.lot, certificateNumber: m.certificateNumber, expiresOn: m.expiresOn } : null,
    source: p.input.source,
    stock: p.input.stock,
    steps: p.input.steps,
    result: p.result,
    engineVersion: p.engineVersion,
    createdBy: { id: p.createdBy.id, name: p.createdBy.name },
    createdAt: p.createdAt.toISOString(),
  };
}

@Injectable()
export class PreparationsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly audit: AuditService,
  ) {}

  async preview(dto: PreparationPreviewRequestDto): Promise<PreparationPreviewDto> {
    return (await this.compute(this.dataSource.manager, dto)).result;
  }

  async create(dto: CreatePreparationDto, actor: AuthUser): Promise<PreparationDto> {
    const id = await writeTransaction(this.dataSource, async (manager) => {
      const { input, material, result } = await this.compute(manager, dto);
      const saved = await manager.save(
        manager.create(StandardPreparation, {
          name: dto.name,
          materialId: material?.id ?? null,
          input,
          result,
          engineVersion: ENGINE_VERSION,
          createdById: actor.id,
        }),
      );
      await this.audit.record(
        {
          actor,
          action: 'preparation.created',
          entity: 'preparation',
          entityId: saved.id,
          changes: createdFields({
            name: dto.name,
            materialId: material?.id ?? null,
            lot: material?.lot ?? null,
            stockConcentration: result.stock.concentration,
            stockU: result.stock.u,
            steps: result.steps.length,
          }),
        },
        manager,
      );
      return saved.id;
    });
    return this.findOne(id);
  }

  async findAll(): Promise<PreparationDto[]> {
    const all = await this.dataSource
      .getRepository(StandardPreparation)
      .find({ relations: { material: true, createdBy: true }, order: { createdAt: 'DESC' }, take: 500 });
    return all.map(toPreparationDto);
  }

  async findOne(id: string): Promise<PreparationDto> {
    const found = await this.dataSource
      .getRepository(StandardPreparation)
      .findOne({ where: { id }, relations: { material: true, createdBy: true } });
    if (!found) throw new NotFoundException('Preparation not found.');
    return toPreparationDto(found);
  }

  /** Refusals for standards of a study that name a preparation: it must exist and its material be in use. */
  async studyStandardErrors(manager: EntityManager, data: Record<string, unknown>): Promise<FieldError[]> {
    const standards = Array.isArray(data.standards) ? (data.standards as unknown[]) : [];
    const named = standards
      .map((s, i) => ({ i, id: (s as { preparationId?: unknown } | null)?.preparationId }))
      .filter((s): s is { i: number; id: string } => typeof s.id === 'string' && /^[0-9a-f-]{36}$/i.test(s.id));
    if (!named.length) return [];
    const found = await manager.find(StandardPreparation, {
      where: { id: In([...new Set(named.map((s) => s.id))]) },
      relations: { material: true },
    });
    const byId = new Map(found.map((p) => [p.id, p]));
    const today = todayIso();
    return named.flatMap(({ i, id }): FieldError[] => {
      const field = `standards[${i}].preparationId`;
      const preparation = byId.get(id);
      if (!preparation) return [{ field, code: 'not_found', message: `Standard ${i + 1}: there is no saved preparation with this id.` }];
      const material = preparation.material;
      if (!material) return [];
      const status = referenceMaterialStatus(material, today);
      if (status === 'in-use') return [];
      return [{ field, code: `material_${status}`, message: `Standard ${i + 1}: ${STATUS_REFUSALS[status](material)}` }];
    });
  }

  private async compute(manager: EntityManager, dto: PreparationPreviewRequestDto) {
    const { material, source } = await this.resolveSource(manager, dto.source);
    const input: StoredPreparationInput = {
      source,
      stock: plainFields(dto.stock, STOCK_FIELDS),
      steps: dto.steps.map((step) => plainFields(step, STEP_FIELDS)),
    };
    const errors = preparationErrors(input);
    if (errors.length) throw unprocessable(humanizePreparationErrors(errors), 'The preparation cannot be calculated; nothing was saved.');
    const computed = preparationUncertainty(input);
    const result: PreparationPreviewDto = {
      stock: {
        concentration: computed.stock.concentration,
        u: computed.stock.u,
        relativeU: computed.stock.relativeU,
        unit: computed.stock.unit,
        budget: computed.stock.budget.map(({ quantity, label, value, u, relativeU, contribution }) => ({
          quantity,
          label,
          value,
          u,
          relativeU,
          contribution,
        })),
      },
      steps: computed.steps.map(({ concentration, u, relativeU }) => ({ concentration, u, relativeU })),
    };
    return { input, material, result };
  }

  private async resolveSource(manager: EntityManager, source: PreparationPreviewRequestDto['source']) {
    const hasValues = source.purity !== undefined || source.uPurity !== undefined;
    if (source.materialId !== undefined && hasValues)
      throw unprocessable([{ field: 'source', code: 'ambiguous', message: 'Choose a reference material or enter a purity, not both.' }]);
    if (source.materialId === undefined) {
      if (!hasValues)
        throw unprocessable([
          { field: 'source', code: 'required', message: 'Choose a reference material or enter a purity with its uncertainty.' },
        ]);
      return { material: null, source: { purity: source.purity as number, uPurity: source.uPurity as number } };
    }
    const material = await manager.findOneBy(ReferenceMaterial, { id: source.materialId });
    if (!material)
      throw unprocessable([{ field: 'source.materialId', code: 'not_found', message: 'There is no reference material with this id.' }]);
    const refusal = materialRefusal(material);
    if (refusal) throw unprocessable([refusal], 'This reference material cannot be used.');
    return { material, source: { purity: material.certifiedValue, uPurity: certifiedStandardUncertainty(material) } };
  }
}

const STOCK_FIELDS = [
  'mass',
  'uMass',
  'massUnit',
  'volume',
  'volumeTolerance',
  'volumeDistribution',
  'volumeRepeatability',
  'temperatureRange',
  'expansionCoefficient',
] as const satisfies readonly (keyof PreparationStock)[];
const STEP_FIELDS = [
  'aliquot',
  'aliquotTolerance',
  'aliquotDistribution',
  'volume',
  'volumeTolerance',
  'volumeDistribution',
] as const satisfies readonly (keyof PreparationStep)[];

/** The request's fields as a plain object for the JSON column, in a fixed order, optional ones only where given. */
function plainFields<T extends object>(dto: T, fields: readonly (keyof T)[]): T {
  return Object.fromEntries(fields.filter((field) => dto[field] !== undefined).map((field) => [field, dto[field]])) as T;
}
