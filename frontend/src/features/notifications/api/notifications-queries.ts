import { queryOptions } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

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
  all: ['notifications'] as const,
  list: () =>
    queryOptions({
      queryKey: [...notificationsQueries.all, 'list'],
      queryFn: ({ signal }) => api.get<NotificationList>('/notifications', { signal }),
      refetchInterval: 60_000,
    }),
};
