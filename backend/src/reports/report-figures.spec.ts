import { describe, expect, it } from 'vitest';
import { criterionInWords, describeFigure, formatAgainstCriterion } from './report-figures.js';

const units = { x: 'µg/L', y: 'peak area' };

describe('figures in words', () => {
  it('should name result paths with their units', () => {
    expect(describeFigure('calibration.r2', units)).toEqual({ label: 'Coefficient of determination R²', unit: null, kind: 'correlation' });
    expect(describeFigure('detection.blankSd.lod', units)).toEqual({
      label: 'LOD (SD of blank responses, ICH Q2(R2))',
      unit: 'µg/L',
      kind: 'plain',
    });
    expect(describeFigure('recovery.byLevel.low.meanPct', units)).toMatchObject({
      label: 'Mean recovery, level low',
      unit: '%',
      kind: 'percent',
    });
    expect(describeFigure('precision.rsdR', units)).toMatchObject({ unit: '%', kind: 'percent' });
    expect(describeFigure('calibration.slope', units).unit).toBe('peak area per µg/L');
    expect(describeFigure('mandel.p', units).kind).toBe('p');
    expect(describeFigure('something.new', units).label).toBe('something.new');
  });

  it('should state criteria in words, never with signs the font lacks', () => {
    expect(criterionInWords('>=', 0.995, null)).toBe('at least 0.995');
    expect(criterionInWords('<=', 5, '%')).toBe('at most 5 %');
    expect(criterionInWords('between', [90, 110], '%')).toBe('between 90 and 110 %');
    expect(criterionInWords('abs<=', 15, '%')).toBe('within ±15 % of zero');
    expect(criterionInWords('<', 0.5, 'µg/L')).toBe('less than 0.5 µg/L');
  });

  it('should print enough digits that the printed value agrees with the outcome', () => {
    expect(formatAgainstCriterion(0.99988, 'correlation', '>=', 0.995, true)).toBe('0.99988');
    // Rounded to five decimals 0.994996 would read 0.99500 and seem to meet "at least 0.995".
    expect(formatAgainstCriterion(0.994996, 'correlation', '>=', 0.995, false)).toBe('0.994996');
    expect(formatAgainstCriterion(110.04, 'percent', 'between', [90, 110], false)).toBe('110.04');
    expect(formatAgainstCriterion(null, 'plain', '<=', 1, false)).toBe('—');
  });
});
