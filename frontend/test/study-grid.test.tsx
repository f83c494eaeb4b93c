import { fireEvent, screen, within } from '@testing-library/react';
import { useState } from 'react';
import { DataGrid } from '@/features/studies/components/grid/data-grid';
import { cellProblem, newRow, sectionColumns, type GridRow } from '@/features/studies/utils/grid-sections';
import {
  accuracyDesignProblems,
  accuracyItems,
  accuracyOptionProblems,
  dataToDraft,
  draftToData,
} from '@/features/studies/utils/study-sheets';
import { renderWithProviders } from './render';

// Invented numbers of the demo laboratory; what is checked is the handling of the cells.
const units = { x: 'mg/L', y: 'AU' };
const standards = sectionColumns('standards', units);

function Harness({ initial, onChange }: { initial: GridRow[]; onChange?: (rows: GridRow[]) => void }) {
  const [rows, setRows] = useState(initial);
  return (
    <DataGrid
      label="Calibration standards"
      columns={standards}
      rows={rows}
      onRowsChange={(next) => {
        setRows(next);
        onChange?.(next);
      }}
    />
  );
}

describe('numeric validation of grid cells', () => {
  it('says at the cell what is wrong', () => {
    const [x, y] = standards;
    expect(cellProblem(x, '0,5')).toBeNull();
    expect(cellProblem(x, 'abc')).toBe('“abc” is not a number');
    expect(cellProblem(y, '')).toBe('Required');
    expect(cellProblem(sectionColumns('recovery', units)[2], '0')).toBe('Must be above zero');
    const blank = sectionColumns('lowSpikes', units)[1];
    expect(cellProblem(blank, 'ND')).toBeNull();
    expect(cellProblem(blank, 'n.d.')).toBeNull();
    expect(cellProblem(blank, 'trace')).toMatch(/not a number; write ND/);
  });

  it('marks a non-numeric cell, names the problem and moves on with Enter', async () => {
    const { user } = renderWithProviders(<Harness initial={[newRow({ x: '0.5', y: '0.0612' }), newRow({ x: '1', y: '0,1218' })]} />);
    const grid = await screen.findByRole('table', { name: 'Calibration standards' });

    const response = within(grid).getByRole('textbox', { name: 'Response, row 2' });
    await user.clear(response);
    await user.type(response, '0.12a{Enter}');

    expect(response).toHaveAttribute('aria-invalid', 'true');
    expect(response).toHaveAccessibleDescription('“0.12a” is not a number');
    // Enter moved on to the same column of the next (empty) row.
    expect(within(grid).getByRole('textbox', { name: 'Response, row 3' })).toHaveFocus();
    // A decimal comma is a number: no mark.
    expect(within(grid).getByRole('textbox', { name: 'Response, row 1' })).not.toHaveAttribute('aria-invalid');
  });

  it('spreads a block pasted into one cell over the grid', async () => {
    const changes: GridRow[][] = [];
    renderWithProviders(<Harness initial={[]} onChange={(rows) => changes.push(rows)} />);
    const first = await screen.findByRole('textbox', { name: 'Concentration, row 1' });
    fireEvent.paste(first, { clipboardData: { getData: () => 'Conc\tAbs\n0,5\t0,0612\n1,0\t0,1218\n' } });
    expect(changes.at(-1)?.map((row) => row.cells)).toEqual([
      { x: '0,5', y: '0,0612' },
      { x: '1,0', y: '0,1218' },
    ]);
    expect(await screen.findByRole('textbox', { name: 'Response, row 2' })).toHaveValue('0,1218');
  });
});

