import type { PreparationDto } from '@meritline/shared';
import { screen, within } from '@testing-library/react';
import { useState } from 'react';
import { DataGrid } from '@/features/studies/components/grid/data-grid';
import { PreparationDialog } from '@/features/studies/components/steps/preparation-dialog';
import { isBlankRow, newRow, sectionColumns, type GridRow } from '@/features/studies/utils/grid-sections';
import { dropRetypedPreparations, normalizeUnit } from '@/features/studies/utils/preparation-standards';
import { dataToDraft, draftToData } from '@/features/studies/utils/study-sheets';
import { renderWithProviders, stubApi } from './render';

// Invented preparations of the demo laboratory; concentrations as the server would have computed them.
function preparation(id: string, name: string, unit: string, steps: { concentration: number; u: number }[]): PreparationDto {
  return {
    id,
    name,
    material: { id: 'm-1', name: 'Cadmium granules', lot: 'NF-CD-0917', certificateNumber: 'C-1', expiresOn: '2027-12-31' },
    source: { purity: 0.9999, uPurity: 0.00005 },
    stock: { mass: 100.28, uMass: 0.05, massUnit: 'mg', volume: 100, volumeTolerance: 0.1, volumeDistribution: 'triangular' },
    steps: [],
    result: {
      stock: { concentration: 1002.7, u: 0.6, relativeU: 0.0006, unit, budget: [] },
      steps: steps.map((s) => ({ ...s, relativeU: s.u / s.concentration })),
    },
    engineVersion: 'test',
    createdBy: { id: 'u-1', name: 'Demo Analyst' },
    createdAt: '2026-12-01T08:00:00.000Z',
  };
}

const PREP_ID = '0b6f6f3e-8a51-4c36-9d4e-1f2a3b4c5d6e';
const cadmium = preparation(PREP_ID, 'Cadmium working set', 'mg/L', [
  { concentration: 10.027, u: 0.012 },
  { concentration: 1.0027, u: 0.0016 },
]);
const microgram = preparation('1c7e7e4f-9b62-4d47-8e5f-2a3b4c5d6e7f', 'Cadmium trace set', 'µg/L', [{ concentration: 5.01, u: 0.01 }]);

const units = { x: 'mg/L', y: 'AU' };
const columns = sectionColumns('standards', units);

function Harness({ initial }: { initial: GridRow[] }) {
  const [rows, setRows] = useState(initial);
  const filled = rows.filter((row) => !isBlankRow(row, columns));
  return (
    <>
      <PreparationDialog
        xUnit={units.x}
        filledRows={filled.length}
        onFill={(added, mode) => setRows(mode === 'append' ? [...filled, ...added] : added)}
      />
      <DataGrid label="Calibration standards" columns={columns} rows={rows} onRowsChange={setRows} />
      <output data-testid="preparation-ids">{rows.map((row) => row.preparationId ?? '-').join(',')}</output>
    </>
  );
}

const cell = (row: number, column: number) => screen.getByLabelText(`${columns[column].label}, row ${row}`);

describe('standards taken from a saved preparation', () => {
  beforeEach(() => {
    stubApi({ 'GET /api/preparations': { body: [cadmium, microgram] } });
  });

  it('fills one row per working standard, its concentration as x and the preparation kept, responses left empty', async () => {
    const { user } = renderWithProviders(<Harness initial={[]} />);
    await user.click(screen.getByRole('button', { name: 'Take concentrations from a preparation' }));
    const table = await screen.findByRole('table', { name: 'Saved preparations' });
    expect(within(table).getAllByText('Cadmium granules, lot NF-CD-0917')).toHaveLength(2);
    // Each estimate printed to the decimal of its u given to two digits (JCGM 100:2008, GUM 7.2.6).
    expect(within(table).getByText('10.027 (u 0.012) mg/L; 1.0027 (u 0.0016) mg/L')).toBeInTheDocument();
    await user.click(within(table).getByRole('button', { name: 'Choose Cadmium working set' }));
    await user.click(screen.getByRole('button', { name: 'Put 2 standards in the grid' }));

    expect(cell(1, 0)).toHaveValue('10.027');
    expect(cell(2, 0)).toHaveValue('1.0027');
    expect(cell(1, 1)).toHaveValue('');
    expect(screen.getByTestId('preparation-ids')).toHaveTextContent(`${PREP_ID},${PREP_ID}`);
  });

  it('refuses, in words, a preparation in another unit and fills nothing', async () => {
    const { user } = renderWithProviders(<Harness initial={[]} />);
    await user.click(screen.getByRole('button', { name: 'Take concentrations from a preparation' }));
    await user.click(await screen.findByRole('button', { name: 'Choose Cadmium trace set' }));
    expect(screen.getByText(/concentrations are in µg\/L, the study's in mg\/L\. Nothing was put in the grid/)).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Put the standards in the grid' })).toBeDisabled();
    expect(screen.getByTestId('preparation-ids')).toHaveTextContent('');
  });

  it('keeps rows already typed when the analyst chooses to add after them', async () => {
    const { user } = renderWithProviders(<Harness initial={[newRow({ x: '0', y: '0.002' })]} />);
    await user.click(screen.getByRole('button', { name: 'Take concentrations from a preparation' }));
    await user.click(await screen.findByRole('button', { name: 'Choose Cadmium working set' }));
    expect(screen.getByText('The grid already holds 1 row. Keep it or replace it?')).toBeInTheDocument();
    await user.click(screen.getByText('Keep them and add after'));
    await user.click(screen.getByRole('button', { name: 'Put 2 standards in the grid' }));
    expect(cell(1, 0)).toHaveValue('0');
    expect(cell(3, 0)).toHaveValue('1.0027');
    expect(screen.getByTestId('preparation-ids')).toHaveTextContent(`-,${PREP_ID},${PREP_ID}`);
  });

  it('carries the preparation of each standard through the draft and back', () => {
    const data = {
      standards: [
        { x: 10.027, y: 0.41, preparationId: PREP_ID },
        { x: 0, y: 0.002 },
      ],
    };
    const draft = dataToDraft(data);
    expect(draft.sheets.standards.map((row) => row.preparationId)).toEqual([PREP_ID, undefined]);
    expect((draftToData(draft).standards as unknown[])[0]).toEqual({ x: 10.027, y: 0.41, preparationId: PREP_ID });
    expect((draftToData(draft).standards as unknown[])[1]).toEqual({ x: 0, y: 0.002 });
  });

  it('forgets the preparation of a standard whose concentration is typed over, and only of that one', () => {
    const before = [
      { ...newRow({ x: '10.027', y: '' }), preparationId: PREP_ID },
      { ...newRow({ x: '1.0027', y: '' }), preparationId: PREP_ID },
    ];
    const typed = [
      { ...before[0], cells: { x: '10', y: '' } },
      { ...before[1], cells: { x: '1.0027', y: '0.08' } },
    ];
    expect(dropRetypedPreparations(before, typed).map((row) => row.preparationId)).toEqual([undefined, PREP_ID]);
  });

  it('reads the usual spellings of one unit as the same unit', () => {
    expect(normalizeUnit('mg / L')).toBe(normalizeUnit('mg/L'));
    expect(normalizeUnit('mg L-1')).toBe(normalizeUnit('mg/L'));
    expect(normalizeUnit('ug/L')).toBe(normalizeUnit('µg/L'));
    expect(normalizeUnit('µg/L')).not.toBe(normalizeUnit('mg/L'));
  });
});
