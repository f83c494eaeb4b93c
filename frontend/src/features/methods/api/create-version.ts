import { useMutation, useQueryClient } from '@tanstack/react-query';
import {
  METHOD_CHANGE_KINDS,
  REVALIDATION_FAMILIES,
  type MethodChangeKind,
  type RevalidationFamily,
  type MethodVersionDto,
} from '@meritline/shared';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import { methodsQueries } from './methods-queries';
import { changeSummaryField, criteriaField, fromCriterionRows, settingsSchema, type CriterionRow } from './version-rules';

export const versionFormSchema = yup.object({
  changeSummary: changeSummaryField,
  criteria: criteriaField,
  settings: settingsSchema,
  changeKind: yup.string().oneOf(['', ...METHOD_CHANGE_KINDS]),
  revalidationScope: yup.array(yup.string().oneOf(REVALIDATION_FAMILIES).required()),
  recoveryEquivalenceMarginPct: yup
    .number()
    .transform((value: number, original: unknown) => (original === '' ? undefined : value))
    .typeError('Give the margin as a number of percentage points.')
    .required('Give the recovery equivalence margin.')
    .moreThan(0, 'The margin must be more than 0 percentage points.')
    .max(50, 'The margin can be at most 50 percentage points.'),
});

/** A new version must say what kind of change it makes. */
export const newVersionFormSchema = versionFormSchema.shape({
  changeKind: yup.string().oneOf(METHOD_CHANGE_KINDS, 'Choose the kind of change.').required('Choose the kind of change.'),
});

export type VersionFormValues = Omit<
  yup.InferType<typeof versionFormSchema>,
  'criteria' | 'settings' | 'changeKind' | 'revalidationScope' | 'recoveryEquivalenceMarginPct'
> & {
  criteria: CriterionRow[];
  /** Empty for the first version of a method, which records no change. */
  changeKind: MethodChangeKind | '';
  revalidationScope: RevalidationFamily[];
  recoveryEquivalenceMarginPct: number | '';
  settings: {
    requiresQualityRelease: boolean;
    checkTolerancePct: number | '';
    onePointMaxInterceptPct: number | '';
    accuracyBeta: number;
    accuracyLambdaPct: number | '';
    coverageFactor: number | '';
  };
};

export function versionBody(values: VersionFormValues) {
  return {
    changeSummary: values.changeSummary,
    ...(values.changeKind ? { changeKind: values.changeKind, revalidationScope: values.revalidationScope } : {}),
    criteria: fromCriterionRows(values.criteria),
    settings: {
      requiresQualityRelease: values.settings.requiresQualityRelease,
      checkTolerancePct: Number(values.settings.checkTolerancePct),
      onePointMaxInterceptPct: Number(values.settings.onePointMaxInterceptPct),
      recoveryEquivalenceMarginPct: Number(values.recoveryEquivalenceMarginPct),
      accuracyBeta: Number(values.settings.accuracyBeta),
      accuracyLambdaPct: Number(values.settings.accuracyLambdaPct),
      coverageFactor: Number(values.settings.coverageFactor),
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
