import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { fitCalibration } from '../engine/calibration.js';
import { predictUnknown } from '../engine/inverse.js';
import { evaluateStudy } from '../evaluate.js';
import type { StandardPoint } from '../study.js';

const close = (a: number, b: number, rel = 1e-9) => Math.abs(a - b) <= rel * Math.max(1, Math.abs(a), Math.abs(b));

/** Calibration designs: 4–10 standards at distinct positive x, a line with some scatter. */
const design = fc
  .record({
    xs: fc.uniqueArray(fc.integer({ min: 1, max: 500 }), { minLength: 4, maxLength: 10 }),
    slope: fc.double({ min: 0.01, max: 100, noNaN: true }),
    intercept: fc.double({ min: -5, max: 5, noNaN: true }),
    noise: fc.array(fc.double({ min: -1, max: 1, noNaN: true }), { minLength: 10, maxLength: 10 }),
  })
  .map(({ xs, slope, intercept, noise }) =>
    xs.map((x, i): StandardPoint => ({ x: x / 10, y: intercept + slope * (x / 10) * (1 + 0.02 * noise[i]) + 0.01 * noise[i] })),
  );

describe('properties of the calibration', () => {
  it('slope × x-scale is invariant; intercept, s_y/x and R² unchanged', () => {
    fc.assert(
      fc.property(design, fc.constantFrom(1e-3, 0.1, 7, 1000), (standards, k) => {
        const a = fitCalibration(standards).calibration;
        const b = fitCalibration(standards.map((s) => ({ ...s, x: s.x * k }))).calibration;
        expect(close(b.slope * k, a.slope)).toBe(true);
        expect(close(b.intercept, a.intercept)).toBe(true);
        expect(close(b.sYX!, a.sYX!, 1e-7)).toBe(true);
        expect(close(b.r2!, a.r2!)).toBe(true);
      }),
    );
  });

  it('detection limits scale with the concentration unit (mg/L → µg/L multiplies them by 1000)', () => {
    fc.assert(
      fc.property(design, (standards) => {
        const fit = evaluateStudy({ standards, blanks: [0.01, 0.012, 0.009] });
        const ys = standards.map((s) => s.y);
        // A nearly perfect line leaves a residual SD made of rounding noise, which no unit change preserves.
        fc.pre(fit.calibration!.sYX! > 1e-6 * (Math.max(...ys) - Math.min(...ys)));
        const mg = fit.detection!;
        const ug = evaluateStudy({ standards: standards.map((s) => ({ ...s, x: s.x * 1000 })), blanks: [0.01, 0.012, 0.009] }).detection!;
        expect(close(ug.sdResidual!.lod, 1000 * mg.sdResidual!.lod, 1e-7)).toBe(true);
        expect(close(ug.blankSd!.loq, 1000 * mg.blankSd!.loq, 1e-7)).toBe(true);
        expect(close(ug.iso11843!.detectableX, 1000 * mg.iso11843!.detectableX, 1e-7)).toBe(true);
        expect(close(ug.hubauxVos!.detectableX, 1000 * mg.hubauxVos!.detectableX, 1e-7)).toBe(true);
      }),
    );
  });

  it('the order of the standards does not matter', () => {
    fc.assert(
      fc.property(design, fc.integer(), (standards, seed) => {
        const shuffled = [...standards].sort((p, q) => ((p.x * 7919 + seed) % 13) - ((q.x * 7919 + seed) % 13));
        for (const model of ['linear', 'quadratic', 'linear-through-origin'] as const) {
          const a = fitCalibration(standards, { model }).calibration;
          const b = fitCalibration(shuffled, { model }).calibration;
          expect(close(a.slope, b.slope, 1e-8)).toBe(true);
          expect(close(a.intercept, b.intercept, 1e-8)).toBe(true);
          expect(close(a.sYX!, b.sYX!, 1e-6)).toBe(true);
        }
      }),
    );
  });

  it('multiplying every SD by a constant leaves a 1/s² weighted fit unchanged', () => {
    fc.assert(
      fc.property(design, fc.double({ min: 1e-3, max: 1e3, noNaN: true }), (standards, k) => {
        const withSd = standards.map((s) => ({ ...s, sd: 0.01 + 0.02 * s.x }));
        const a = fitCalibration(withSd, { weighting: '1/s2' });
        const b = fitCalibration(
          withSd.map((s) => ({ ...s, sd: s.sd * k })),
          { weighting: '1/s2' },
        );
        expect(close(a.calibration.slope, b.calibration.slope)).toBe(true);
        expect(close(a.calibration.intercept, b.calibration.intercept)).toBe(true);
        const y = a.predict(standards[1].x);
        expect(close(predictUnknown(a, [y]).sX0!, predictUnknown(b, [y]).sX0!, 1e-7)).toBe(true);
      }),
    );
  });

  it('x0 of the fitted response at x gives back x (every model)', () => {
    fc.assert(
      fc.property(design, fc.double({ min: 0, max: 1, noNaN: true }), (standards, f) => {
        const xs = standards.map((s) => s.x);
        const x = Math.min(...xs) + f * (Math.max(...xs) - Math.min(...xs));
        for (const model of ['linear', 'linear-through-origin'] as const) {
          for (const weighting of model === 'linear' ? (['none', '1/x', '1/x2'] as const) : (['none'] as const)) {
            const fit = fitCalibration(standards, { model, weighting });
            expect(close(predictUnknown(fit, [fit.predict(x)]).x0, x, 1e-9)).toBe(true);
          }
        }
        const quad = fitCalibration(standards, { model: 'quadratic' });
        const q = quad.inverse(quad.predict(x));
        if (q !== null) expect(close(q, x, 1e-6)).toBe(true);
      }),
    );
  });
});
