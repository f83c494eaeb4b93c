import type { StudyDto } from '@meritline/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import { studiesQueries } from './studies-queries';
import { studyDetailsSchema } from './study-details-rules';

export const createStudySchema = studyDetailsSchema.shape({
  methodId: yup.string().required('Choose the method.'),
  methodVersionId: yup.string().required('Choose the version of the method.'),
});

export type CreateStudyValues = yup.InferType<typeof createStudySchema>;

export function useCreateStudy() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ methodVersionId, title, instrument, startedOn, finishedOn }: CreateStudyValues) =>
      api.post<StudyDto>('/studies', {
        methodVersionId,
        title,
        data: { model: 'linear', weighting: 'none', standards: [] },
        meta: { instrument: instrument || undefined, startedOn: startedOn || undefined, finishedOn: finishedOn || undefined },
      }),
    onSuccess: (study) => {
      queryClient.setQueryData(studiesQueries.detail(study.id).queryKey, study);
      return queryClient.invalidateQueries({ queryKey: studiesQueries.lists() });
    },
    meta: { inlineErrors: true },
  });
}
