import type { QualificationRunDetailDto, QualificationRunDto } from '@meritline/shared';
import { queryOptions } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { saveFile } from '@/lib/save-file';

export const qualificationQueries = {
  all: ['qualification'] as const,
  list: () =>
    queryOptions({
      queryKey: [...qualificationQueries.all, 'list'],
      queryFn: ({ signal }) => api.get<QualificationRunDto[]>('/qualification', { signal }),
    }),
};

export const runQualification = () => api.post<QualificationRunDetailDto>('/qualification');

export async function downloadQualificationReport(id: string): Promise<void> {
  saveFile(await api.download(`/qualification/${encodeURIComponent(id)}/report`), `meritline-self-qualification-${id.slice(0, 8)}.pdf`);
}
