import { type ValidationBasis } from '@meritline/shared';
import { describe, expect, it } from 'vitest';
import { limitsText } from './run-sheet.js';

function validation(overrides: Partial<ValidationBasis>): ValidationBasis {
  return {
    studyId: 's',
    studyTitle: 'Validation',
    approvedAt: null,
    model: 'linear',
    weighting: 'none',
    confidence: 0.95,
    slope: 0.2,
    intercept: 0.01,
    curvature: null,
    lod: 0.12,
    loq: 0.38,
    lodBasis: 'sdResidual',
    loqBasis: 'sdResidual',
    validatedRange: null,
    interceptTest: null,
    ...overrides,
  };
}

describe('run sheet detection limits', () => {
  it('names each limit’s own basis when the LOD comes from the MDL and the LOQ from the residual SD', () => {
    const text = limitsText(validation({ lod: 0.05, lodBasis: 'epaMdl', loqBasis: 'sdResidual' }), 'mg/L');
    expect(text).toBe(
      'LOD 0.0500 mg/L (Method detection limit, 40 CFR 136 App. B); LOQ 0.380 mg/L (Residual SD of the calibration, ICH Q2(R2)); measured solution',
    );
    expect(text).not.toMatch(/epaMdl|sdResidual/);
  });

  it('names one basis once when both limits share it', () => {
    expect(limitsText(validation({}), 'mg/L')).toBe(
      '0.120 mg/L / 0.380 mg/L (measured solution; both from: Residual SD of the calibration, ICH Q2(R2))',
    );
  });
});
