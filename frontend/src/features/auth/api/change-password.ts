import { useMutation } from '@tanstack/react-query';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import { newPasswordField } from './password-rules';

export const changePasswordSchema = yup.object({
  currentPassword: yup.string().required('Enter your current password.'),
  newPassword: newPasswordField.notOneOf([yup.ref('currentPassword')], 'Choose a password different from the current one.'),
  confirmPassword: yup
    .string()
    .required('Repeat the new password.')
    .oneOf([yup.ref('newPassword')], 'The two passwords are not the same.'),
});

export type ChangePasswordValues = yup.InferType<typeof changePasswordSchema>;

export function useChangePassword() {
  return useMutation({
    mutationFn: ({ currentPassword, newPassword }: ChangePasswordValues) =>
      api.post<void>('/auth/change-password', { currentPassword, newPassword }),
    meta: { inlineErrors: true },
  });
}
