import { describe, expect, it } from 'vitest';
import { evaluateStudy } from '../evaluate.js';
import type { CalibrationModel, Weighting } from '../study.js';
import { typicalStudy } from './helpers.js';

const close = (a: number, b: number, rel = 1e-9) => Math.abs(a - b) <= rel * Math.max(1, Math.abs(a), Math.abs(b));

/** The same study read by a sensor whose signal falls with concentration: every response y → −y. */
function mirrored<T extends { standards: { x: number; y: number }[]; blanks: number[] }>(study: T): T {
  return { ...study, standards: study.standards.map((s) => ({ ...s, y: -s.y })), blanks: study.blanks.map((b) => -b) };
}

const base = {
  standards: typicalStudy.standards,
  blanks: typicalStudy.blanks,
  lowSpikes: typicalStudy.lowSpikes,
};

describe('detection limits of a falling response', () => {
  const cases: [CalibrationModel, Weighting][] = [
    ['linear', 'none'],
    ['linear', '1/x'],
    ['quadratic', 'none'],
    ['linear-through-origin', 'none'],
  ];
  it.each(cases)('every limit of a %s (%s) calibration equals the rising one and is a positive concentration', (model, weighting) => {
    const rising = evaluateStudy({ ...base, model, weighting }).detection!;
    const falling = evaluateStudy({ ...mirrored(base), model, weighting }).detection!;
    const limits = (d: typeof rising) => ({
      'residual SD LOD': d.sdResidual?.lod,
      'residual SD LOQ': d.sdResidual?.loq,
      'intercept SD LOD': d.sdIntercept?.lod,
      'intercept SD LOQ': d.sdIntercept?.loq,
      'blank SD LOD': d.blankSd?.lod,
      'blank SD LOQ': d.blankSd?.loq,
      'mean blank + 3 SD': d.blankSd?.responseLodX,
      'mean blank + 10 SD': d.blankSd?.responseLoqX,
      'ISO 11843 critical value': d.iso11843?.criticalX,
      'ISO 11843 minimum detectable value': d.iso11843?.detectableX,
      'Hubaux-Vos critical value': d.hubauxVos?.criticalX,
      'Hubaux-Vos detectable value': d.hubauxVos?.detectableX,
      MDL: d.epaMdl?.mdl,
    });
    const up = limits(rising);
    const down = limits(falling);
    for (const [name, value] of Object.entries(up)) {
      if (value === undefined) continue;
      const mirror = down[name as keyof typeof down];
      expect(mirror, name).toBeDefined();
      expect(close(mirror!, value, 1e-9), `${name}: ${mirror} vs ${value}`).toBe(true);
      expect(mirror!, name).toBeGreaterThan(0);
    }
    expect(rising.flagBasis).toBe(falling.flagBasis);
  });

  it('the blank-based response limits lie below the blank mean when the signal falls', () => {
    const falling = evaluateStudy(mirrored(base)).detection!.blankSd!;
    expect(falling.responseLod).toBeLessThan(falling.mean);
    expect(falling.responseLoq).toBeLessThan(falling.responseLod);
    expect(falling.responseLodX).toBeGreaterThan(0);
  });

  it('the critical responses mirror the rising ones', () => {
    const rising = evaluateStudy(base).detection!;
    const falling = evaluateStudy(mirrored(base)).detection!;
    expect(close(falling.iso11843!.criticalResponse, -rising.iso11843!.criticalResponse)).toBe(true);
    expect(close(falling.hubauxVos!.criticalResponse, -rising.hubauxVos!.criticalResponse)).toBe(true);
  });

  it('unknowns of a falling response are flagged as the rising ones are', () => {
    const study = { ...base, unknowns: typicalStudy.unknowns };
    const fallingStudy = { ...mirrored(base), unknowns: typicalStudy.unknowns.map((u) => ({ ...u, y: u.y.map((v) => -v) })) };
    const rising = evaluateStudy(study).unknowns!;
    const falling = evaluateStudy(fallingStudy).unknowns!;
    expect(falling.map((u) => u.flags)).toEqual(rising.map((u) => u.flags));
  });
});
