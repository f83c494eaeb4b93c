import { describe, expect, it } from 'vitest';
import { controlLimits, controlSignals } from '../engine/control-rules.js';

// The rules are common practice in laboratory QC (Westgard 1-3s and 2-of-3 2s; runs of seven and trends of six).
// Each series below is built so that exactly the signals named occur; limits use mean 100 and s 1.
const limits = { mean: 100, sd: 1 };
const rules = (values: number[]) => controlSignals(values, limits).map((s) => [s.rule, s.index, s.direction]);

describe('control limits from a baseline', () => {
  it('gives mean ± 2 s and ± 3 s with the sample SD (n − 1), computed by hand', () => {
    // 2, 4, 4, 4, 5, 5, 7, 9: mean 5, squared deviations sum 32, s = √(32/7) = 2.138090…
    const l = controlLimits([2, 4, 4, 4, 5, 5, 7, 9])!;
    expect(l.mean).toBe(5);
    expect(l.sd).toBeCloseTo(2.1380899352993952, 14);
    expect(l.warning[0]).toBeCloseTo(5 - 4.27617987059879, 12);
    expect(l.action[1]).toBeCloseTo(5 + 6.414269805898186, 12);
  });

  it('refuses fewer than three baseline values', () => {
    expect(controlLimits([1, 2])).toBeNull();
  });
});

describe('run rules', () => {
  it('finds nothing in a series that alternates close to the mean', () => {
    expect(rules([100.5, 99.5, 100.4, 99.6, 100.3, 99.7, 100.2, 99.8, 100.1])).toEqual([]);
  });

  it('fires one point beyond 3 s on the side it lies', () => {
    expect(rules([100.2, 99.8, 103.5, 99.9, 96.4])).toEqual([
      ['beyondAction', 2, 'above'],
      ['beyondAction', 4, 'below'],
    ]);
  });

  it('fires two of three beyond the same 2 s limit, not two on opposite sides', () => {
    expect(rules([100.1, 102.5, 99.9, 102.4, 99.8])).toEqual([['twoOfThreeBeyondWarning', 3, 'above']]);
    expect(rules([100.1, 102.5, 97.5, 100.2])).toEqual([]);
    // Three beyond in a row fire once: the third point shares a partner with the signal already given.
    expect(rules([97.5, 97.6, 97.7, 100.1])).toEqual([['twoOfThreeBeyondWarning', 1, 'below']]);
  });

  it('fires at the seventh point in a row on one side, once per run', () => {
    const seven = [99.5, 100.3, 100.6, 100.2, 100.8, 100.4, 100.7, 100.1, 100.5, 99.6];
    expect(rules(seven)).toEqual([['sevenOnOneSide', 7, 'above']]);
    expect(rules(seven.slice(0, 7))).toEqual([]);
  });

  it('fires at the sixth point of a steady rise or fall', () => {
    expect(rules([100.5, 99.4, 99.6, 99.8, 100.1, 100.3, 100.4, 99.9])).toEqual([['sixTrending', 6, 'rising']]);
    expect(rules([100.6, 100.4, 100.2, 99.9, 99.7, 100.2])).toEqual([]);
    expect(rules([100.6, 100.4, 100.2, 99.9, 99.7, 99.5])).toEqual([['sixTrending', 5, 'falling']]);
  });
});
