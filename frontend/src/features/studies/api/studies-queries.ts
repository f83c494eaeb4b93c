import type { StudyDto, StudyPageDto } from '@meritline/shared';
import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { studyKeys } from '@/lib/query-keys';
import type { StudyListParams } from './types';

function listSearch(params: StudyListParams): string {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) {
    if (value === undefined || value === '' || value === false) continue;
    search.set(key, String(value));
  }
  return search.toString();
}

export const studiesQueries = {
  ...studyKeys,
  list: (params: StudyListParams) =>
    queryOptions({
      queryKey: studyKeys.list(params),
      queryFn: ({ signal }) => api.get<StudyPageDto>(`/studies?${listSearch(params)}`, { signal }),
      placeholderData: keepPreviousData,
    }),
  detail: (id: string) =>
    queryOptions({
      queryKey: studyKeys.detail(id),
      queryFn: ({ signal }) => api.get<StudyDto>(`/studies/${encodeURIComponent(id)}`, { signal }),
      // The wizard holds its own draft; a background refetch must not overwrite what is being typed.
      staleTime: Infinity,
      refetchOnWindowFocus: false,
    }),
};
