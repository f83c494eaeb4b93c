import {
  ConflictException,
  Inject,
  Injectable,
  Logger,
  NotFoundException,
  type OnApplicationBootstrap,
  type OnApplicationShutdown,
} from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { createHash } from 'node:crypto';
import { DataSource, IsNull, type EntityManager } from 'typeorm';
import {
  canonicalJson,
  certifiedStandardUncertainty,
  daysBetween,
  EXPIRY_WARNING_DAYS,
  MAX_CERTIFICATE_BYTES,
  PURITY_UNIT,
  referenceMaterialStatus,
  Role,
  todayIso,
  type FieldError,
  type ReferenceMaterialDto,
  type ReferenceMaterialFields,
} from '@meritline/shared';
import type { FieldChanges } from '../audit/audit-entry.entity.js';
import { appConfig, type AppConfigType } from '../config/app.config.js';
import { AuditService, type AuditRecord } from '../audit/audit.service.js';
import type { AuthUser } from '../common/decorators/current-user.decorator.js';
import { unprocessable } from '../common/validation.js';
import { writeTransaction } from '../database/write-transaction.js';
import { MailService } from '../mail/mail.service.js';
import { UsersService } from '../users/users.service.js';
import type { CreateReferenceMaterialDto } from './dto/create-reference-material.dto.js';
import type { UpdateReferenceMaterialDto } from './dto/update-reference-material.dto.js';
import type { WithdrawReferenceMaterialDto } from './dto/withdraw-reference-material.dto.js';
import { ReferenceMaterial } from './reference-material.entity.js';

const EDITABLE = [
  'name',
  'analyte',
  'supplier',
  'lot',
  'certificateNumber',
  'valueKind',
  'certifiedValue',
  'unit',
  'expandedUncertainty',
  'coverageFactor',
  'standardUncertainty',
  'receivedOn',
  'openedOn',
  'expiresOn',
  'storage',
] as const satisfies readonly (keyof ReferenceMaterialFields)[];

const REQUIRED = EDITABLE.filter(
  (key) => !['expandedUncertainty', 'coverageFactor', 'standardUncertainty', 'openedOn', 'storage'].includes(key),
);

type Editable = Pick<ReferenceMaterial, (typeof EDITABLE)[number]>;

const DAY_MS = 24 * 60 * 60_000;
const EXPIRY_SERVICE: AuditRecord['actor'] = { id: null, name: 'Meritline (expiry check)' };

function validDay(day: string): boolean {
  const date = new Date(`${day}T00:00:00Z`);
  return !Number.isNaN(date.getTime()) && date.toISOString().slice(0, 10) === day;
}

/** The rules that concern more than one field, on the fields as they would be saved. */
export function referenceMaterialErrors(m: Editable): FieldError[] {
  const errors: FieldError[] = [];
  const add = (field: string, code: string, message: string) => errors.push({ field, code, message });
  if (m.valueKind === 'purity') {
    if (!(m.certifiedValue > 0 && m.certifiedValue <= 1))
      add('certifiedValue', 'out_of_range', 'A purity is a mass fraction: above 0 and at most 1 (e.g. 0.9995 for 99.95 %).');
    if (m.unit !== PURITY_UNIT) add('unit', 'invalid_value', `A purity is given in ${PURITY_UNIT}.`);
  }
  const hasStandard = m.standardUncertainty != null;
  const hasExpanded = m.expandedUncertainty != null || m.coverageFactor != null;
  if (hasStandard && hasExpanded)
    add(
      'standardUncertainty',
      'ambiguous',
      'Give either the expanded uncertainty with its coverage factor or the standard uncertainty, not both.',
    );
  else if (!hasStandard) {
    if (m.expandedUncertainty == null)
      add('expandedUncertainty', 'required', 'Give the expanded uncertainty from the certificate (or its standard uncertainty).');
    if (m.coverageFactor == null) add('coverageFactor', 'required', 'Give the coverage factor k printed with the expanded uncertainty.');
  }
  for (const field of ['receivedOn', 'openedOn', 'expiresOn'] as const) {
    const day = m[field];
    if (day != null && !validDay(day)) add(field, 'invalid_date', 'This date does not exist.');
  }
  if (errors.length) return errors;
  if (m.expiresOn < m.receivedOn) add('expiresOn', 'before_received', 'The expiry date cannot be before the date received.');
  if (m.openedOn != null && m.openedOn < m.receivedOn)
    add('openedOn', 'before_received', 'The date opened cannot be before the date received.');
  if (m.valueKind === 'purity' && certifiedStandardUncertainty(m) > m.certifiedValue)
    add('standardUncertainty', 'out_of_range', 'The uncertainty is larger than the purity itself; check the certificate.');
  return errors;
}

