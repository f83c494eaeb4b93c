/** The notifications bell's cache key: a transition sends notices, so the bell refreshes after one. */
export const notificationKeys = { all: ['notifications'] as const };
