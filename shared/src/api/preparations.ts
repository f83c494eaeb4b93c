import type { BudgetEntry, MassUnit, PreparationStep, PreparationStock, ToleranceDistribution } from '../uncertainty-types.js';

/** Request and response bodies of /api/preparations. Volumes in mL; concentrations in the mass unit per litre. */

export const MASS_UNITS: readonly MassUnit[] = ['µg', 'mg', 'g'];
export const TOLERANCE_DISTRIBUTIONS: readonly ToleranceDistribution[] = ['rectangular', 'triangular'];
export const TOLERANCE_DISTRIBUTION_LABELS: Record<ToleranceDistribution, string> = {
  rectangular: 'Rectangular',
  triangular: 'Triangular',
};
export const MAX_DILUTION_STEPS = 12;

export type PreparationSource = { purity: number; uPurity: number } | { materialId: string };

export interface PreparationPreviewRequest {
  source: PreparationSource;
  stock: PreparationStock;
  steps: PreparationStep[];
}

export interface CreatePreparationRequest extends PreparationPreviewRequest {
  name: string;
}

export type PreparationBudgetRow = Pick<BudgetEntry, 'quantity' | 'label' | 'value' | 'u' | 'relativeU' | 'contribution'>;

export interface PreparationPreviewDto {
  stock: { concentration: number; u: number; relativeU: number; unit: string; budget: PreparationBudgetRow[] };
  steps: { concentration: number; u: number; relativeU: number }[];
}

export interface PreparationMaterialDto {
  id: string;
  name: string;
  lot: string;
  certificateNumber: string;
  expiresOn: string;
}

export interface PreparationDto {
  id: string;
  name: string;
  material: PreparationMaterialDto | null;
  /** The purity and its standard uncertainty used, copied from the material at saving. */
  source: { purity: number; uPurity: number };
  stock: PreparationStock;
  steps: PreparationStep[];
  result: PreparationPreviewDto;
  engineVersion: string;
  createdBy: { id: string; name: string };
  createdAt: string;
}

/** Words for the fields of a preparation, for messages a person reads. */
export function preparationFieldLabel(field: string): string {
  const step = /^steps\[(\d+)\]\.(\w+)$/.exec(field);
  if (step) return `Dilution ${Number(step[1]) + 1}: ${STEP_LABELS[step[2]] ?? step[2]}`;
  return FIELD_LABELS[field] ?? field;
}

const FIELD_LABELS: Record<string, string> = {
  name: 'Name',
  source: 'Source',
  'source.materialId': 'Reference material',
  'source.purity': 'Purity',
  'source.uPurity': 'Standard uncertainty of the purity',
  stock: 'Stock solution',
  'stock.mass': 'Mass weighed',
  'stock.uMass': 'Standard uncertainty of the mass',
  'stock.massUnit': 'Mass unit',
  'stock.volume': 'Volume of the flask',
  'stock.volumeTolerance': 'Tolerance of the flask',
  'stock.volumeDistribution': 'Distribution of the flask tolerance',
  'stock.volumeRepeatability': 'Filling repeatability',
  'stock.temperatureRange': 'Temperature range',
  'stock.expansionCoefficient': 'Expansion coefficient',
  steps: 'Dilutions',
};

const STEP_LABELS: Record<string, string> = {
  aliquot: 'aliquot',
  aliquotTolerance: 'tolerance of the pipette',
  aliquotDistribution: 'distribution of the pipette tolerance',
  volume: 'final volume',
  volumeTolerance: 'tolerance of the flask',
  volumeDistribution: 'distribution of the flask tolerance',
};

/** The engine's field errors with the field's words in place of its path. */
export function humanizePreparationErrors<E extends { field: string; message: string }>(errors: readonly E[]): E[] {
  return errors.map((e) => ({
    ...e,
    message: e.message.startsWith(e.field) ? `${preparationFieldLabel(e.field)}${e.message.slice(e.field.length)}` : e.message,
  }));
}
