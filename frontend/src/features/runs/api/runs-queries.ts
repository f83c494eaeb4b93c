import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import type {
  ImportMappingDto,
  QcSeries,
  QcTrendsDto,
  RunControlChartDto,
  RunMethodChoiceDto,
  RunDto,
  RunOptionsDto,
  RunPageDto,
} from '@meritline/shared';
import { api } from '@/lib/api-client';
import type { RunFilters } from './types';

const search = (filters: RunFilters) => {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(filters)) if (value !== undefined && value !== '') params.set(key, String(value));
  const text = params.toString();
  return text ? `?${text}` : '';
};

export const runsQueries = {
  all: ['runs'] as const,
  lists: () => [...runsQueries.all, 'list'] as const,
  list: (filters: RunFilters) =>
    queryOptions({
      queryKey: [...runsQueries.lists(), filters],
      queryFn: ({ signal }) => api.get<RunPageDto>(`/runs${search(filters)}`, { signal }),
      placeholderData: keepPreviousData,
    }),
  detail: (runId: string) =>
    queryOptions({
      queryKey: [...runsQueries.all, 'detail', runId],
      queryFn: ({ signal }) => api.get<RunDto>(`/runs/${encodeURIComponent(runId)}`, { signal }),
      // Runs never change once saved.
      staleTime: Infinity,
    }),
  methodChoices: () =>
    queryOptions({
      queryKey: [...runsQueries.all, 'method-choices'],
      queryFn: ({ signal }) => api.get<RunMethodChoiceDto[]>('/runs/method-choices', { signal }),
    }),
  options: (methodVersionId: string) =>
    queryOptions({
      queryKey: [...runsQueries.all, 'options', methodVersionId],
      queryFn: ({ signal }) => api.get<RunOptionsDto>(`/method-versions/${encodeURIComponent(methodVersionId)}/run-options`, { signal }),
    }),
  controlChart: (methodVersionId: string) =>
    queryOptions({
      queryKey: [...runsQueries.all, 'control-chart', methodVersionId],
      queryFn: ({ signal }) =>
        api.get<RunControlChartDto>(`/method-versions/${encodeURIComponent(methodVersionId)}/control-chart`, { signal }),
    }),
  importMapping: (methodVersionId: string) =>
    queryOptions({
      queryKey: [...runsQueries.all, 'import-mapping', methodVersionId],
      queryFn: ({ signal }) =>
        api.get<ImportMappingDto>(`/method-versions/${encodeURIComponent(methodVersionId)}/import-mapping`, { signal }),
    }),
  qcTrends: (methodId: string, series: QcSeries, versionId: string) =>
    queryOptions({
      queryKey: [...runsQueries.all, 'qc-trends', methodId, series, versionId],
      queryFn: ({ signal }) =>
        api.get<QcTrendsDto>(
          `/methods/${encodeURIComponent(methodId)}/qc-trends?series=${series}${versionId ? `&versionId=${encodeURIComponent(versionId)}` : ''}`,
          { signal },
        ),
    }),
};
