import { evaluateStudy, type StudyInput } from '@meritline/shared';
import { screen, within } from '@testing-library/react';
import { DetectionExclusions } from '@/components/study-results/detection-table';
import { DiffPanel } from '@/features/reviews/components/diff-panel';
import { StudyDataSections } from '@/features/reviews/components/study-data-sections';
import { renderWithProviders } from './render';

// Invented low-level spikes and MDL blanks (mg/L) of the demo laboratory: the fourth spike and the second blank are excluded.
const data: StudyInput = {
  lowSpikes: {
    spiked: [0.21, 0.18, 0.24, { value: 0.43, excluded: { reason: 'spiked twice' } }, 0.2, 0.17, 0.22, 0.19],
    blanks: [0.02, { value: 0.11, excluded: { reason: 'contaminated vial' } }, null],
  },
};
const units = { x: 'mg/L', y: 'AU' };

describe('excluded low-level spikes and MDL blanks on screen', () => {
  it('lists them with their values and reasons under the detection limits', () => {
    renderWithProviders(<DetectionExclusions result={evaluateStudy(data)} units={units} />);
    const table = screen.getByRole('table', { name: 'Results excluded from the detection limits' });
    const rows = within(table).getAllByRole('row').slice(1);
    expect(rows.map((row) => row.textContent)).toEqual([
      'Low-level spike, row 40.43 mg/Lspiked twice',
      'Method blank for the MDL, row 20.11 mg/Lcontaminated vial',
    ]);
  });

  it('shows nothing when no result is excluded', () => {
    const { container } = renderWithProviders(
      <DetectionExclusions result={evaluateStudy({ lowSpikes: { spiked: [0.21, 0.18, 0.24] } })} units={units} />,
    );
    expect(container.querySelector('table')).toBeNull();
  });

  it('gives the reviewer each value as entered and the reason it was excluded', () => {
    renderWithProviders(<StudyDataSections data={data} units={units} />);
    const spikes = screen.getByRole('table', { name: /Low-level spikes/ });
    expect(within(spikes).getByRole('row', { name: /0\.43/ })).toHaveTextContent('spiked twice');
    const blanks = screen.getByRole('table', { name: /Method blanks/ });
    expect(within(blanks).getByRole('row', { name: /0\.11/ })).toHaveTextContent('contaminated vial');
    expect(within(blanks).getByRole('row', { name: /not detected/ })).toBeInTheDocument();
  });

  it('shows the reviewer a newly excluded spike as its exclusion between two submissions', () => {
    const diff = {
      from: { signatureId: 'sig-1', signedAt: '2026-11-30T10:00:00.000Z' },
      to: { signatureId: 'sig-2', signedAt: '2026-12-01T10:00:00.000Z' },
      settings: [],
      meta: [],
      sections: [
        {
          section: 'lowSpikes.spiked',
          added: [],
          removed: [],
          changed: [{ key: '#4', field: 'excluded', from: null, to: { reason: 'spiked twice' } }],
        },
      ],
    };
    renderWithProviders(<DiffPanel diff={diff} data={data} unit="mg/L" />);
    const row = within(screen.getByRole('table', { name: 'Changes between submissions' })).getAllByRole('row')[1];
    expect(
      within(row)
        .getAllByRole('cell')
        .map((cell) => cell.textContent),
    ).toEqual(['Low-level spikes', 'Row 4: Excluded', 'changed', '—', 'yes: spiked twice']);
  });
});
