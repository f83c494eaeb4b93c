import { describe, expect, it } from 'vitest';
import { formatR2, roundToInterval } from '../catalogue/format.js';

// JCGM 100:2008 (GUM) 7.2.6: an uncertainty needs at most two significant digits, and the result is rounded to match.
describe('rounding a result to its interval', () => {
  it.each([
    [322.5437, 0.3129, '322.54', '0.31'],
    [322.5437, 3.129, '322.5', '3.1'],
    [0.045612, 0.00234, '0.0456', '0.0023'],
    [12345.6, 234.5, '12350', '230'],
  ])('%s ± %s reads %s ± %s', (value, halfWidth, v, h) => {
    expect(roundToInterval(value, halfWidth)).toEqual({ value: v, halfWidth: h });
  });
});

describe('R² with enough digits', () => {
  it.each([
    [0.99776, '0.9978'],
    [0.9999962, '0.9999962'],
    [0.99999912, '0.99999912'],
    [1, '1.0000'],
  ])('%s reads %s', (r2, text) => {
    expect(formatR2(r2)).toBe(text);
  });
});
