import type { NotificationListDto } from '@meritline/shared';
import { queryOptions } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { notificationKeys } from '@/lib/query-keys';

export const notificationsQueries = {
  ...notificationKeys,
  list: () =>
    queryOptions({
      queryKey: notificationKeys.lists(),
      queryFn: ({ signal }) => api.get<NotificationListDto>('/notifications', { signal }),
      refetchInterval: 60_000,
    }),
};
