import { describe, expect, it } from 'vitest';
import { accuracyProfile, accuracyProfileErrors, betaExpectationInterval } from '../engine/accuracy-profile.js';
import { preparationErrors, preparationUncertainty, toleranceToStandard } from '../engine/preparation.js';
import { biasUncertainty, combineTopDown, topDownUncertainty, truenessVersusReference } from '../engine/uncertainty.js';
import type { AccuracyItem, PreparationInput } from '../uncertainty-types.js';
import { evaluateStudy } from '../evaluate.js';
import { validationErrors } from './helpers.js';

// Invented numbers: a 1 g/L stock diluted twice.
const prep: PreparationInput = {
  source: { purity: 0.998, uPurity: 0.001 },
  stock: {
    mass: 50.0,
    uMass: 0.02,
    massUnit: 'mg',
    volume: 50,
    volumeTolerance: 0.06,
    volumeDistribution: 'triangular',
    volumeRepeatability: 0.01,
    temperatureRange: 3,
  },
  steps: [
    {
      aliquot: 1,
      aliquotTolerance: 0.008,
      aliquotDistribution: 'rectangular',
      volume: 100,
      volumeTolerance: 0.1,
      volumeDistribution: 'triangular',
    },
    {
      aliquot: 5,
      aliquotTolerance: 0.015,
      aliquotDistribution: 'rectangular',
      volume: 50,
      volumeTolerance: 0.06,
      volumeDistribution: 'triangular',
    },
  ],
};

describe('standard preparation', () => {
  it('converts tolerances: a/√3 rectangular, a/√6 triangular', () => {
    expect(toleranceToStandard(Math.sqrt(3), 'rectangular')).toBeCloseTo(1, 14);
    expect(toleranceToStandard(Math.sqrt(6), 'triangular')).toBeCloseTo(1, 14);
  });

  it('gives the concentration in the mass unit per litre and carries the relative uncertainty down the dilutions', () => {
    const r = preparationUncertainty(prep);
    expect(r.stock.unit).toBe('mg/L');
    expect(r.stock.concentration).toBeCloseTo(998, 10);
    expect(r.steps[0].concentration).toBeCloseTo(9.98, 12);
    expect(r.steps[1].concentration).toBeCloseTo(0.998, 12);
    expect(r.steps[0].relativeU).toBeGreaterThan(r.stock.relativeU);
    expect(r.steps[1].relativeU).toBeGreaterThan(r.steps[0].relativeU);
    const rel = Math.hypot(r.stock.relativeU, 0.008 / Math.sqrt(3) / 1, 0.1 / Math.sqrt(6) / 100);
    expect(r.steps[0].relativeU).toBeCloseTo(rel, 14);
    const volume = r.stock.budget.find((b) => b.quantity === 'volume')!;
    const parts = r.stock.budget.filter((b) => b.quantity.startsWith('volume') && b.quantity !== 'volume');
    expect(Math.hypot(...parts.map((p) => p.u))).toBeCloseTo(volume.u, 14);
    expect(parts.find((p) => p.quantity === 'volumeTemperature')!.u).toBeCloseTo((3 * 2.1e-4 * 50) / Math.sqrt(3), 14);
  });

  it('is invariant to the mass unit except for the unit label', () => {
    const g = preparationUncertainty({ ...prep, stock: { ...prep.stock, mass: 0.05, uMass: 0.00002, massUnit: 'g' } });
    expect(g.stock.unit).toBe('g/L');
    expect(g.stock.concentration * 1000).toBeCloseTo(998, 9);
    expect(g.stock.relativeU).toBeCloseTo(preparationUncertainty(prep).stock.relativeU, 12);
  });

  it('refuses bad fields with field errors', () => {
    const bad = { ...prep, source: { purity: 1.2, uPurity: -1 }, stock: { ...prep.stock, mass: 0, volumeTolerance: -0.1 } };
    const fields = preparationErrors(bad).map((e) => e.field);
    expect(fields).toEqual(expect.arrayContaining(['source.purity', 'source.uPurity', 'stock.mass', 'stock.volumeTolerance']));
    expect(validationErrors(() => preparationUncertainty(bad)).length).toBe(fields.length);
  });
});

describe('top-down uncertainty', () => {
  it('combines u(Rw) and u(bias) in quadrature and U = k·u_c', () => {
    expect(biasUncertainty({ biases: [3, -4], uReference: 0 })).toBeCloseTo(Math.sqrt(12.5), 14);
    expect(combineTopDown(3, 4)).toEqual({ uc: 5, U: 10 });
    expect(combineTopDown(3, 4, 3).U).toBe(15);
  });

  it('states U absolute below relativeAbove and relative above it', () => {
    const r = topDownUncertainty(
      [
        { level: 'low', concentration: 1, sRw: 0.05, biasPct: [2, -2], uReferencePct: 1 },
        { level: 'high', concentration: 100, sRw: 2, biasPct: [1, 3], uReferencePct: 1 },
      ],
      { relativeAbove: 10 },
    );
    expect(r.byLevel.map((l) => l.expressedAs)).toEqual(['absolute', 'relative']);
    expect(r.absolute!.U).toBeCloseTo(2 * r.byLevel[0].uc, 14);
    expect(r.relative!.UPct).toBeCloseTo(2 * r.byLevel[1].ucPct, 14);
    expect(topDownUncertainty(r.byLevel.map((l) => ({ ...l, sRw: l.uRw, biasPct: [0], uReferencePct: 0 }))).absolute).toBeNull();
  });

  it('trueness: a clear bias is reported significant and in words', () => {
    const ok = truenessVersusReference({ certified: 10, uCertified: 0.1, results: [10.1, 9.9, 10.0, 10.2] });
    expect(ok.significant).toBe(false);
    expect(ok.conclusion).toMatch(/no bias/);
    const biased = truenessVersusReference({ certified: 10, uCertified: 0.05, results: [10.9, 11.0, 11.1] });
    expect(biased.significant).toBe(true);
    expect(biased.UDifference).toBeCloseTo(2 * Math.sqrt(0.01 / 3 + 0.0025), 12);
  });
});

