import { describe, expect, it } from 'vitest';
import { describeCriterion, figureLabel, figureUnit, findFigure } from '../catalogue/figures.js';
import { evaluateStudy } from '../evaluate.js';
import { withVersionOptions } from '../version-options.js';

// Invented design: 3 levels × 3 series × 2 replicates, and a reference material.
const accuracy = [
  [1, [0.98, 1.01], [1.03, 1.02], [0.97, 0.99]],
  [5, [4.96, 5.04], [5.08, 5.02], [4.95, 4.99]],
  [10, [9.9, 10.05], [10.12, 10.02], [9.95, 9.98]],
].flatMap(([nominal, ...series]) =>
  (series as number[][]).flatMap((values, s) =>
    values.map((found) => ({ level: `L${nominal}`, series: `day ${s + 1}`, nominal: nominal as number, found })),
  ),
);
const study = {
  accuracy,
  referenceMaterial: { certified: 5.2, uCertified: 0.05, results: [5.1, 5.25, 5.18, 5.22] },
  criteria: [
    { figure: 'accuracyProfile.validFrom', op: '<=', value: 1 },
    { figure: 'uncertainty.byLevel.L5.UPct', op: '<=', value: 10 },
    { figure: 'uncertainty.relative.UPct', op: '<=', value: 0.01 },
    { figure: 'trueness.UDifference', op: '>', value: 0 },
  ],
};

describe('uncertainty, accuracy-profile and trueness figures', () => {
  it('have words, units and a section in the catalogue, per level too', () => {
    expect(figureLabel('uncertainty.relative.UPct')).toBe('Expanded uncertainty U, relative (largest level)');
    expect(figureLabel('uncertainty.byLevel.L5.uRw')).toBe('Within-laboratory reproducibility u(Rw) at level L5');
    expect(figureUnit('uncertainty.byLevel.L5.uBias', { x: 'mg/L' })).toBe('mg/L');
    expect(findFigure('accuracyProfile.levels.L1.upperPct')?.section).toBe('Accuracy profile');
    expect(describeCriterion({ figure: 'accuracyProfile.validFrom', op: '<=', value: 1 }, { x: 'mg/L' })).toBe(
      'Lower limit of quantitation (accuracy profile) at most 1 mg/L',
    );
    expect(findFigure('trueness.UDifference')?.section).toBe('Trueness against a reference material');
  });

  it('are judged by the criteria with the values of the result', () => {
    const result = evaluateStudy(study);
    const [from, uAtL5, largest, trueness] = result.verdict.criteria;
    expect(from.value).toBe(result.accuracyProfile!.validFrom);
    expect(uAtL5.value).toBe(result.uncertainty!.byLevel.find((l) => l.level === 'L5')!.UPct);
    expect(uAtL5.pass).toBe(true);
    expect(largest.value).toBe(result.uncertainty!.relative!.UPct);
    expect(largest.pass).toBe(false);
    expect(trueness.value).toBe(result.trueness!.UDifference);
    expect(result.verdict.pass).toBe(false);
  });

  it('takes β, λ and k from the method version only where the study states none', () => {
    const settings = { accuracyBeta: 0.95, accuracyLambdaPct: 5, coverageFactor: 3 };
    expect(withVersionOptions({ precision: [] }, settings)).toEqual({ precision: [] });
    const filled: Record<string, unknown> = withVersionOptions({ accuracy } as Record<string, unknown>, settings);
    expect(filled.accuracyProfile).toEqual({ beta: 0.95, lambda: 5 });
    expect(filled.uncertainty).toEqual({ coverageFactor: 3 });
    const own: Record<string, unknown> = withVersionOptions(
      { accuracy, accuracyProfile: { beta: 0.8 }, uncertainty: { coverageFactor: 2 } },
      settings,
    );
    expect(own.accuracyProfile).toEqual({ beta: 0.8, lambda: 5 });
    expect(own.uncertainty).toEqual({ coverageFactor: 2 });
    const result = evaluateStudy(filled);
    expect(result.accuracyProfile!.beta).toBe(0.95);
    expect(result.uncertainty!.coverageFactor).toBe(3);
  });
});
