import { screen, within } from '@testing-library/react';
import { compareResults, evaluateStudy, type VersionComparisonResponse } from '@meritline/shared';
import { ComparisonTests } from '@/features/methods/components/comparison/comparison-tests';
import { renderWithProviders } from './render';

const levels = [1, 2, 4, 8, 16];
const study = (slope: number, recovery: number[]) =>
  evaluateStudy({
    standards: levels.flatMap((x, i) => [0, 1].map((r) => ({ x, y: 0.02 + slope * x + 0.003 * Math.sin(3 * i + r) }))),
    recovery: recovery.map((found, i) => ({ id: `R${i}`, added: 10, found })),
  });

function comparison(): VersionComparisonResponse {
  const c = compareResults(study(0.5, [9.9, 10.1, 10.0, 9.95]), study(0.6, [10.0, 10.05, 9.97, 10.02]));
  const side = {
    versionId: 'v',
    number: 1,
    status: 'retired' as const,
    createdAt: '',
    studyId: 's',
    studyTitle: 'A',
    studyStatus: null,
    approvedAt: null,
  };
  return {
    method: { id: 'm', name: 'Invented method', xUnit: 'mg/L', yUnit: 'AU' },
    from: side,
    to: { ...side, number: 2, status: 'active' },
    alpha: c.alpha,
    recoveryMarginPct: c.recoveryMarginPct,
    changes: [],
    figures: c.figures,
    tests: { ...c, recovery: c.recovery },
    detection: c.detection,
    range: c.range,
    missing: [],
  };
}

describe('ComparisonTests', () => {
  it('gives every test its verdict in words, and says in a sentence why a test could not be made', () => {
    renderWithProviders(<ComparisonTests comparison={comparison()} />);
    const slope = screen.getByRole('heading', { name: 'Slope (sensitivity)' }).closest('[data-testid="comparison-test"]') as HTMLElement;
    expect(within(slope).getByText('significantly different')).toBeInTheDocument();
    expect(slope.textContent).toMatch(/\(\+(19|20)(\.\d+)? % sensitivity\)/);
    expect(screen.getAllByText('equivalent within the margin').length).toBeGreaterThan(0);
    expect(screen.getAllByText('Precision results are missing from one of the studies.')).toHaveLength(2);
    expect(document.body.textContent).not.toMatch(/no-difference|calibration\.|\bdifferent\b(?! )/);
  });
});