function design(levels: number[], series: number, replicates: number, f: (x: number, s: number, r: number) => number): AccuracyItem[] {
  return levels.flatMap((x) =>
    Array.from({ length: series }, (_, s) =>
      Array.from({ length: replicates }, (_, r) => ({ level: String(x), series: `day ${s + 1}`, nominal: x, found: f(x, s, r) })),
    ).flat(),
  );
}

describe('accuracy profile', () => {
  it('reduces to the normal prediction interval when there is no between-series variance', () => {
    const ti = betaExpectationInterval(
      [
        [1, 2, 3],
        [1, 2, 3],
        [1, 2, 3],
      ],
      0.9,
    );
    expect(ti.R).toBe(0);
    expect(ti.B).toBe(1);
    expect(ti.sBetween).toBe(0);
  });

  it('is invariant to a shift and scales with the data', () => {
    const y = [
      [9.8, 10.1, 9.9],
      [10.3, 10.4, 10.2],
      [9.7, 9.9, 9.6],
    ];
    const a = betaExpectationInterval(y);
    const b = betaExpectationInterval(y.map((s) => s.map((v) => 3 * v + 1000)));
    expect(b.k).toBeCloseTo(a.k, 10);
    expect(b.sI).toBeCloseTo(3 * a.sI, 9);
    expect(b.upper).toBeCloseTo(3 * a.upper + 1000, 8);
  });

  it('finds the validity range by interpolation where the profile crosses the limits', () => {
    // Imprecise at the lowest level only: ±40 % noise at 1, ±0.5 % elsewhere.
    const items = design([1, 10, 100], 3, 3, (x, s, r) => x * (1 + (x === 1 ? 0.4 : 0.005) * Math.sin(1 + 3 * s + r)));
    const p = accuracyProfile(items, { lambda: 15 });
    expect(p.beta).toBe(0.8);
    expect(p.levels.map((l) => l.within)).toEqual([false, true, true]);
    expect(p.validFrom!).toBeGreaterThan(1);
    expect(p.validFrom!).toBeLessThan(10);
    expect(p.validTo).toBe(100);
  });

  it('refuses a design with too few series, replicates or levels and bad β, λ', () => {
    const fields = accuracyProfileErrors(
      design([1, 2], 1, 1, (x) => x),
      { beta: 1, lambda: 0 },
    );
    expect(fields.map((e) => e.code)).toEqual(
      expect.arrayContaining(['out_of_range', 'not_positive', 'too_few_levels', 'too_few_series', 'too_few_replicates']),
    );
  });
});

describe('uncertainty sections of a study', () => {
  const accuracy = design([1, 10, 100], 3, 3, (x, s, r) => x * (1 + 0.01 * Math.sin(1 + 3 * s + r) + 0.005 * s));

  it('adds the accuracy profile, trueness and top-down uncertainty to the evaluation', () => {
    const result = evaluateStudy({
      accuracy,
      accuracyProfile: { beta: 0.9, lambda: 10 },
      referenceMaterial: { certified: 10, uCertified: 0.1, results: [10.1, 9.9, 10.05] },
      uncertainty: { relativeAbove: 5 },
    });
    expect(result.accuracyProfile!.levels).toHaveLength(3);
    expect(result.accuracyProfile!.beta).toBe(0.9);
    expect(result.trueness!.significant).toBe(false);
    expect(result.uncertainty!.byLevel.map((l) => l.expressedAs)).toEqual(['absolute', 'relative', 'relative']);
    expect(result.uncertainty!.byLevel[0].uRw).toBeCloseTo(result.accuracyProfile!.levels[0].sI, 14);
  });

  it('leaves the result unchanged for a study without these sections', () => {
    const result = evaluateStudy({ precision: [1, 2, 3, 4].map((value) => ({ group: String(value % 2), value })) });
    expect(result).not.toHaveProperty('uncertainty');
    expect(result).not.toHaveProperty('accuracyProfile');
  });

  it('gives field errors for a bad design, β and λ', () => {
    const two = design([1, 10, 100], 1, 1, (x) => x);
    const codes = validationErrors(() => evaluateStudy({ accuracy: two })).map((e) => e.code);
    expect(codes).toEqual(expect.arrayContaining(['too_few_series', 'too_few_replicates']));
    const fields = validationErrors(() => evaluateStudy({ accuracy, accuracyProfile: { beta: 1.5, lambda: -1 } })).map((e) => e.field);
    expect(fields).toEqual(expect.arrayContaining(['accuracyProfile.beta', 'accuracyProfile.lambda']));
    const rm = validationErrors(() => evaluateStudy({ referenceMaterial: { certified: 0, uCertified: -1, results: [1] } })).map(
      (e) => e.field,
    );
    expect(rm).toEqual(
      expect.arrayContaining(['referenceMaterial.certified', 'referenceMaterial.uCertified', 'referenceMaterial.results']),
    );
  });
});
