import type { ImportPreviewDto, ImportSection, StudyDto } from '@meritline/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { studiesQueries } from './studies-queries';

export interface ImportRequest {
  file: File;
  section: ImportSection;
  /** Target field → column header; a field mapped to null is left out. */
  mapping?: Record<string, string | null>;
}

function importForm({ file, section, mapping }: ImportRequest, extra: Record<string, string>) {
  const form = new FormData();
  form.append('file', file);
  form.append('section', section);
  if (mapping) form.append('mapping', JSON.stringify(mapping));
  for (const [key, value] of Object.entries(extra)) form.append(key, value);
  return form;
}

/** The server reads the file and answers what it would import; nothing is saved. */
export function usePreviewImport(studyId: string) {
  return useMutation({
    mutationFn: (request: ImportRequest) =>
      api.post<ImportPreviewDto>(`/studies/${encodeURIComponent(studyId)}/imports`, importForm(request, { dryRun: 'true' })),
    meta: { inlineErrors: true },
  });
}

/** Replaces the section with the file's rows; all or nothing. */
export function useApplyImport(studyId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ lockVersion, reason, ...request }: ImportRequest & { lockVersion: number; reason?: string }) =>
      api.post<StudyDto>(
        `/studies/${encodeURIComponent(studyId)}/imports`,
        importForm(request, { lockVersion: String(lockVersion), ...(reason ? { reason } : {}) }),
      ),
    onSuccess: (study) => {
      queryClient.setQueryData(studiesQueries.detail(studyId).queryKey, study);
      return queryClient.invalidateQueries({ queryKey: studiesQueries.lists() });
    },
    meta: { inlineErrors: true },
  });
}

export async function downloadImportTemplate(section: ImportSection) {
  const blob = await api.download(`/import-templates/${section}`);
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = `${section}-template.csv`;
  link.click();
  URL.revokeObjectURL(url);
}
