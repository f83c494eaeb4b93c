import { CRITERION_OPS, describeCriterion, type CriterionOp, type MethodVersionSettings } from '@meritline/shared';
import * as yup from 'yup';
import { figureLabel, type CriterionDefinition } from '@/components/study-results';

/** A criterion as the form edits it: `value` is the lower limit of a `between`, `high` its upper. */
export interface CriterionRow {
  figure: string;
  label: string;
  op: CriterionOp;
  value: string;
  high: string;
  level?: string | number;
}

const emptyToUndefined = (value: unknown, original: unknown) => (original === '' || original === null ? undefined : value);

/** Limits are typed as text so that "0." and decimal commas survive editing. */
export const toNumber = (text: string) => Number(text.trim().replace(',', '.'));
const numberText = (required: string) =>
  yup
    .string()
    .trim()
    .required(required)
    .test('number', 'Enter a number.', (text) => text === undefined || Number.isFinite(toNumber(text)));

export const criterionRowSchema = yup.object({
  figure: yup.string().trim().required('Choose a figure.'),
  label: yup.string().trim().max(200, 'Use at most 200 characters.').default(''),
  op: yup
    .mixed<CriterionOp>()
    .oneOf([...CRITERION_OPS], 'Choose a comparison.')
    .required('Choose a comparison.'),
  value: numberText('Enter a number.'),
  high: yup
    .string()
    .default('')
    .when('op', {
      is: 'between',
      then: () =>
        numberText('Enter the upper limit.').test('order', 'The upper limit must not be below the lower.', function (text) {
          return text === undefined || toNumber(text) >= toNumber(String(this.parent.value ?? ''));
        }),
    }),
});

export const criteriaField = yup.array(criterionRowSchema).required().default([]);

export const settingsSchema = yup.object({
  requiresQualityRelease: yup.boolean().required().default(false),
  checkTolerancePct: yup
    .number()
    .transform(emptyToUndefined)
    .typeError('Enter a number.')
    .required('Enter the tolerance.')
    .min(0.1, 'Use at least 0.1 %.')
    .max(50, 'Use at most 50 %.'),
  onePointMaxInterceptPct: yup
    .number()
    .transform(emptyToUndefined)
    .typeError('Enter a number.')
    .required('Enter the limit.')
    .min(0, 'Use zero or more.')
    .max(100, 'Use at most 100 %.'),
  accuracyBeta: yup.number().oneOf([0.8, 0.95], 'Choose 80 % or 95 %.').required('Choose β.'),
  accuracyLambdaPct: yup
    .number()
    .transform(emptyToUndefined)
    .typeError('Enter a number.')
    .required('Enter the acceptance limits.')
    .moreThan(0, 'Use more than 0 %.')
    .max(100, 'Use at most 100 %.'),
  coverageFactor: yup
    .number()
    .transform(emptyToUndefined)
    .typeError('Enter a number.')
    .required('Enter the coverage factor.')
    .min(1, 'Use at least 1.')
    .max(5, 'Use at most 5.'),
});

export const changeSummaryField = yup.string().trim().required('Say what changed and why.').max(2000, 'Use at most 2000 characters.');

export const DEFAULT_SETTINGS: MethodVersionSettings = { requiresQualityRelease: false, checkTolerancePct: 10, onePointMaxInterceptPct: 2 };

export function toCriterionRows(criteria: readonly CriterionDefinition[]): CriterionRow[] {
  return criteria.map((c) => ({
    figure: c.figure,
    label: c.label ?? '',
    op: c.op,
    value: String(Array.isArray(c.value) ? c.value[0] : c.value),
    high: Array.isArray(c.value) ? String(c.value[1]) : '',
    ...(c.level !== undefined ? { level: c.level } : {}),
  }));
}

export function fromCriterionRows(rows: readonly CriterionRow[]): CriterionDefinition[] {
  return rows.map((row) => ({
    figure: row.figure.trim(),
    op: row.op,
    value: row.op === 'between' ? [toNumber(row.value), toNumber(row.high)] : toNumber(row.value),
    // The words are written from the figure, comparison and limit, so they cannot contradict the limit.
    label: criterionRowInWords(row),
    ...(row.level !== undefined ? { level: row.level } : {}),
  }));
}

/** "Repeatability RSD at most 2 %", or the figure alone while the limit is not a number yet. */
export function criterionRowInWords(row: CriterionRow): string {
  const low = toNumber(row.value);
  const high = toNumber(row.high);
  const complete =
    Number.isFinite(low) && row.value.trim() !== '' && (row.op !== 'between' || (Number.isFinite(high) && row.high.trim() !== ''));
  if (!complete) return figureLabel(row.figure);
  return describeCriterion({ figure: row.figure, op: row.op, value: row.op === 'between' ? [low, high] : low });
}
