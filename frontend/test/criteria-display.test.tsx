import { evaluateStudy, formatNumber } from '@meritline/shared';
import { screen, within } from '@testing-library/react';
import { CalibrationTable } from '@/components/study-results/calibration-figures';
import { describeRequirement } from '@/components/study-results/format';
import { judgeCriteria } from '@/components/study-results/judge-criteria';
import { VerdictSummary } from '@/components/study-results/verdict-summary';
import type { CriterionDefinition } from '@/components/study-results/types';
import { renderWithProviders } from './render';

// Miller & Miller, Statistics and Chemometrics for Analytical Chemistry, fluorescence calibration
// example: the book prints b = 1.93, a = 1.52, r = 0.9989; recomputed b = 1.930357…,
// a = 1.517857…, R² = 0.997760… (reference-checks/data/calibration_miller_fluorescence.json).
const x = [0, 2, 4, 6, 8, 10, 12];
const y = [2.1, 5.0, 9.0, 12.6, 17.3, 21.0, 24.7];
const data = { units: { x: 'pg/mL', y: 'units' }, standards: x.map((xi, i) => ({ x: xi, y: y[i] })) };

const criteria: CriterionDefinition[] = [
  { figure: 'calibration.r2', op: '>=', value: 0.995, label: 'R² at least 0.995' },
  { figure: 'calibration.r2', op: '>=', value: 0.999 },
  { figure: 'recovery.overall.meanPct', op: 'between', value: [98, 102], label: 'Mean recovery 98–102 %' },
];
const engineCriteria = criteria.map(({ figure, op, value }) => ({ figure, op, value }));
const result = evaluateStudy({ ...data, criteria: engineCriteria });

describe('criteria in words', () => {
  it.each([
    ['>=', 0.995, undefined, 'at least 0.995'],
    ['<=', 2, '%', 'at most 2 %'],
    ['between', [98, 102], '%', 'from 98 to 102 %'],
    ['abs<=', 20, '%', 'within ± 20 %'],
  ] as const)('%s %s reads "%s"', (op, value, unit, words) => {
    expect(describeRequirement(op, value as number | [number, number], unit)).toBe(words);
  });

  it('pairs each criterion with the engine outcome, in order', () => {
    const judged = judgeCriteria(criteria, result);
    // A known figure is named by the catalogue, never by a hand-written label that could contradict the limit.
    expect(judged.map((j) => [j.name, j.pass])).toEqual([
      ['Coefficient of determination R²', true],
      ['Coefficient of determination R²', false],
      ['Mean recovery, all levels', false],
    ]);
    expect(judged[0].value).toBeCloseTo(0.99776, 5);
    expect(judged[2].value).toBeNull();
  });
});

describe('VerdictSummary', () => {
  it('shows each criterion with what was required, what was found and the outcome in words', async () => {
    renderWithProviders(<VerdictSummary result={result} criteria={criteria} />);

    expect(await screen.findByText('Does not meet 2 of 3 acceptance criteria')).toBeInTheDocument();
    const table = screen.getByRole('table', { name: 'Acceptance criteria' });
    const rows = within(table).getAllByRole('row').slice(1);
    expect(rows[0]).toHaveTextContent('Coefficient of determination R²');
    expect(rows[0]).not.toHaveTextContent('calibration.r2');
    expect(rows[0]).toHaveTextContent('at least 0.995');
    expect(rows[0]).toHaveTextContent(formatNumber(result.verdict.criteria[0].value, 5));
    expect(rows[0]).toHaveTextContent('Meets');
    expect(rows[1]).toHaveTextContent('at least 0.999');
    expect(rows[1]).toHaveTextContent('Does not meet');
    // A criterion on a figure the study cannot give fails, and says why.
    expect(rows[2]).toHaveTextContent('from 98 to 102 %');
    expect(rows[2]).toHaveTextContent('Fails: not computed');
    // The outcome is never colour alone: each mark carries an icon and words.
    for (const row of rows) expect(row.querySelector('[data-outcome] svg')).not.toBeNull();
  });

  it('says there is no verdict when the method states no criteria', async () => {
    renderWithProviders(<VerdictSummary result={evaluateStudy(data)} criteria={[]} />);
    expect(await screen.findByText('No verdict: the method version states no acceptance criteria')).toBeInTheDocument();
  });
});

describe('CalibrationTable', () => {
  it('lists the fitted line with its criterion beside R² (Miller & Miller fluorescence)', async () => {
    renderWithProviders(<CalibrationTable result={result} units={data.units} judged={judgeCriteria(criteria, result)} />);
    const table = await screen.findByRole('table', { name: 'Calibration line' });
    const row = (name: string) => within(table).getByRole('row', { name: new RegExp(`^${name}`) });
    expect(row('Slope')).toHaveTextContent('1.9304 units per pg/mL');
    expect(row('Intercept')).toHaveTextContent('1.518 units');
    expect(row('Correlation coefficient r')).toHaveTextContent('0.99888');
    expect(row('Coefficient of determination R²')).toHaveTextContent('at least 0.995');
    expect(row('Coefficient of determination R²')).toHaveTextContent('Meets');
    expect(row('Adjusted R²')).not.toHaveTextContent('Meets');
  });
});
