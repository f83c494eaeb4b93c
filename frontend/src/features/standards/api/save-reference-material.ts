import {
  PURITY_UNIT,
  type CertifiedValueKind,
  type CreateReferenceMaterialRequest,
  type ReferenceMaterialDto,
  type UpdateReferenceMaterialRequest,
} from '@meritline/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import { referenceMaterialsQueries } from './reference-materials-queries';

const text = (message: string, max: number) => yup.string().trim().required(message).max(max, `Use at most ${max} characters.`);
const optionalNumber = (label: string) =>
  yup
    .string()
    .trim()
    .default('')
    .test('number', `${label} must be a number.`, (v) => !v || Number.isFinite(Number(v)))
    .test('non-negative', `${label} cannot be negative.`, (v) => !v || Number(v) >= 0);
const date = (message: string) =>
  yup
    .string()
    .required(message)
    .matches(/^\d{4}-\d{2}-\d{2}$/, message);

export const materialSchema = yup.object({
  name: text('Name the material.', 160),
  analyte: text('Name the analyte.', 120),
  supplier: text('Name the supplier.', 160),
  lot: text('Give the lot number.', 80),
  certificateNumber: text('Give the certificate number.', 80),
  valueKind: yup.string().oneOf(['purity', 'content']).required('Say whether the certificate gives a purity or a content.'),
  certifiedValue: yup
    .string()
    .trim()
    .required('Enter the certified value.')
    .test('number', 'Enter the certified value as a number.', (v) => Number.isFinite(Number(v)))
    .test('range', 'A purity is a mass fraction: above 0 and at most 1 (e.g. 0.9995).', function (v) {
      const n = Number(v);
      return this.parent.valueKind === 'purity' ? n > 0 && n <= 1 : n > 0;
    }),
  unit: yup
    .string()
    .trim()
    .max(30, 'Use at most 30 characters.')
    .test('unit', 'Give the unit of the certified content.', function (v) {
      return this.parent.valueKind === 'purity' || Boolean(v);
    }),
  uncertaintyForm: yup.string().oneOf(['expanded', 'standard']).required(),
  expandedUncertainty: optionalNumber('The expanded uncertainty').test('required', 'Give U from the certificate.', function (v) {
    return this.parent.uncertaintyForm !== 'expanded' || Boolean(v);
  }),
  coverageFactor: optionalNumber('The coverage factor').test('required', 'Give the coverage factor k.', function (v) {
    return this.parent.uncertaintyForm !== 'expanded' || Number(v) > 0;
  }),
  standardUncertainty: optionalNumber('The standard uncertainty').test('required', 'Give u from the certificate.', function (v) {
    return this.parent.uncertaintyForm !== 'standard' || Boolean(v);
  }),
  receivedOn: date('Give the date received.'),
  openedOn: yup.string().default(''),
  expiresOn: date('Give the expiry date.'),
  storage: yup.string().trim().max(500, 'Use at most 500 characters.').default(''),
});

export type MaterialValues = yup.InferType<typeof materialSchema>;

export const emptyMaterial: MaterialValues = {
  name: '',
  analyte: '',
  supplier: '',
  lot: '',
  certificateNumber: '',
  valueKind: 'purity',
  certifiedValue: '',
  unit: '',
  uncertaintyForm: 'expanded',
  expandedUncertainty: '',
  coverageFactor: '2',
  standardUncertainty: '',
  receivedOn: '',
  openedOn: '',
  expiresOn: '',
  storage: '',
};

export function materialValues(m: ReferenceMaterialDto): MaterialValues {
  const expanded = m.expandedUncertainty !== null;
  return {
    name: m.name,
    analyte: m.analyte,
    supplier: m.supplier,
    lot: m.lot,
    certificateNumber: m.certificateNumber,
    valueKind: m.valueKind,
    certifiedValue: String(m.certifiedValue),
    unit: m.valueKind === 'purity' ? '' : m.unit,
    uncertaintyForm: expanded ? 'expanded' : 'standard',
    expandedUncertainty: expanded ? String(m.expandedUncertainty) : '',
    coverageFactor: expanded ? String(m.coverageFactor) : '2',
    standardUncertainty: expanded ? '' : String(m.standardUncertainty),
    receivedOn: m.receivedOn,
    openedOn: m.openedOn ?? '',
    expiresOn: m.expiresOn,
    storage: m.storage,
  };
}

export function toRequest(v: MaterialValues): CreateReferenceMaterialRequest {
  const expanded = v.uncertaintyForm === 'expanded';
  return {
    name: v.name,
    analyte: v.analyte,
    supplier: v.supplier,
    lot: v.lot,
    certificateNumber: v.certificateNumber,
    valueKind: v.valueKind as CertifiedValueKind,
    certifiedValue: Number(v.certifiedValue),
    unit: v.valueKind === 'purity' ? PURITY_UNIT : (v.unit ?? ''),
    expandedUncertainty: expanded ? Number(v.expandedUncertainty) : null,
    coverageFactor: expanded ? Number(v.coverageFactor) : null,
    standardUncertainty: expanded ? null : Number(v.standardUncertainty),
    receivedOn: v.receivedOn,
    openedOn: v.openedOn || null,
    expiresOn: v.expiresOn,
    storage: v.storage,
  };
}

export function useSaveReferenceMaterial() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id?: string; body: CreateReferenceMaterialRequest | UpdateReferenceMaterialRequest }) =>
      id
        ? api.patch<ReferenceMaterialDto>(`/reference-materials/${encodeURIComponent(id)}`, body)
        : api.post<ReferenceMaterialDto>('/reference-materials', body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: referenceMaterialsQueries.all }),
    meta: { inlineErrors: true },
  });
}
