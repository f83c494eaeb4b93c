import type { QualificationRunDetailDto, QualificationRunDto } from '@meritline/shared';
import { api } from '@/lib/api-client';
import { wholeListQuery } from '@/lib/list-query';
import { saveFile } from '@/lib/save-file';

export const qualificationQueries = {
  all: ['qualification'] as const,
  list: () => wholeListQuery<QualificationRunDto>(qualificationQueries.all),
};

export const runQualification = () => api.post<QualificationRunDetailDto>('/qualification');

export async function downloadQualificationReport(id: string): Promise<void> {
  saveFile(await api.download(`/qualification/${encodeURIComponent(id)}/report`), `meritline-self-qualification-${id.slice(0, 8)}.pdf`);
}
