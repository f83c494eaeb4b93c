import type { MassUnit, PreparationPreviewRequest, ReferenceMaterialDto, ToleranceDistribution } from '@meritline/shared';
import * as yup from 'yup';

const number = (label: string, rule: 'positive' | 'nonNegative', required = true) =>
  yup
    .string()
    .trim()
    .default('')
    .test('required', `Enter ${label}.`, (v) => !required || Boolean(v))
    .test('number', `${label[0].toUpperCase()}${label.slice(1)} must be a number.`, (v) => !v || Number.isFinite(Number(v)))
    .test(rule, `${label[0].toUpperCase()}${label.slice(1)} must be ${rule === 'positive' ? 'greater than zero' : 'zero or more'}.`, (v) =>
      !v ? true : rule === 'positive' ? Number(v) > 0 : Number(v) >= 0,
    );

const stepSchema = yup.object({
  aliquot: number('the aliquot', 'positive'),
  aliquotTolerance: number('the pipette tolerance', 'nonNegative'),
  aliquotDistribution: yup.string().required(),
  volume: number('the final volume', 'positive'),
  volumeTolerance: number('the flask tolerance', 'nonNegative'),
  volumeDistribution: yup.string().required(),
});

export const preparationSchema = yup.object({
  name: yup.string().trim().required('Name the preparation, e.g. what and when.').max(160, 'Use at most 160 characters.'),
  materialId: yup.string().required('Choose the reference material weighed.'),
  stock: yup.object({
    mass: number('the mass weighed', 'positive'),
    uMass: number('the standard uncertainty of the mass', 'nonNegative'),
    massUnit: yup.string().required(),
    volume: number('the volume of the flask', 'positive'),
    volumeTolerance: number('the flask tolerance', 'nonNegative'),
    volumeDistribution: yup.string().required(),
    volumeRepeatability: number('the filling repeatability', 'nonNegative', false),
    temperatureRange: number('the temperature range', 'nonNegative', false),
    expansionCoefficient: number('the expansion coefficient', 'nonNegative', false),
  }),
  steps: yup.array().of(stepSchema).max(12, 'At most 12 dilutions.').default([]),
});

export type PreparationValues = yup.InferType<typeof preparationSchema>;
export type StepValues = yup.InferType<typeof stepSchema>;

export const newStep = (): StepValues => ({
  aliquot: '',
  aliquotTolerance: '',
  aliquotDistribution: 'triangular',
  volume: '',
  volumeTolerance: '',
  volumeDistribution: 'triangular',
});

export const emptyPreparation: PreparationValues = {
  name: '',
  materialId: '',
  stock: {
    mass: '',
    uMass: '',
    massUnit: 'mg',
    volume: '',
    volumeTolerance: '',
    volumeDistribution: 'triangular',
    volumeRepeatability: '',
    temperatureRange: '',
    expansionCoefficient: '',
  },
  steps: [newStep()],
};

/** Formik keeps what number inputs hold as numbers, and emptied ones as ''. */
const text = (v: unknown) => (v === undefined || v === null ? '' : String(v).trim());
const optional = (v: unknown) => (text(v) === '' ? undefined : Number(v));

/** The request once every required number is there; null while the form is incomplete. */
export function previewRequest(v: PreparationValues): PreparationPreviewRequest | null {
  const s = v.stock;
  const required = [
    s.mass,
    s.uMass,
    s.volume,
    s.volumeTolerance,
    ...v.steps.flatMap((st) => [st.aliquot, st.aliquotTolerance, st.volume, st.volumeTolerance]),
  ];
  if (!v.materialId || required.some((x) => text(x) === '' || !Number.isFinite(Number(x)))) return null;
  return {
    source: { materialId: v.materialId },
    stock: {
      mass: Number(s.mass),
      uMass: Number(s.uMass),
      massUnit: s.massUnit as MassUnit,
      volume: Number(s.volume),
      volumeTolerance: Number(s.volumeTolerance),
      volumeDistribution: s.volumeDistribution as ToleranceDistribution,
      volumeRepeatability: optional(s.volumeRepeatability),
      temperatureRange: optional(s.temperatureRange),
      expansionCoefficient: optional(s.expansionCoefficient),
    },
    steps: v.steps.map((st) => ({
      aliquot: Number(st.aliquot),
      aliquotTolerance: Number(st.aliquotTolerance),
      aliquotDistribution: st.aliquotDistribution as ToleranceDistribution,
      volume: Number(st.volume),
      volumeTolerance: Number(st.volumeTolerance),
      volumeDistribution: st.volumeDistribution as ToleranceDistribution,
    })),
  };
}

/** Only materials in use and certified for purity can be weighed for a stock. */
export const usableMaterials = (materials: readonly ReferenceMaterialDto[]) =>
  materials.filter((m) => m.status === 'in-use' && m.valueKind === 'purity');
