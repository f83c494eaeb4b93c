import type { CreateRunRequest, ModelChoice, RunDto, RunData, RunModel } from '@meritline/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import * as yup from 'yup';
import { api, ApiError, isApiError } from '@/lib/api-client';
import { parseBlanks, parseChecks, parseQcSamples, parseStandards, parseUnknowns, type ParsedTable } from '../utils/measurement-text';
import { runsQueries } from './runs-queries';

export interface RunFormValues {
  methodVersionId: string;
  title: string;
  model: RunModel | '';
  bracketing: boolean;
  /** One-point: the standard level to calibrate with, as typed in the standards. */
  calibrant: string;
  standards: string;
  checks: string;
  unknowns: string;
  blanks: string;
  qcSamples: string;
}

export const emptyRunForm: RunFormValues = {
  methodVersionId: '',
  title: '',
  model: '',
  bracketing: false,
  calibrant: '',
  standards: '',
  checks: '',
  unknowns: '',
  blanks: '',
  qcSamples: '',
};

const readable = (parse: (text: string) => ParsedTable<unknown>, what: string) =>
  yup
    .string()
    .required(`Enter or paste the ${what}.`)
    .test('readable', (text, context) => {
      const { rows, errors } = parse(text ?? '');
      if (errors.length > 0) return context.createError({ message: errors.join(' ') });
      return rows.length > 0 || context.createError({ message: `Enter or paste the ${what}.` });
    });

const optionalTable = (parse: (text: string) => ParsedTable<unknown>) =>
  yup.string().test('readable', (text, context) => {
    const { errors } = parse(text ?? '');
    return errors.length === 0 || context.createError({ message: errors.join(' ') });
  });

export const runFormSchema = yup.object({
  methodVersionId: yup.string().required('Choose the method version the run uses.'),
  title: yup.string().trim().required('Give the run a title, e.g. the batch and date.').max(200, 'Use at most 200 characters.'),
  model: yup.string().required('Choose how to calibrate.'),
  bracketing: yup.boolean().required(),
  calibrant: yup.string(),
  standards: readable(parseStandards, 'standards'),
  checks: readable(parseChecks, 'check standards'),
  unknowns: readable(parseUnknowns, 'samples'),
  blanks: optionalTable(parseBlanks),
  qcSamples: optionalTable(parseQcSamples),
});

/** The distinct standard levels, lowest first. */
export function standardLevels(standards: RunData['standards']): number[] {
  return [...new Set(standards.map((s) => s.x))].sort((a, b) => a - b);
}

/**
 * The run as the API takes it. Standards a one- or two-point calibration does not use stay in the
 * data, left out with the reason, so the record shows everything that was measured.
 */
export function buildRunInput(values: RunFormValues, choice: ModelChoice | undefined, lockVersion?: number): CreateRunRequest | null {
  const standards = parseStandards(values.standards);
  const checks = parseChecks(values.checks);
  const unknowns = parseUnknowns(values.unknowns);
  const blanks = parseBlanks(values.blanks);
  const qcSamples = parseQcSamples(values.qcSamples);
  if (!values.methodVersionId || !values.model || [standards, checks, unknowns].some((t) => t.errors.length > 0 || t.rows.length === 0))
    return null;
  if (blanks.errors.length > 0 || qcSamples.errors.length > 0) return null;
  const levels = standardLevels(standards.rows);
  let used: (x: number) => boolean = () => true;
  let reason = '';
  if (values.model === 'one-point') {
    const level = levels.includes(Number(values.calibrant)) ? Number(values.calibrant) : levels[levels.length - 1];
    used = (x) => x === level;
    reason = `Not used: one-point calibration with the standard at ${level}.`;
  } else if (values.model === 'two-point' && !values.bracketing && levels.length > 2) {
    used = (x) => x === levels[0] || x === levels[levels.length - 1];
    reason = 'Not used: two-point calibration through the lowest and highest standards.';
  }
  const data: RunData = {
    model: values.model,
    ...(choice?.weighting && choice.weighting !== 'none' ? { weighting: choice.weighting } : {}),
    ...(values.model === 'two-point' && values.bracketing ? { twoPoint: { bracketing: true } } : {}),
    standards: standards.rows.map((s) => (used(s.x) ? s : { ...s, excluded: { reason } })),
    checks: checks.rows,
    unknowns: unknowns.rows,
    ...(blanks.rows.length ? { blanks: blanks.rows } : {}),
    ...(qcSamples.rows.length ? { qcSamples: qcSamples.rows } : {}),
  };
  return {
    methodVersionId: values.methodVersionId,
    title: values.title.trim() || 'Untitled run',
    data,
    ...(lockVersion ? { methodVersionLockVersion: lockVersion } : {}),
  };
}

const FIELD_OF: Record<string, keyof RunFormValues> = {
  methodVersionId: 'methodVersionId',
  title: 'title',
  'data.model': 'model',
  'data.weighting': 'model',
  'data.twoPoint': 'bracketing',
};

const ROW_NAMES = {
  standards: 'Standard',
  checks: 'Check standard',
  unknowns: 'Sample',
  blanks: 'Method blank',
  qcSamples: 'QC sample',
} as const;

/** `data.standards[3].x` → the standards field, and "Standard 4" for the message. */
export function formFieldOf(field: string): { name: keyof RunFormValues | null; row: string | null } {
  const table = /^data\.(standards|checks|unknowns|blanks|qcSamples)(?:\[(\d+)\])?/.exec(field);
  if (table) {
    const key = table[1] as keyof typeof ROW_NAMES;
    return { name: key, row: table[2] === undefined ? null : `${ROW_NAMES[key]} ${Number(table[2]) + 1}` };
  }
  return { name: FIELD_OF[field] ?? null, row: null };
}

/** The server's field paths point into the run data; the form shows them on its own fields. */
export function toFormError(error: unknown): unknown {
  if (!isApiError(error) || !error.body.errors) return error;
  const errors = error.body.errors.map((e) => {
    const { name, row } = formFieldOf(e.field);
    return { ...e, field: name ?? e.field, message: row ? `${row}: ${e.message}` : e.message };
  });
  return new ApiError({ ...error.body, errors });
}

export function useCreateRun() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (input: CreateRunRequest) => {
      try {
        return await api.post<RunDto>('/runs', input);
      } catch (error) {
        throw toFormError(error);
      }
    },
    onSuccess: async (run) => {
      queryClient.setQueryData(runsQueries.detail(run.id).queryKey, run);
      await queryClient.invalidateQueries({ queryKey: runsQueries.lists() });
      await queryClient.invalidateQueries({ queryKey: runsQueries.controlChart(run.methodVersionId).queryKey });
    },
    meta: { inlineErrors: true },
  });
}
