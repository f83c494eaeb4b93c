import * as yup from 'yup';

const isoDate = yup
  .string()
  .trim()
  .default('')
  .matches(/^(\d{4}-\d{2}-\d{2})?$/, 'Use a date such as 2026-11-02.');

/** Title and the bench facts of a study, shared by creating and editing. */
export const studyDetailsSchema = yup.object({
  title: yup.string().trim().required('Give the study a title.').max(200, 'Use at most 200 characters.'),
  instrument: yup.string().trim().max(120, 'Use at most 120 characters.').default(''),
  startedOn: isoDate,
  finishedOn: isoDate.test('after-start', 'The study cannot finish before it starts.', function (finishedOn) {
    const { startedOn } = this.parent as { startedOn?: string };
    return !finishedOn || !startedOn || finishedOn >= startedOn;
  }),
});

export type StudyDetailsValues = yup.InferType<typeof studyDetailsSchema>;