export function toReferenceMaterialDto(m: ReferenceMaterial, today = todayIso()): ReferenceMaterialDto {
  const status = referenceMaterialStatus(m, today);
  const daysToExpiry = daysBetween(today, m.expiresOn);
  return {
    id: m.id,
    name: m.name,
    analyte: m.analyte,
    supplier: m.supplier,
    lot: m.lot,
    certificateNumber: m.certificateNumber,
    valueKind: m.valueKind,
    certifiedValue: m.certifiedValue,
    unit: m.unit,
    expandedUncertainty: m.expandedUncertainty,
    coverageFactor: m.coverageFactor,
    standardUncertainty: certifiedStandardUncertainty(m),
    receivedOn: m.receivedOn,
    openedOn: m.openedOn,
    expiresOn: m.expiresOn,
    storage: m.storage,
    status,
    daysToExpiry,
    expiringSoon: status === 'in-use' && daysToExpiry <= EXPIRY_WARNING_DAYS,
    withdrawnReason: m.withdrawnReason,
    withdrawnAt: m.withdrawnAt?.toISOString() ?? null,
    certificate:
      m.certificateFileName && m.certificateUploadedAt
        ? {
            fileName: m.certificateFileName,
            sizeBytes: m.certificateSizeBytes ?? 0,
            sha256: m.certificateSha256 ?? '',
            uploadedAt: m.certificateUploadedAt.toISOString(),
          }
        : null,
    lockVersion: m.lockVersion,
    createdAt: m.createdAt.toISOString(),
    updatedAt: m.updatedAt.toISOString(),
  };
}

function staleMaterial() {
  return new ConflictException('Someone else changed this reference material; reload it and try again.');
}

function fileNameOf(name: string): string {
  const cleaned = name
    .replace(/[^\w.\- ]+/g, '_')
    .trim()
    .slice(0, 200);
  return cleaned.toLowerCase().endsWith('.pdf') ? cleaned : `${cleaned || 'certificate'}.pdf`;
}

