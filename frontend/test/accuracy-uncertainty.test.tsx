import { evaluateStudy, formatNumber } from '@meritline/shared';
import { screen, within } from '@testing-library/react';
import { AccuracyProfilePlot, AccuracyProfileTables, TruenessSummary } from '@/components/study-results/accuracy-profile';
import { judgeCriteria } from '@/components/study-results/judge-criteria';
import { UncertaintyTables } from '@/components/study-results/uncertainty-tables';
import { renderWithProviders } from './render';

// The 3-level accuracy profile of reference-checks/data/tolerance_interval_accuracy_profile.json (synthetic data; the
// β-expectation tolerance limits recomputed there with the Mee 1984 formula, written from memory): with β = 0.95 and
// λ = 5 %, level 10 has limits −12.18 % to +11.96 % (outside), levels 50 and 100 lie inside.
const levels: [number, number[][]][] = [
  [
    10,
    [
      [9.8, 10.1, 9.9],
      [10.3, 10.4, 10.2],
      [9.7, 9.9, 9.6],
    ],
  ],
  [
    50,
    [
      [49.6, 50.2, 49.9],
      [50.8, 50.5, 51.0],
      [49.7, 49.4, 50.1],
    ],
  ],
  [
    100,
    [
      [99.1, 100.4, 99.8],
      [99.6, 100.9, 100.2],
      [100.3, 99.2, 99.9],
    ],
  ],
];
const accuracy = levels.flatMap(([nominal, series]) =>
  series.flatMap((values, s) => values.map((found) => ({ level: `${nominal}`, series: `day ${s + 1}`, nominal, found }))),
);
const units = { x: 'mg/L', y: 'AU' };
// Invented: a sample read off an invented calibration, and an invented reference material.
const study = {
  units,
  accuracy,
  accuracyProfile: { beta: 0.95, lambda: 5 },
  uncertainty: { relativeAbove: 20 },
  referenceMaterial: { certified: 50.5, uCertified: 0.2, results: [50.1, 50.6, 49.8, 50.3] },
  standards: [1, 2, 4, 8].flatMap((x) => [
    { x, y: 0.05 * x + 0.001 },
    { x, y: 0.05 * x + 0.0014 },
  ]),
  unknowns: [{ id: 'S-1 invented sample', y: [0.2012, 0.2016] }],
};
const criteria = [{ figure: 'accuracyProfile.validFrom', op: '<=' as const, value: 50 }];
const result = evaluateStudy({ ...study, criteria });
const judged = judgeCriteria(criteria, result);

describe('accuracy profile, trueness and uncertainty displays', () => {
  it('states the validity domain in words and judges the lower limit of quantitation against its criterion', () => {
    renderWithProviders(<AccuracyProfileTables result={result} units={units} judged={judged} />);
    const profile = result.accuracyProfile!;
    expect(profile.levels.map((l) => l.within)).toEqual([false, true, true]);
    expect(profile.levels[0].lowerPct).toBeCloseTo(-12.18328611733484, 6);
    expect(screen.getByText(`from ${formatNumber(profile.validFrom, 4)} to ${formatNumber(profile.validTo, 4)} mg/L`)).toBeInTheDocument();
    const table = screen.getByRole('table', { name: 'Accuracy profile by level' });
    const rows = within(table).getAllByRole('row');
    expect(rows[1]).toHaveTextContent('-12.2 %');
    expect(rows[1]).toHaveTextContent('12.0 %');
    expect(rows[1]).toHaveTextContent('No');
    expect(rows[3]).toHaveTextContent('Yes');
    const domain = screen.getByRole('table', { name: 'Validity domain of the accuracy profile' });
    expect(within(domain).getByRole('row', { name: /Lower limit of quantitation/ })).toHaveTextContent('Meets');
  });

  it('labels the plot with the validity domain for people who cannot see it', () => {
    renderWithProviders(<AccuracyProfilePlot result={result} units={units} />);
    expect(
      screen.getByRole('group', { name: /^Accuracy profile: relative bias and 95 % β-expectation tolerance limits at 3 levels/ }),
    ).toHaveAccessibleName(
      expect.stringContaining(
        `valid from ${formatNumber(result.accuracyProfile!.validFrom, 4)} to ${formatNumber(result.accuracyProfile!.validTo, 4)} mg/L`,
      ),
    );
  });

  it('shows U by level, absolute below the switch-over and relative from it, with the calibration u(x0) beside it', () => {
    renderWithProviders(<UncertaintyTables result={result} units={units} judged={judged} />);
    const u = result.uncertainty!;
    const table = screen.getByRole('table', { name: 'Measurement uncertainty by level' });
    expect(within(table).getByRole('columnheader', { name: 'U (k = 2)' })).toBeInTheDocument();
    const [low, mid] = within(table).getAllByRole('row').slice(1);
    expect(low).toHaveTextContent('Absolute (mg/L)');
    expect(low).toHaveTextContent(`${formatNumber(u.byLevel[0].U, 3)} mg/L`);
    expect(mid).toHaveTextContent('Relative (%)');
    expect(mid).toHaveTextContent(`${formatNumber(u.byLevel[1].UPct, 3)} %`);
    // u_c = √(u(R_w)² + u(bias)²) (Nordtest TR 537).
    expect(u.byLevel[1].ucPct).toBeCloseTo(Math.hypot(u.byLevel[1].uRwPct, u.byLevel[1].uBiasPct), 12);
    const samples = screen.getByRole('table', { name: 'Uncertainty of the samples read off the calibration' });
    expect(samples).toHaveTextContent('S-1 invented sample');
    expect(samples).toHaveTextContent(formatNumber(result.unknowns![0].sX0, 3));
  });

  it('says in plain words whether the reference material shows a bias', () => {
    renderWithProviders(<TruenessSummary result={result} units={units} judged={judged} />);
    // Mean 50.2, 0.3 below 50.5; U of the difference = 2·√(s²/4 + 0.2²) ≈ 0.53 (common practice).
    expect(screen.getByTestId('trueness-words')).toHaveTextContent(
      /The mean of 4 results on the reference material is 50\.20 mg\/L, 0\.300 mg\/L \(0\.594 %\) below the certified 50\.5 mg\/L\. That difference is within the expanded uncertainty of the difference, so no bias is shown on this material/,
    );
    expect(document.body.textContent).not.toMatch(/trueness\.|accuracyProfile\./);
  });
});
