import { describe, expect, it } from 'vitest';
import { evaluateStudy } from '../evaluate.js';
import { parseStudy } from '../validate.js';
import { typicalStudy, validationErrors } from './helpers.js';

// Invented nitrate study; the ninth blank is made gross (a carried-over vial) so it would dominate the blank SD.
const blanks = typicalStudy.blanks.map((b, i) => (i === 8 ? 0.0412 : b));
const carryOver = { reason: 'carry-over from the top standard', test: 'grubbs' };

describe('excluded method blanks', () => {
  it('leave every blank-based figure exactly as if the blank were not there', () => {
    const withExclusion = evaluateStudy({
      ...typicalStudy,
      blanks: blanks.map((value, i) => (i === 8 ? { value, excluded: carryOver } : value)),
    });
    const without = evaluateStudy({ ...typicalStudy, blanks: blanks.filter((_, i) => i !== 8) });
    const { excludedBlanks, ...figures } = withExclusion.detection!;
    const { excludedBlanks: none, ...expected } = without.detection!;
    expect(figures).toEqual(expected);
    expect(none).toEqual([]);
    expect(excludedBlanks).toEqual([{ index: 8, label: 'blank 9', value: 0.0412, reason: carryOver.reason }]);
    expect(figures.blankSd?.n).toBe(9);
    // Mean of the nine kept blanks, summed by hand: 0.1026 / 9.
    expect(figures.blankSd?.mean).toBeCloseTo(0.1026 / 9, 12);
    expect(withExclusion.warnings).toContainEqual({
      section: 'detection',
      code: 'excluded',
      message: '1 method blank excluded by the analyst: carry-over from the top standard',
    });
    expect(withExclusion.outliers?.some((flag) => flag.set === 'blanks' && flag.index === 8)).toBe(false);
    // Kept in, the gross blank is the one Grubbs' test points at (index in the study's own list).
    const kept = evaluateStudy({ ...typicalStudy, blanks });
    expect(kept.outliers?.some((flag) => flag.set === 'blanks' && flag.index === 8 && flag.outlier)).toBe(true);
    expect(kept.detection?.blankSd?.n).toBe(10);
  });

  it('keep plain-number blanks and blanks written as an object without exclusion unchanged', () => {
    const plain = evaluateStudy(typicalStudy);
    const asObjects = evaluateStudy({ ...typicalStudy, blanks: typicalStudy.blanks.map((value) => ({ value })) });
    expect(asObjects.detection).toEqual(plain.detection);
    expect(plain.detection?.excludedBlanks).toEqual([]);
    expect(parseStudy(typicalStudy).blanks).toEqual(typicalStudy.blanks);
  });

  it('answer no blank SD, with a warning, when every blank is excluded', () => {
    const result = evaluateStudy({ ...typicalStudy, blanks: blanks.map((value) => ({ value, excluded: carryOver })) });
    expect(result.detection?.blankSd).toBeNull();
    expect(result.detection?.excludedBlanks).toHaveLength(10);
    expect(result.warnings).toContainEqual({ section: 'detection', code: 'all_excluded', message: 'every method blank is excluded' });
  });

  it('refuse a blank object without a number or with an unknown field or a reason that is not text', () => {
    expect(validationErrors(() => parseStudy({ ...typicalStudy, blanks: [0.01, { value: 'high' }] }))).toContainEqual(
      expect.objectContaining({ field: 'blanks[1].value' }),
    );
    expect(validationErrors(() => parseStudy({ ...typicalStudy, blanks: [{ value: 0.01, note: 'x' }] }))).toContainEqual(
      expect.objectContaining({ field: 'blanks[0].note', code: 'unknown_field' }),
    );
    expect(validationErrors(() => parseStudy({ ...typicalStudy, blanks: [{ value: 0.01, excluded: { reason: 3 } }] }))).toContainEqual(
      expect.objectContaining({ field: 'blanks[0].excluded.reason' }),
    );
    expect(validationErrors(() => parseStudy({ ...typicalStudy, blanks: [0.01, 'x'] }))).toContainEqual(
      expect.objectContaining({ field: 'blanks[1]' }),
    );
  });
});
