import type { LoginResponse } from '@meritline/shared';
import { useMutation } from '@tanstack/react-query';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import { useStartSession } from '@/lib/auth';

export const signInSchema = yup.object({
  email: yup.string().trim().required('Enter your e-mail address.').email('Enter a valid e-mail address.'),
  password: yup.string().required('Enter your password.'),
});

export type SignInValues = yup.InferType<typeof signInSchema>;

export function useSignIn() {
  const startSession = useStartSession();
  return useMutation({
    mutationFn: (values: SignInValues) => api.post<LoginResponse>('/auth/login', values, { public: true }),
    onSuccess: startSession,
    meta: { inlineErrors: true },
  });
}
