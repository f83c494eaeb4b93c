import type { RunUnknown } from '@meritline/shared';
import { screen, within } from '@testing-library/react';
import { ControlsTables } from '@/features/runs/components/controls-table';
import { ResultsTable } from '@/features/runs/components/results-table';
import { renderWithProviders } from './render';

// Invented sample, diluted 1:10: the line reads 32.254 mg/L; the result is ten times that.
const sample = {
  id: 'W-2901',
  m: 2,
  yMean: 4.915,
  dilution: 10,
  x0: 322.5437,
  x0Undiluted: 32.25437,
  ci: [319.4148, 325.6726],
  flags: [],
  reported: '322.5 ± 3.1 mg/L',
  remarks: [],
  suggestedDilution: null,
  reportable: true,
} as unknown as RunUnknown;

describe('run results', () => {
  it('shows the undiluted reading and the dilution-corrected result in columns of their own, rounded to the interval it names', async () => {
    renderWithProviders(<ResultsTable unknowns={[sample]} xUnit="mg/L" yUnit="µS·min" confidence={0.95} />);
    const table = await screen.findByRole('table', { name: 'Sample results' });
    const headers = within(table)
      .getAllByRole('columnheader')
      .map((h) => h.textContent);
    expect(headers.some((h) => /Read off the line, undiluted/.test(h ?? ''))).toBe(true);
    expect(headers.some((h) => /Result, dilution corrected/.test(h ?? ''))).toBe(true);
    const row = within(table).getByRole('row', { name: /W-2901/ });
    expect(row).toHaveTextContent('32.25');
    // JCGM 100:2008 7.2.6: the half-width 3.129 to two significant digits, the result to the same place.
    expect(row).toHaveTextContent('322.5 ± 3.1');
    expect(row).not.toHaveTextContent('322.54');
    expect(row).toHaveTextContent('calibration confidence interval, 95 %');
  });

  it('shows the expanded uncertainty of the validation instead of the interval when the result carries one', async () => {
    // U = 6 % of 322.54 = 19.35 → 19 (two significant digits, JCGM 100:2008 7.2.6), the result to the same place.
    const withU = {
      ...sample,
      uncertainty: { value: { U: 19.35, coverageFactor: 2, expressedAs: 'relative', relativePct: 6 }, basis: 'From the validation.' },
    };
    renderWithProviders(<ResultsTable unknowns={[withU as RunUnknown]} xUnit="mg/L" yUnit="µS·min" confidence={0.95} />);
    const row = within(await screen.findByRole('table', { name: 'Sample results' })).getByRole('row', { name: /W-2901/ });
    expect(row).toHaveTextContent('323 ± 19');
    expect(row).toHaveTextContent('expanded uncertainty U, k = 2');
  });

  it('says in words whether each method blank and QC sample met its limit', async () => {
    renderWithProviders(
      <ControlsTables
        blanks={[{ id: 'MB-1', yMean: 0.05, found: 0.31, limit: 0.0304, limitBasis: 'lod', pass: false }]}
        qcSamples={[{ id: 'QC 20', known: 20, dilution: 1, yMean: 3.05, found: 20.02, recoveryPct: 100.1, pass: true }]}
        window={{ low: 80, high: 120, basis: 'the mean-recovery criterion of this method version' }}
        xUnit="mg/L"
      />,
    );
    expect(within(await screen.findByRole('table', { name: 'Method blanks' })).getByRole('row', { name: /MB-1/ })).toHaveTextContent(
      'Not below the limit',
    );
    expect(within(screen.getByRole('table', { name: 'QC samples' })).getByRole('row', { name: /QC 20/ })).toHaveTextContent(
      'Within the window',
    );
    expect(screen.getByText(/must recover 80 to 120 % of their known value/)).toBeInTheDocument();
  });
});
