import { describe, expect, it } from 'vitest';
import type { ValidationBasis } from '../api/runs.js';
import { modelChoices } from '../runs/calibration-choices.js';

const settings = { checkTolerancePct: 10, onePointMaxInterceptPct: 2 };

function basis(overrides: Partial<ValidationBasis> = {}): ValidationBasis {
  return {
    studyId: 's',
    studyTitle: 'Validation',
    approvedAt: null,
    model: 'linear',
    weighting: 'none',
    confidence: 0.95,
    slope: 0.0725,
    intercept: 0.0133,
    curvature: null,
    lod: 0.66,
    loq: 2,
    lodBasis: 'sdResidual',
    loqBasis: 'sdResidual',
    validatedRange: { low: 0, high: 10, basis: 'standards' },
    // Miller & Miller weighted example fitted unweighted: intercept 1.8 % of the top response, p about 0.28.
    interceptTest: { intercept: 0.0133, p: 0.28, significant: false, interceptPctOfTopResponse: 1.8 },
    ...overrides,
  };
}

const choice = (choices: ReturnType<typeof modelChoices>, model: string) => choices.find((c) => c.model === model)!;

describe('calibration choices of a run', () => {
  it('should offer one-point when the intercept is not significant and within the limit (common practice)', () => {
    const choices = modelChoices(basis(), settings, 'AU');
    expect(choice(choices, 'one-point')).toEqual({ model: 'one-point', allowed: true });
    expect(choice(choices, 'linear')).toEqual({ model: 'linear', allowed: true, weighting: 'none' });
    expect(choice(choices, 'quadratic').allowed).toBe(false);
  });

  it('should refuse one-point in words for a significant intercept, one above the limit, or no intercept test', () => {
    const significant = modelChoices(
      basis({ interceptTest: { intercept: 1.518, p: 0.0036, significant: true, interceptPctOfTopResponse: 6.1 } }),
      settings,
      'AU',
    );
    expect(choice(significant, 'one-point').reason).toBe(
      "The validation's intercept (1.52 AU) differs significantly from zero (p = 0.0036): a line forced through the origin would bias the results.",
    );
    const above = modelChoices(basis(), { ...settings, onePointMaxInterceptPct: 1 });
    expect(choice(above, 'one-point').reason).toMatch(/1\.8 % of the top standard's response, above this version's limit of 1 %/);
    const untested = modelChoices(basis({ interceptTest: null }), settings);
    expect(choice(untested, 'one-point').reason).toMatch(/no intercept test/);
  });

  it('should offer only the validated curve and weighting', () => {
    const curved = modelChoices(basis({ model: 'quadratic', weighting: '1/x' }), settings);
    expect(curved.filter((c) => c.allowed)).toEqual([{ model: 'quadratic', allowed: true, weighting: '1/x' }]);
    expect(choice(curved, 'two-point').reason).toMatch(/misread the samples between them/);
    expect(choice(modelChoices(basis({ weighting: '1/x2' }), settings), 'linear').weighting).toBe('1/x2');
  });

  it('should offer nothing without a validation', () => {
    expect(modelChoices(null, settings).every((c) => !c.allowed && c.reason)).toBe(true);
  });
});
