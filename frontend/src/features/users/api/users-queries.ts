import type { UserDto } from '@meritline/shared';
import { wholeListQuery } from '@/lib/list-query';

export const usersQueries = {
  all: ['users'] as const,
  list: () => wholeListQuery<UserDto>(usersQueries.all),
};
