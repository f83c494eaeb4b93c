import type { LoginResponse } from '@meritline/shared';
import { useMutation } from '@tanstack/react-query';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import { useStartSession } from '@/lib/auth';
import { newPasswordField, PASSWORD_MIN_LENGTH } from './password-rules';

export const acceptInvitationSchema = yup.object({
  name: yup.string().trim().required('Enter your name as colleagues should see it.').max(120, 'Use at most 120 characters.'),
  password: newPasswordField,
  confirmPassword: yup
    .string()
    .required('Repeat the password.')
    .oneOf([yup.ref('password')], 'The two passwords are not the same.'),
});

export type AcceptInvitationValues = yup.InferType<typeof acceptInvitationSchema>;

export function useAcceptInvitation(token: string) {
  const startSession = useStartSession();
  return useMutation({
    mutationFn: ({ name, password }: AcceptInvitationValues) =>
      api.post<LoginResponse>('/auth/accept-invitation', { token, name, password }, { public: true }),
    onSuccess: startSession,
    meta: { inlineErrors: true },
  });
}

export { PASSWORD_MIN_LENGTH };
