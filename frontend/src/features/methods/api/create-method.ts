import type { MethodDto } from '@meritline/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import * as yup from 'yup';
import type { CriterionDefinition } from '@/components/study-results';
import { api } from '@/lib/api-client';
import { methodsQueries } from './methods-queries';

const text = (label: string, max: number) => yup.string().trim().required(label).max(max, `Use at most ${max} characters.`);

export const createMethodSchema = yup.object({
  name: text('Name the method.', 160),
  analyte: text('Name the analyte.', 120),
  matrix: text('Name the matrix, e.g. drinking water.', 120),
  technique: text('Name the technique.', 80),
  xUnit: text('Enter the concentration unit.', 30),
  yUnit: text('Enter the response unit.', 30),
  purpose: yup.string().required('Choose a starting set of acceptance criteria.'),
  changeSummary: yup.string().trim().max(500, 'Use at most 500 characters.').default(''),
});

export type CreateMethodValues = yup.InferType<typeof createMethodSchema>;

export function useCreateMethod() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (values: CreateMethodValues & { criteria?: CriterionDefinition[] }) =>
      api.post<MethodDto>('/methods', { ...values, changeSummary: values.changeSummary || undefined }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: methodsQueries.all }),
    meta: { inlineErrors: true },
  });
}
