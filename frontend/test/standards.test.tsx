import { screen, within } from '@testing-library/react';
import { emptyPreparation, previewRequest } from '@/features/standards/api/preparation-form';
import { emptyMaterial, materialSchema, toRequest } from '@/features/standards/api/save-reference-material';
import { BudgetTable } from '@/features/standards/components/budget-table';
import { renderWithProviders } from './render';

describe('standard preparation form', () => {
  it('sends nothing while the form is incomplete, then numbers, leaving out optional fields left empty', () => {
    expect(previewRequest(emptyPreparation)).toBeNull();
    const filled = {
      ...emptyPreparation,
      materialId: 'm-1',
      // Formik keeps what a number input holds as a number.
      stock: { ...emptyPreparation.stock, mass: 100.28, uMass: '0.05', volume: 100, volumeTolerance: '0.1' },
      steps: [{ ...emptyPreparation.steps[0], aliquot: 1, aliquotTolerance: 0.008, volume: '100', volumeTolerance: '0.1' }],
    } as unknown as typeof emptyPreparation;
    const body = previewRequest(filled);
    expect(body).toEqual({
      source: { materialId: 'm-1' },
      stock: { mass: 100.28, uMass: 0.05, massUnit: 'mg', volume: 100, volumeTolerance: 0.1, volumeDistribution: 'triangular' },
      steps: [
        {
          aliquot: 1,
          aliquotTolerance: 0.008,
          aliquotDistribution: 'triangular',
          volume: 100,
          volumeTolerance: 0.1,
          volumeDistribution: 'triangular',
        },
      ],
    });
  });
});

describe('reference material form', () => {
  const filled = {
    ...emptyMaterial,
    name: 'Zinc shot',
    analyte: 'Zinc',
    supplier: 'Westmoor Metals',
    lot: 'WM-1',
    certificateNumber: 'C-1',
    certifiedValue: '99.95',
    expandedUncertainty: '0.0002',
    receivedOn: '2026-10-01',
    expiresOn: '2027-10-01',
  };

  it('catches a purity typed as a percentage before anything is sent', async () => {
    await expect(materialSchema.validate(filled)).rejects.toThrow('A purity is a mass fraction: above 0 and at most 1 (e.g. 0.9995).');
    await expect(materialSchema.validate({ ...filled, certifiedValue: '0.9995' })).resolves.toBeTruthy();
  });

  it('sends a purity in g/g and only the uncertainty the certificate states', () => {
    expect(toRequest({ ...filled, certifiedValue: '0.9995' })).toMatchObject({
      certifiedValue: 0.9995,
      unit: 'g/g',
      expandedUncertainty: 0.0002,
      coverageFactor: 2,
      standardUncertainty: null,
      openedOn: null,
    });
  });
});

describe('uncertainty budget', () => {
  it('names each input in words, never by its code', () => {
    renderWithProviders(
      <BudgetTable
        massUnit="mg"
        stock={{
          concentration: 1002.7,
          u: 0.8352,
          relativeU: 0.000833,
          unit: 'mg/L',
          budget: [
            { quantity: 'purity', label: 'Purity', value: 0.9999, u: 0.0000577, relativeU: 0.0000577, contribution: 0.0579 },
            { quantity: 'mass', label: 'Mass weighed', value: 100.28, u: 0.05, relativeU: 0.000499, contribution: 0.49995 },
            { quantity: 'volume', label: 'Volume of the flask', value: 100, u: 0.0665, relativeU: 0.000665, contribution: 0.6665 },
          ],
        }}
      />,
    );
    const table = screen.getByRole('table', { name: 'Uncertainty budget of the stock solution' });
    expect(within(table).getByText('Mass weighed')).toBeInTheDocument();
    expect(within(table).getByText('100.28 mg')).toBeInTheDocument();
    expect(within(table).getByText('0.84 mg/L')).toBeInTheDocument();
    expect(table.textContent).not.toMatch(/volumeCalibration|relativeU|quantity/);
  });
});
