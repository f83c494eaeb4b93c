import { describe, expect, it } from 'vitest';
import {
  formatDate,
  formatDateTime,
  formatEstimate,
  formatLevel,
  formatNumber,
  formatPercent,
  formatPercentValue,
  formatPValue,
  NOT_AVAILABLE,
  pText,
} from '../catalogue/format.js';

describe('number formatting shared by the screens and the signed reports', () => {
  it('should round an estimate to its standard uncertainty given to two significant digits', () => {
    // JCGM 100:2008 (GUM) 7.2.2, example (from memory): m_S = 100.021 47 g with u_c = 0.35 mg is written 100.021 47(35) g.
    expect(formatEstimate(100.02147, 0.00035)).toEqual({ value: '100.02147', uncertainty: '0.00035', decimals: 5 });
    // Miller & Miller fluorescence example (recomputed values): b = 1.930357, s_b = 0.040900 print as 1.930 and 0.041.
    expect(formatEstimate(1.930357142857143, 0.040900264457006445)).toEqual({ value: '1.930', uncertainty: '0.041', decimals: 3 });
    expect(formatEstimate(97.517, 60.168)).toEqual({ value: '98', uncertainty: '60', decimals: 0 });
    expect(formatEstimate(5, null).uncertainty).toBe(NOT_AVAILABLE);
  });

  it('should keep significant digits without rounding away integer digits or switching to exponents in the usual range', () => {
    expect(formatNumber(0.637682014941968, 3)).toBe('0.638');
    expect(formatNumber(55333.3333, 4)).toBe('55333');
    expect(formatNumber(0.5, 4)).toBe('0.5000');
    expect(formatNumber(-0.00227, 3)).toBe('-0.00227');
    expect(formatNumber(1e-8, 3)).toBe('1.00 × 10⁻⁸');
    expect(formatNumber(2.5392e8, 5)).toBe('2.5392 × 10⁸');
    expect(formatNumber(2.5e6, 4)).toBe('2500000');
    expect(formatNumber(-0.00001, 2)).toBe('-1.0 × 10⁻⁵');
    expect(formatNumber(-0.0000001 * 0, 3)).toBe('0.00');
    expect(formatNumber(null)).toBe(NOT_AVAILABLE);
    expect(formatNumber(Number.NaN)).toBe(NOT_AVAILABLE);
  });

  it('should print nominal levels as entered and percentages with at least one decimal', () => {
    expect(formatLevel(0.5)).toBe('0.5');
    expect(formatLevel(50)).toBe('50');
    expect(formatLevel(0.1 + 0.2)).toBe('0.3');
    expect(formatPercentValue(98.6666)).toBe('98.7');
    expect(formatPercentValue(0.7235)).toBe('0.724');
    expect(formatPercent(100)).toBe('100.0 %');
    expect(formatPercent(98.7654, 4)).toBe('98.77 %');
  });

  it('should give p-values two significant digits and only a bound below 0.001', () => {
    expect(formatPValue(0.12245797)).toBe('0.122');
    expect(formatPValue(0.0049161)).toBe('0.0049');
    expect(formatPValue(8.0e-37)).toBe('< 0.001');
    expect(pText(0.5148)).toBe('p = 0.515');
    expect(pText(0.0001)).toBe('p < 0.001');
  });

  it('should write dates as ISO 8601 in UTC', () => {
    expect(formatDate('2026-11-03')).toBe('2026-11-03');
    expect(formatDateTime(new Date('2026-11-20T09:14:59.999Z'))).toBe('2026-11-20 09:14 UTC');
    expect(formatDateTime(null)).toBe(NOT_AVAILABLE);
    expect(formatDate('not a date')).toBe(NOT_AVAILABLE);
  });
});
