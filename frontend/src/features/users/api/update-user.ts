import type { Role, UserDto } from '@meritline/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import * as yup from 'yup';
import { authQueries } from '@/lib/auth';
import { api } from '@/lib/api-client';
import { nameField, rolesField } from './role-rules';
import { usersQueries } from './users-queries';

export const editUserSchema = yup.object({ name: nameField, roles: rolesField });

export type EditUserValues = yup.InferType<typeof editUserSchema>;

export interface UserChanges {
  name?: string;
  roles?: Role[];
  active?: boolean;
}

export function useUpdateUser(options: { inlineErrors?: boolean } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, changes }: { id: string; changes: UserChanges }) => api.patch<UserDto>(`/users/${encodeURIComponent(id)}`, changes),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: usersQueries.all }),
        // An administrator may have changed their own roles.
        queryClient.invalidateQueries({ queryKey: authQueries.all }),
      ]),
    meta: { inlineErrors: options.inlineErrors },
  });
}
