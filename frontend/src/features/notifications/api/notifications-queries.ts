import { queryOptions } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { notificationKeys } from '@/lib/query-keys';

export interface NotificationItem {
  id: string;
  kind: string;
  message: string;
  link: string | null;
  readAt: string | null;
  createdAt: string;
}

export interface NotificationList {
  items: NotificationItem[];
  unread: number;
}

export const notificationsQueries = {
  ...notificationKeys,
  list: () =>
    queryOptions({
      queryKey: notificationKeys.lists(),
      queryFn: ({ signal }) => api.get<NotificationList>('/notifications', { signal }),
      refetchInterval: 60_000,
    }),
};
