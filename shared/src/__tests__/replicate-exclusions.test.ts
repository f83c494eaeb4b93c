import { describe, expect, it } from 'vitest';
import { evaluateStudy } from '../evaluate.js';
import { parseStudy } from '../validate.js';
import { validationErrors } from './helpers.js';

// Invented spike-recovery and precision rows; one gross value in each (a spilt vial, a wrong dilution).
const recovery = [
  { id: 'S1', level: 'low', added: 1, found: 0.98 },
  { id: 'S2', level: 'low', added: 1, found: 1.02 },
  { id: 'S3', level: 'low', added: 1, found: 0.62 },
  { id: 'S4', level: 'high', added: 10, found: 9.9 },
  { id: 'S5', level: 'high', added: 10, found: 10.1 },
];
const precision = [
  { group: 'day 1', value: 5.02 },
  { group: 'day 1', value: 4.98 },
  { group: 'day 1', value: 5.01 },
  { group: 'day 2', value: 5.06 },
  { group: 'day 2', value: 5.9 },
  { group: 'day 2', value: 5.04 },
];
const spilt = { reason: 'vial spilt before injection' };

describe('excluded replicate rows', () => {
  it('leave recovery figures exactly as if the row were not there, and are listed with their reason', () => {
    const withExclusion = evaluateStudy({ recovery: recovery.map((r, i) => (i === 2 ? { ...r, excluded: spilt } : r)) });
    const without = evaluateStudy({ recovery: recovery.filter((_, i) => i !== 2) });
    expect(withExclusion.recovery?.overall).toEqual(without.recovery?.overall);
    expect(withExclusion.recovery?.byLevel).toEqual(without.recovery?.byLevel);
    expect(withExclusion.recovery?.items).toEqual(without.recovery?.items);
    expect(withExclusion.recovery?.excluded).toEqual([{ index: 2, label: 'S3', value: 0.62, reason: spilt.reason }]);
    // Recovery = 100 (found − native) / added, common practice: low level (98 + 102) / 2 = 100 %.
    expect(withExclusion.recovery?.byLevel.find((g) => g.level === 'low')?.meanPct).toBeCloseTo(100, 10);
    expect(withExclusion.warnings).toContainEqual({
      section: 'recovery',
      code: 'excluded',
      message: '1 recovery experiment excluded by the analyst: vial spilt before injection',
    });
    // Without the exclusion the gross value pulls the low-level mean down to (98 + 102 + 62) / 3.
    expect(evaluateStudy({ recovery }).recovery?.byLevel.find((g) => g.level === 'low')?.meanPct).toBeCloseTo(262 / 3, 10);
  });

  it('leave the precision analysis of variance exactly as if the result were not there', () => {
    const withExclusion = evaluateStudy({
      precision: precision.map((p, i) => (i === 4 ? { ...p, excluded: { reason: 'wrong dilution' } } : p)),
    });
    const without = evaluateStudy({ precision: precision.filter((_, i) => i !== 4) });
    const { excluded, ...figures } = withExclusion.precision!;
    const { excluded: none, ...expected } = without.precision!;
    expect(figures).toEqual(expected);
    expect(none).toEqual([]);
    expect(excluded).toEqual([{ index: 4, label: 'day 2', value: 5.9, reason: 'wrong dilution' }]);
    expect(figures.N).toBe(5);
    // Series means 5.0033… and 5.05: the excluded 5.9 is not in either.
    expect(figures.series.find((s) => s.group === 'day 2')?.mean).toBeCloseTo(5.05, 12);
    expect(withExclusion.outliers?.some((flag) => flag.set === 'precision day 2' && flag.index === 4)).toBe(false);
  });

  it('answer nothing, with a warning, when every row of a section is excluded', () => {
    const result = evaluateStudy({ recovery: recovery.map((r) => ({ ...r, excluded: spilt })) });
    expect(result.recovery).toBeNull();
    expect(result.warnings.map((w) => w.code)).toContain('all_excluded');
  });

  it('need a reason, as an excluded standard does', () => {
    const errors = validationErrors(() =>
      parseStudy({ recovery: [{ ...recovery[0], excluded: {} }], precision: [{ ...precision[0], excluded: { reason: ' ' } }] }),
    );
    expect(errors.map((e) => e.field).sort()).toEqual(['precision[0].excluded.reason', 'recovery[0].excluded.reason']);
    const parsed = parseStudy({ precision: [{ ...precision[0], excluded: { reason: 'bubble', test: 'grubbs' } }] });
    expect(parsed.precision?.[0].excluded).toEqual({ reason: 'bubble', test: 'grubbs' });
  });
});
