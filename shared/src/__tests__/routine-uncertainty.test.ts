import { describe, expect, it } from 'vitest';
import { routineUncertainty } from '../engine/routine-uncertainty.js';

// U = k·u_c (GUM, JCGM 100:2008 §6.2); the levels are invented and every expected value is computed by hand.
const both = { coverageFactor: 2, absolute: { U: 0.2, uc: 0.1, below: 5 }, relative: { UPct: 6, ucPct: 3, from: 5 } };

describe('routine result uncertainty from the validation', () => {
  it('takes the absolute U below the switch level and scales it by the dilution factor', () => {
    expect(routineUncertainty(both, 2.5, 1)).toEqual({ U: 0.2, coverageFactor: 2, expressedAs: 'absolute', relativePct: null });
    expect(routineUncertainty(both, 2.5, 10)!.U).toBeCloseTo(2, 12);
  });

  it('takes the relative U at and above the switch level, applied to the dilution-corrected result', () => {
    expect(routineUncertainty(both, 5, 1)).toEqual({ U: 0.3, coverageFactor: 2, expressedAs: 'relative', relativePct: 6 });
    expect(routineUncertainty(both, 8, 4)!.U).toBeCloseTo(0.06 * 32, 12);
  });

  it('uses the only statement the validation gives everywhere', () => {
    expect(routineUncertainty({ ...both, absolute: null }, 0.5, 1)!.U).toBeCloseTo(0.03, 12);
    expect(routineUncertainty({ ...both, relative: null }, 50, 2)!.U).toBeCloseTo(0.4, 12);
    expect(routineUncertainty({ ...both, absolute: null, relative: null }, 1, 1)).toBeNull();
  });
});
