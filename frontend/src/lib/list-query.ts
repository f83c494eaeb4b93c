import { queryOptions } from '@tanstack/react-query';
import { api } from './api-client';

/** The query of a resource the server answers as one whole list at `path`, cached under the resource's key and 'list'. */
export const wholeListQuery = <T>(all: readonly [string], path: string, options: { staleTime?: number } = {}) =>
  queryOptions({
    queryKey: [...all, 'list'],
    queryFn: ({ signal }) => api.get<T[]>(path, { signal }),
    ...options,
  });
