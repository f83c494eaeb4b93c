import { describe, expect, it } from 'vitest';
import { formatSignificant, formatWithInterval } from './report-format.js';

describe('reported numbers', () => {
  it('should round the interval to two significant figures and the value to the same decimal (GUM 7.2.6)', () => {
    expect(formatWithInterval(12.3456, 0.4321, 'mg/L')).toBe('12.35 ± 0.43 mg/L');
    expect(formatWithInterval(1234.5, 56.7, 'µg/L')).toBe('1235 ± 57 µg/L');
    expect(formatWithInterval(0.01234, 0.000987)).toBe('0.01234 ± 0.00099');
    expect(formatWithInterval(31.03608, 3.0815)).toBe('31.0 ± 3.1');
  });

  it('should keep trailing zeros that are significant and never print a negative zero', () => {
    expect(formatSignificant(0.5, 2)).toBe('0.50');
    expect(formatSignificant(12, 3)).toBe('12.0');
    expect(formatSignificant(-0.0001, 2)).toBe('-0.00010');
    expect(formatWithInterval(-0.001, 0.2)).toBe('0.00 ± 0.20');
  });
});