@Injectable()
export class ReferenceMaterialsService implements OnApplicationBootstrap, OnApplicationShutdown {
  private readonly logger = new Logger(ReferenceMaterialsService.name);
  private timers: NodeJS.Timeout[] = [];

  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly audit: AuditService,
    private readonly mail: MailService,
    private readonly users: UsersService,
    @Inject(appConfig.KEY) private readonly config: AppConfigType,
  ) {}

  onApplicationBootstrap() {
    // Tests call sendExpiryNotices() themselves: a timer firing mid-test would add mail to outboxes they count.
    if (this.config.env === 'test') return;
    const check = () => void this.sendExpiryNotices().catch((e: Error) => this.logger.error(`Expiry check failed: ${e.message}`));
    // After start-up (the demo seed included), then daily.
    this.timers = [setTimeout(check, 5_000), setInterval(check, DAY_MS)];
    for (const timer of this.timers) timer.unref();
  }

  onApplicationShutdown() {
    for (const timer of this.timers) clearTimeout(timer);
  }

  async findAll(): Promise<ReferenceMaterialDto[]> {
    const materials = await this.dataSource.getRepository(ReferenceMaterial).find({ order: { name: 'ASC', lot: 'ASC' } });
    const today = todayIso();
    return materials.map((m) => toReferenceMaterialDto(m, today));
  }

  async findExpiring(): Promise<ReferenceMaterialDto[]> {
    return (await this.findAll()).filter((m) => m.expiringSoon).sort((a, b) => a.expiresOn.localeCompare(b.expiresOn));
  }

  async findOne(id: string, manager: EntityManager = this.dataSource.manager): Promise<ReferenceMaterialDto> {
    return toReferenceMaterialDto(await this.load(manager, id));
  }

  async load(manager: EntityManager, id: string): Promise<ReferenceMaterial> {
    const material = await manager.findOneBy(ReferenceMaterial, { id });
    if (!material) throw new NotFoundException('Reference material not found.');
    return material;
  }

  async create(dto: CreateReferenceMaterialDto, actor: AuthUser): Promise<ReferenceMaterialDto> {
    const fields = this.fieldsOf(dto);
    const errors = referenceMaterialErrors(fields);
    if (errors.length) throw unprocessable(errors, 'The reference material has invalid fields.');
    return writeTransaction(this.dataSource, async (manager) => {
      await this.assertUnique(manager, fields);
      const material = await manager.save(manager.create(ReferenceMaterial, { ...fields, createdById: actor.id }));
      const changes: FieldChanges = {};
      for (const key of EDITABLE) changes[key] = { from: null, to: fields[key] };
      await this.audit.record(
        { actor, action: 'reference-material.created', entity: 'reference-material', entityId: material.id, changes },
        manager,
      );
      return this.findOne(material.id, manager);
    });
  }

  async update(id: string, dto: UpdateReferenceMaterialDto, actor: AuthUser): Promise<ReferenceMaterialDto> {
    return writeTransaction(this.dataSource, async (manager) => {
      const material = await this.load(manager, id);
      if (dto.lockVersion !== material.lockVersion) throw staleMaterial();
      if (material.withdrawnAt) throw new ConflictException('A withdrawn reference material stays as it was withdrawn.');
      const cleared = REQUIRED.filter((key) => dto[key] === null);
      if (cleared.length)
        throw unprocessable(cleared.map((field) => ({ field, code: 'required', message: 'This field cannot be emptied.' })));
      const next = { ...this.pick(material), ...this.fieldsOf(dto) };
      if (next.valueKind === 'purity' && dto.unit === undefined) next.unit = PURITY_UNIT;
      const errors = referenceMaterialErrors(next);
      if (errors.length) throw unprocessable(errors, 'The reference material has invalid fields.');
      const changes: FieldChanges = {};
      for (const key of EDITABLE) {
        if (canonicalJson(material[key] ?? null) !== canonicalJson(next[key] ?? null))
          changes[key] = { from: material[key], to: next[key] };
      }
      if (Object.keys(changes).length === 0) return toReferenceMaterialDto(material);
      if (changes.name || changes.supplier || changes.certificateNumber || changes.lot) await this.assertUnique(manager, next, id);
      // A new expiry date deserves its own notice.
      const expiryNoticeSentAt = changes.expiresOn ? null : material.expiryNoticeSentAt;
      await this.saveLocked(manager, material, { ...next, expiryNoticeSentAt });
      await this.audit.record(
        { actor, action: 'reference-material.updated', entity: 'reference-material', entityId: id, changes },
        manager,
      );
      return this.findOne(id, manager);
    });
  }

  async withdraw(id: string, dto: WithdrawReferenceMaterialDto, actor: AuthUser): Promise<ReferenceMaterialDto> {
    return writeTransaction(this.dataSource, async (manager) => {
      const material = await this.load(manager, id);
      if (dto.lockVersion !== material.lockVersion) throw staleMaterial();
      if (material.withdrawnAt) throw new ConflictException('This reference material is already withdrawn.');
      const withdrawnAt = new Date();
      await this.saveLocked(manager, material, { withdrawnAt, withdrawnReason: dto.reason });
      await this.audit.record(
        {
          actor,
          action: 'reference-material.withdrawn',
          entity: 'reference-material',
          entityId: id,
          changes: { status: { from: referenceMaterialStatus(material, todayIso()), to: 'withdrawn' } },
          reason: dto.reason,
        },
        manager,
      );
      return this.findOne(id, manager);
    });
  }

  async uploadCertificate(
    id: string,
    file: Express.Multer.File | undefined,
    lockVersion: number,
    actor: AuthUser,
  ): Promise<ReferenceMaterialDto> {
    if (!file) throw unprocessable([{ field: 'file', code: 'required', message: 'Choose the certificate as a PDF file.' }]);
    if (file.size > MAX_CERTIFICATE_BYTES)
      throw unprocessable([{ field: 'file', code: 'too_large', message: 'The certificate may be at most 10 MB.' }]);
    if (file.buffer.subarray(0, 5).toString('latin1') !== '%PDF-')
      throw unprocessable([{ field: 'file', code: 'not_pdf', message: 'This file is not a PDF; upload the certificate as a PDF.' }]);
    return writeTransaction(this.dataSource, async (manager) => {
      const material = await this.load(manager, id);
      if (lockVersion !== material.lockVersion) throw staleMaterial();
      if (material.withdrawnAt) throw new ConflictException('A withdrawn reference material stays as it was withdrawn.');
      const sha256 = createHash('sha256').update(file.buffer).digest('hex');
      const fileName = fileNameOf(file.originalname);
      await this.saveLocked(manager, material, {
        certificatePdf: file.buffer,
        certificateFileName: fileName,
        certificateSizeBytes: file.size,
        certificateSha256: sha256,
        certificateUploadedAt: new Date(),
      });
      await this.audit.record(
        {
          actor,
          action: 'reference-material.certificate-uploaded',
          entity: 'reference-material',
          entityId: id,
          changes: {
            certificateSha256: { from: material.certificateSha256, to: sha256 },
            certificateFileName: { from: material.certificateFileName, to: fileName },
          },
        },
        manager,
      );
      return this.findOne(id, manager);
    });
  }

  async certificate(id: string): Promise<{ pdf: Buffer; fileName: string }> {
    const material = await this.dataSource
      .getRepository(ReferenceMaterial)
      .createQueryBuilder('m')
      .addSelect('m.certificatePdf')
      .where('m.id = :id', { id })
      .getOne();
    if (!material) throw new NotFoundException('Reference material not found.');
    if (!material.certificatePdf || !material.certificateFileName)
      throw new NotFoundException('No certificate has been uploaded for this reference material.');
    return { pdf: Buffer.from(material.certificatePdf), fileName: material.certificateFileName };
  }

  /** One e-mail to the quality managers per material entering the last EXPIRY_WARNING_DAYS days; returns how many were announced. */
  async sendExpiryNotices(today = todayIso()): Promise<number> {
    const due = await writeTransaction(this.dataSource, async (manager) => {
      const candidates = await manager.find(ReferenceMaterial, { where: { withdrawnAt: IsNull(), expiryNoticeSentAt: IsNull() } });
      const expiring = candidates.filter((m) => {
        const days = daysBetween(today, m.expiresOn);
        return days >= 0 && days <= EXPIRY_WARNING_DAYS;
      });
      for (const material of expiring) {
        await manager.update(ReferenceMaterial, { id: material.id }, { expiryNoticeSentAt: new Date() });
        await this.audit.record(
          {
            actor: EXPIRY_SERVICE,
            action: 'reference-material.expiry-notice-sent',
            entity: 'reference-material',
            entityId: material.id,
            changes: { expiresOn: { from: null, to: material.expiresOn } },
          },
          manager,
        );
      }
      return expiring;
    });
    if (!due.length) return 0;
    const managers = (await this.users.findActiveWithRole(Role.QualityManager)).map((user) => user.email);
    for (const material of due) {
      const days = daysBetween(today, material.expiresOn);
      await this.mail.send({
        to: managers,
        subject: `Reference material expires ${days === 0 ? 'today' : `in ${days} day${days === 1 ? '' : 's'}`}: ${material.name}, lot ${material.lot}`,
        text: [
          `${material.name} (${material.analyte}), lot ${material.lot}, certificate ${material.certificateNumber} from ${material.supplier}`,
          `may be used up to and including ${material.expiresOn}.`,
          '',
          'Order a replacement or plan its withdrawal according to your procedures. Preparations from it are refused after that date.',
          '',
          this.mail.link('/standards'),
        ].join('\n'),
      });
    }
    return due.length;
  }

  private async assertUnique(manager: EntityManager, fields: Editable, exceptId?: string) {
    const existing = await manager.findOneBy(ReferenceMaterial, {
      supplier: fields.supplier,
      certificateNumber: fields.certificateNumber,
      lot: fields.lot,
    });
    if (existing && existing.id !== exceptId) {
      throw new ConflictException({
        statusCode: 409,
        message: 'This supplier, certificate and lot are already registered.',
        errors: [{ field: 'lot', code: 'duplicate', message: 'This supplier, certificate and lot are already registered.' }],
      });
    }
  }

  /** Writes only if nobody changed the material since it was read. */
  private async saveLocked(manager: EntityManager, material: ReferenceMaterial, patch: Partial<ReferenceMaterial>) {
    const result = await manager.update(
      ReferenceMaterial,
      { id: material.id, lockVersion: material.lockVersion },
      { ...patch, lockVersion: material.lockVersion + 1, updatedAt: new Date() },
    );
    if (!result.affected) throw staleMaterial();
  }

  private pick(m: ReferenceMaterial): Editable {
    return Object.fromEntries(EDITABLE.map((key) => [key, m[key]])) as Editable;
  }

  /** The fields a request sets; `null` clears an optional one, a missing field keeps it. */
  private fieldsOf(dto: Partial<ReferenceMaterialFields>): Editable {
    const entries = EDITABLE.filter((key) => dto[key] !== undefined).map((key) => [key, dto[key]]);
    const fields = Object.fromEntries(entries) as Editable;
    if (dto.storage !== undefined) fields.storage = dto.storage ?? '';
    if (fields.valueKind === 'purity' && fields.unit === undefined) fields.unit = PURITY_UNIT;
    return fields;
  }
}
