import type { ImportMappingColumns, ImportMappingDto, InstrumentImportResult } from '@meritline/shared';
import { api } from '@/lib/api-client';

const base = (versionId: string) => `/method-versions/${encodeURIComponent(versionId)}`;

export function uploadInstrumentExport(versionId: string, file: File): Promise<InstrumentImportResult> {
  const form = new FormData();
  form.append('file', file);
  return api.post<InstrumentImportResult>(`${base(versionId)}/instrument-import`, form);
}

export function saveImportMapping(versionId: string, columns: ImportMappingColumns, lockVersion: number): Promise<ImportMappingDto> {
  return api.put<ImportMappingDto>(`${base(versionId)}/import-mapping`, { columns, lockVersion });
}
