import { ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import {
  IMPORT_MAPPING_FIELDS,
  type FieldError,
  type ImportMappingColumns,
  type ImportMappingDto,
  type InstrumentImportResult,
  type PutImportMappingRequest,
} from '@meritline/shared';
import { AuditService } from '../audit/audit.service.js';
import type { AuthUser } from '../common/decorators/current-user.decorator.js';
import { unprocessable } from '../common/validation.js';
import { writeTransaction } from '../database/write-transaction.js';
import { MethodVersion } from '../methods/method-version.entity.js';
import { readImportTable } from '../studies/import-table.js';
import { readInstrumentExport } from './instrument-import.js';
import { RunImportMapping } from './run-import-mapping.entity.js';

const REQUIRED = ['sampleId', 'sampleType', 'response'] as const;
const MAX_HEADER = 200;

const toDto = (methodVersionId: string, m: RunImportMapping | null): ImportMappingDto => ({
  methodVersionId,
  columns: m?.columns ?? null,
  lockVersion: m?.lockVersion ?? 0,
  updatedBy: m?.updatedByName ?? null,
  updatedAt: m?.updatedAt.toISOString() ?? null,
});

/** Instrument exports of any column layout: mapped once per method version, read the same way for every run after. */
@Injectable()
export class InstrumentImportService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly audit: AuditService,
  ) {}

  private async assertVersion(id: string): Promise<void> {
    if (!(await this.dataSource.getRepository(MethodVersion).existsBy({ id }))) throw new NotFoundException('Method version not found.');
  }

  private mapping(methodVersionId: string): Promise<RunImportMapping | null> {
    return this.dataSource.getRepository(RunImportMapping).findOneBy({ methodVersionId });
  }

  async get(methodVersionId: string): Promise<ImportMappingDto> {
    await this.assertVersion(methodVersionId);
    return toDto(methodVersionId, await this.mapping(methodVersionId));
  }

  async put(methodVersionId: string, dto: PutImportMappingRequest, actor: AuthUser): Promise<ImportMappingDto> {
    await this.assertVersion(methodVersionId);
    const columns = checkColumns(dto.columns);
    await writeTransaction(this.dataSource, async (manager) => {
      const repo = manager.getRepository(RunImportMapping);
      const current = await repo.findOneBy({ methodVersionId });
      if ((current?.lockVersion ?? 0) !== dto.lockVersion)
        throw new ConflictException('The column mapping of this version was changed since you loaded it; reload it and map again.');
      const updatedAt = new Date();
      if (current) {
        const result = await manager
          .createQueryBuilder()
          .update(RunImportMapping)
          .set({ columns, updatedByName: actor.name, updatedAt, lockVersion: () => 'lock_version + 1' })
          .where('id = :id AND lock_version = :lockVersion', { id: current.id, lockVersion: current.lockVersion })
          .execute();
        if (result.affected !== 1) throw new ConflictException('Someone else saved a mapping at the same moment; reload it and try again.');
      } else {
        await repo.insert({ methodVersionId, columns, updatedByName: actor.name, updatedAt, lockVersion: 1 });
      }
      await this.audit.record(
        {
          actor,
          action: 'run-import-mapping.saved',
          entity: 'method-version',
          entityId: methodVersionId,
          changes: { importMapping: { from: current?.columns ?? null, to: columns } },
        },
        manager,
      );
    });
    return toDto(methodVersionId, await this.mapping(methodVersionId));
  }

  /** Without a saved mapping: the file's columns to map. With one: the run data, or a 422 naming each line and column that does not fit. */
  async read(methodVersionId: string, file: Buffer): Promise<InstrumentImportResult> {
    await this.assertVersion(methodVersionId);
    const table = await readImportTable(file);
    const saved = await this.mapping(methodVersionId);
    if (!saved) return { status: 'needs-mapping', columns: table.columns, preview: table.rows.slice(0, 5).map((r) => r.cells) };
    const { data, errors } = readInstrumentExport(table, saved.columns);
    if (errors.length) {
      const shown = errors.slice(0, 50);
      throw unprocessable(
        shown,
        `The file does not fit the column mapping saved for this version, so nothing was imported: ${shown[0].message}`,
      );
    }
    return { status: 'parsed', columns: table.columns, data, rows: table.rows.length };
  }
}

function checkColumns(input: unknown): ImportMappingColumns {
  const errors: FieldError[] = [];
  const value = (typeof input === 'object' && input !== null ? input : {}) as Record<string, unknown>;
  for (const key of Object.keys(value))
    if (!(IMPORT_MAPPING_FIELDS as readonly string[]).includes(key))
      errors.push({ field: `columns.${key}`, code: 'unknown_field', message: `${key} is not a field of the mapping.` });
  const columns = {} as Record<string, string | null>;
  for (const field of IMPORT_MAPPING_FIELDS) {
    const header = value[field];
    const required = (REQUIRED as readonly string[]).includes(field);
    if (header === null || header === undefined || header === '') {
      if (required) errors.push({ field: `columns.${field}`, code: 'required', message: 'Choose the column that holds this.' });
      columns[field] = null;
    } else if (typeof header !== 'string' || header.length > MAX_HEADER) {
      errors.push({ field: `columns.${field}`, code: 'invalid', message: `Give a column header of at most ${MAX_HEADER} characters.` });
    } else columns[field] = header;
  }
  const used = Object.entries(columns).filter(([, h]) => h !== null);
  for (const [field, header] of used)
    if (used.find(([, h]) => h === header)![0] !== field)
      errors.push({ field: `columns.${field}`, code: 'duplicate', message: `The column “${header}” is already mapped to another field.` });
  if (errors.length) throw unprocessable(errors, 'The column mapping is not complete.');
  return columns as unknown as ImportMappingColumns;
}