describe('what the grid sends', () => {
  it('never sends a cell that is not a number; decimal commas become numbers', () => {
    const draft = dataToDraft({ standards: [] });
    draft.sheets.standards = [
      newRow({ x: '0,5', y: '0,0612' }),
      newRow({ x: '1', y: 'n.a.' }),
      newRow({ x: '2', y: '0.2431' }, { reason: 'bubble in the cell' }),
    ];
    draft.sheets.lowSpikes = [newRow({ spiked: '0,21', blank: 'ND' }), newRow({ spiked: '0.18', blank: '0,02' })];
    draft.sheets.unknowns = [newRow({ id: 'W-014', y: '0.412', dilution: '2' }), newRow({ id: 'W-014', y: '0,415' })];

    const data = draftToData(draft);
    expect(data.standards).toEqual([
      { x: 0.5, y: 0.0612 },
      { x: 2, y: 0.2431, excluded: { reason: 'bubble in the cell' } },
    ]);
    expect(data.lowSpikes).toEqual({ spiked: [0.21, 0.18], blanks: [null, 0.02] });
    expect(data.unknowns).toEqual([{ id: 'W-014', y: [0.412, 0.415], dilution: 2 }]);
    expect(JSON.stringify(data)).not.toContain('n.a.');
  });

  it('keeps what the wizard does not edit (criteria, units) and reads stored data back into the same grid', () => {
    const stored = {
      units: { x: 'mg/L', y: 'AU' },
      criteria: [{ figure: 'calibration.r2', op: '>=', value: 0.995 }],
      model: 'linear',
      weighting: '1/x',
      confidence: 0.95,
      alpha: 0.05,
      standards: [
        { x: 0.5, y: 0.0612 },
        { x: 1, y: 0.1218, excluded: { reason: 'pipetting error noted in the bench log' } },
      ],
      blanks: [0.0011, 0.0018],
      recovery: [{ id: 'R1', level: 'low', added: 1, found: 0.982 }],
      precision: [{ group: 'day 1', value: 5.02 }],
    };
    expect(draftToData(dataToDraft(stored))).toEqual(stored);
  });

  it('round-trips excluded low-level spikes and MDL blanks, each with its own reason, and keeps plain values plain', () => {
    const stored = {
      model: 'linear',
      weighting: 'none',
      confidence: 0.95,
      alpha: 0.05,
      standards: [],
      lowSpikes: {
        spiked: [0.21, { value: 0.43, excluded: { reason: 'spiked twice' } }, 0.19],
        blanks: [
          { value: null, excluded: { reason: 'vial broken' } },
          0.02,
          { value: 0.11, excluded: { reason: 'contaminated vial' } },
          0.01,
        ],
      },
    };
    const draft = dataToDraft(stored);
    expect(draft.sheets.lowSpikes.map((row) => [row.cells, row.excludedCells])).toEqual([
      [{ spiked: '0.21', blank: 'ND' }, { blank: { reason: 'vial broken' } }],
      [{ spiked: '0.43', blank: '0.02' }, { spiked: { reason: 'spiked twice' } }],
      [{ spiked: '0.19', blank: '0.11' }, { blank: { reason: 'contaminated vial' } }],
      [{ spiked: '', blank: '0.01' }, undefined],
    ]);
    expect(draftToData(draft)).toEqual(stored);
  });

  it('strikes through only the excluded result of a low-level spike row and says why under it', () => {
    const columns = sectionColumns('lowSpikes', units);
    const row = { ...newRow({ spiked: '0.43', blank: '0.02' }), excludedCells: { spiked: { reason: 'spiked twice' } } };
    renderWithProviders(<DataGrid label="Low-level spikes" columns={columns} rows={[row]} onRowsChange={() => undefined} />);
    expect(screen.getByLabelText('Low-level spike result, row 1')).toHaveStyle({ textDecoration: 'line-through' });
    expect(screen.getByLabelText('Method blank result, row 1')).not.toHaveStyle({ textDecoration: 'line-through' });
    expect(screen.getByText('Low-level spike result excluded: spiked twice')).toBeInTheDocument();
  });

  it('round-trips the accuracy design, the reference material and the options; holds back an unbalanced design', () => {
    // Invented numbers: 3 levels × 2 series × 2 replicates.
    const accuracy = [1, 5, 10].flatMap((nominal) =>
      ['day 1', 'day 2'].flatMap((series) => [0.99, 1.01].map((f) => ({ level: `L${nominal}`, series, nominal, found: nominal * f }))),
    );
    const stored = {
      model: 'linear',
      weighting: 'none',
      confidence: 0.95,
      alpha: 0.05,
      standards: [],
      accuracy,
      accuracyProfile: { beta: 0.95, lambda: 15 },
      uncertainty: { coverageFactor: 2, relativeAbove: 2 },
      referenceMaterial: { certified: 7.5, uCertified: 0.06, results: [7.58, 7.6] },
    };
    const draft = dataToDraft(stored);
    expect(draft.settings.accuracy.referenceResults).toBe('7.58; 7.6');
    expect(draftToData(draft)).toEqual(stored);

    // One replicate removed: a series of one; the server would refuse the design, so it waits in the grid (with its options).
    draft.sheets.accuracy = draft.sheets.accuracy.slice(1);
    const held = draftToData(draft);
    expect(held.accuracy).toBeUndefined();
    expect(held.accuracyProfile).toBeUndefined();
    expect(held.referenceMaterial).toEqual(stored.referenceMaterial);
    expect(accuracyDesignProblems(accuracyItems(draft.sheets.accuracy))).toEqual(['Level L1: every series needs at least 2 replicates']);

    // A reference material with one result or a bad number is not sent; the field says what is wrong.
    draft.settings.accuracy = { ...draft.settings.accuracy, referenceResults: '7,58; x', lambda: '0' };
    expect(draftToData(draft).referenceMaterial).toBeUndefined();
    expect(accuracyOptionProblems(draft.settings.accuracy)).toMatchObject({
      referenceResults: 'Write numbers separated by spaces or semicolons',
      lambda: 'λ lies above 0 and at most 100 %',
    });
  });
});
