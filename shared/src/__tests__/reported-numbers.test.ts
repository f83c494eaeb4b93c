import { describe, expect, it } from 'vitest';
import { formatRunInterval, formatRunSignificant } from '../runs/reported-numbers.js';

describe('reported numbers of a routine run', () => {
  it('should round the interval to two significant figures and the value to the same decimal (GUM 7.2.6)', () => {
    expect(formatRunInterval(12.3456, 0.4321, 'mg/L')).toBe('12.35 ± 0.43 mg/L');
    expect(formatRunInterval(1234.5, 56.7, 'µg/L')).toBe('1235 ± 57 µg/L');
    expect(formatRunInterval(0.01234, 0.000987)).toBe('0.01234 ± 0.00099');
    expect(formatRunInterval(31.03608, 3.0815)).toBe('31.0 ± 3.1');
  });

  it('should keep trailing zeros that are significant and never print a negative zero', () => {
    expect(formatRunSignificant(0.5, 2)).toBe('0.50');
    expect(formatRunSignificant(12, 3)).toBe('12.0');
    expect(formatRunSignificant(-0.0001, 2)).toBe('-0.00010');
    expect(formatRunInterval(-0.001, 0.2)).toBe('0.00 ± 0.20');
  });
});
