import { queryOptions } from '@tanstack/react-query';
import { api } from './api-client';

/** The query of a resource the server answers as one whole list at `/api/<resource>`, cached under `[resource, 'list']`. */
export const wholeListQuery = <T>([resource]: readonly [string], options: { staleTime?: number } = {}) =>
  queryOptions({
    queryKey: [resource, 'list'],
    queryFn: ({ signal }) => api.get<T[]>(`/${resource}`, { signal }),
    ...options,
  });
