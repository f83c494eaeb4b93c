import type { AuditPersonDto, AuditReviewDto, AuditTrailPageDto, AuditVerificationDto, CreateAuditReviewRequest } from '@meritline/shared';
import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { saveFile } from '@/lib/save-file';

export interface AuditFilters {
  record?: string;
  user?: string;
  action?: string;
  from?: string;
  to?: string;
  q?: string;
}

export const AUDIT_PAGE_SIZE = 25;

const search = (params: Record<string, string | number | undefined>) => {
  const query = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) if (value !== undefined && value !== '') query.set(key, String(value));
  const text = query.toString();
  return text ? `?${text}` : '';
};

export const auditQueries = {
  all: ['audit'] as const,
  page: (filters: AuditFilters, cursor: number | undefined) =>
    queryOptions({
      queryKey: [...auditQueries.all, 'page', filters, cursor ?? null],
      queryFn: ({ signal }) => api.get<AuditTrailPageDto>(`/audit${search({ ...filters, cursor, pageSize: AUDIT_PAGE_SIZE })}`, { signal }),
      placeholderData: keepPreviousData,
    }),
  people: () =>
    queryOptions({
      queryKey: [...auditQueries.all, 'people'],
      queryFn: ({ signal }) => api.get<AuditPersonDto[]>('/audit/people', { signal }),
    }),
  reviews: () =>
    queryOptions({
      queryKey: [...auditQueries.all, 'reviews'],
      queryFn: ({ signal }) => api.get<AuditReviewDto[]>('/audit/reviews', { signal }),
    }),
};

export const verifyChain = () => api.get<AuditVerificationDto>('/audit/verify');

export const markReviewed = (request: CreateAuditReviewRequest) =>
  api.post<AuditReviewDto>('/audit/reviews', request, { passwordCheck: true });

export async function downloadAuditExtract(filters: AuditFilters, format: 'csv' | 'pdf'): Promise<void> {
  const stamp = new Date().toISOString().slice(0, 19).replace(/[:T]/g, '-');
  saveFile(await api.download(`/audit/export${search({ ...filters, format })}`), `meritline-audit-trail-${stamp}.${format}`);
}
