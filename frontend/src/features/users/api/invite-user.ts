import type { UserDto } from '@meritline/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import { nameField, rolesField } from './role-rules';
import { usersQueries } from './users-queries';

export const inviteUserSchema = yup.object({
  email: yup.string().trim().required('Enter the e-mail address.').email('Enter a valid e-mail address.'),
  name: nameField,
  roles: rolesField,
});

export type InviteUserValues = yup.InferType<typeof inviteUserSchema>;

export function useInviteUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (values: InviteUserValues) => api.post<UserDto>('/users/invitations', values),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: usersQueries.all }),
    meta: { inlineErrors: true },
  });
}
