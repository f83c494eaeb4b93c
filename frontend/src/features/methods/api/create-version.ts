import { useMutation, useQueryClient } from '@tanstack/react-query';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import { methodsQueries } from './methods-queries';
import type { MethodVersionDto } from './types';
import { changeSummaryField, criteriaField, fromCriterionRows, settingsSchema, type CriterionRow } from './version-rules';

export const versionFormSchema = yup.object({
  changeSummary: changeSummaryField,
  criteria: criteriaField,
  settings: settingsSchema,
});

export type VersionFormValues = Omit<yup.InferType<typeof versionFormSchema>, 'criteria' | 'settings'> & {
  criteria: CriterionRow[];
  settings: { requiresQualityRelease: boolean; checkTolerancePct: number | ''; onePointMaxInterceptPct: number | '' };
};

export function versionBody(values: VersionFormValues) {
  return {
    changeSummary: values.changeSummary,
    criteria: fromCriterionRows(values.criteria),
    settings: {
      requiresQualityRelease: values.settings.requiresQualityRelease,
      checkTolerancePct: Number(values.settings.checkTolerancePct),
      onePointMaxInterceptPct: Number(values.settings.onePointMaxInterceptPct),
    },
  };
}

export function useCreateVersion(methodId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (values: VersionFormValues) =>
      api.post<MethodVersionDto>(`/methods/${encodeURIComponent(methodId)}/versions`, versionBody(values)),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: methodsQueries.all }),
    meta: { inlineErrors: true },
  });
}
