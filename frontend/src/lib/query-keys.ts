/**
 * Cache keys of the resources that more than one feature reads. Every factory builds on these levels, and every
 * mutation invalidates through them, so a change made on one screen refreshes every other screen showing it.
 */
export const studyKeys = {
  all: ['studies'] as const,
  lists: () => [...studyKeys.all, 'list'] as const,
  list: (params: object) => [...studyKeys.lists(), params] as const,
  details: () => [...studyKeys.all, 'detail'] as const,
  detail: (id: string) => [...studyKeys.details(), id] as const,
};

export const reviewQueueKeys = {
  all: ['review-queue'] as const,
  lists: () => [...reviewQueueKeys.all, 'list'] as const,
};

export const notificationKeys = {
  all: ['notifications'] as const,
  lists: () => [...notificationKeys.all, 'list'] as const,
};
