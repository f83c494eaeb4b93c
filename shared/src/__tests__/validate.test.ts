import { describe, expect, it } from 'vitest';
import { evaluateStudy } from '../evaluate.js';
import { fitCalibration } from '../engine/calibration.js';
import { parseStudy } from '../validate.js';
import { points, validationErrors } from './helpers.js';

const line = points([1, 2, 3, 4], [2.1, 3.9, 6.2, 7.8]);

describe('parseStudy: structure, types and finiteness', () => {
  it('fills in the defaults', () => {
    const study = parseStudy({ standards: line });
    expect(study).toMatchObject({ model: 'linear', weighting: 'none', confidence: 0.95, alpha: 0.05 });
  });

  it('names the field path of a wrong type or a non-finite number', () => {
    const errors = validationErrors(() =>
      parseStudy({ standards: [...line, { x: 'five', y: 9 }, { x: 6, y: Number.NaN }, { x: Infinity, y: 1 }] }),
    );
    expect(errors).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ field: 'standards[4].x', code: 'not_number' }),
        expect.objectContaining({ field: 'standards[5].y', code: 'not_finite' }),
        expect.objectContaining({ field: 'standards[6].x', code: 'not_finite' }),
      ]),
    );
  });

  it('rejects a study that is not an object, unknown fields and bad enumerations', () => {
    expect(validationErrors(() => parseStudy(null))[0]).toMatchObject({ field: 'study', code: 'not_object' });
    expect(validationErrors(() => parseStudy([]))[0]).toMatchObject({ code: 'not_object' });
    const errors = validationErrors(() => parseStudy({ standards: line, weighing: '1/x', model: 'cubic' }));
    expect(errors.map((e) => [e.field, e.code])).toEqual(
      expect.arrayContaining([
        ['weighing', 'unknown_field'],
        ['model', 'invalid_value'],
      ]),
    );
  });

  it('keeps the preparation a standard came from, which changes no figure, and refuses one that is not an id', () => {
    const id = '3f6c2a9e-1b7d-4c1e-9a3b-2d5e8f0a7c41';
    const traced = line.map((p, i) => (i === 0 ? { ...p, preparationId: id } : p));
    expect(parseStudy({ standards: traced }).standards?.[0].preparationId).toBe(id);
    expect(evaluateStudy({ standards: traced }).calibration).toEqual(evaluateStudy({ standards: line }).calibration);
    const errors = validationErrors(() => parseStudy({ standards: [{ ...line[0], preparationId: 'stock of Monday' }, ...line.slice(1)] }));
    expect(errors[0]).toMatchObject({ field: 'standards[0].preparationId', code: 'invalid_value' });
  });

  it('requires a reason for an excluded standard', () => {
    const errors = validationErrors(() => parseStudy({ standards: [...line, { x: 5, y: 10, excluded: {} }] }));
    expect(errors[0]).toMatchObject({ field: 'standards[4].excluded.reason', code: 'required' });
  });

  it('an unknown with no responses', () => {
    const errors = validationErrors(() => parseStudy({ standards: line, unknowns: [{ id: 'A', y: [] }] }));
    expect(errors[0]).toMatchObject({ field: 'unknowns[0].y', code: 'empty' });
  });

  it('duplicate unknown ids, non-positive dilution, bad criteria', () => {
    const errors = validationErrors(() =>
      parseStudy({
        standards: line,
        unknowns: [
          { id: 'A', y: [1] },
          { id: 'A', y: [2], dilution: 0 },
        ],
        criteria: [
          { figure: 'calibration.r2', op: '~', value: 1 },
          { figure: 'x', op: 'between', value: [3, 1] },
        ],
      }),
    );
    expect(errors.map((e) => [e.field, e.code])).toEqual(
      expect.arrayContaining([
        ['unknowns[1].id', 'duplicate'],
        ['unknowns[1].dilution', 'not_positive'],
        ['criteria[0].op', 'invalid_value'],
        ['criteria[1].value', 'invalid_value'],
      ]),
    );
  });

  it('confidence, alpha and massFraction ranges', () => {
    const errors = validationErrors(() => parseStudy({ standards: line, confidence: 95, alpha: 0.7, massFraction: 5 }));
    expect(errors.map((e) => e.field).sort()).toEqual(['alpha', 'confidence', 'massFraction']);
  });

  it('EPA blanks accept null for "no numerical result"', () => {
    const study = parseStudy({ lowSpikes: { spiked: [1, 2], blanks: [null, 0.1] } });
    expect(study.lowSpikes?.blanks).toEqual([null, 0.1]);
  });
});

describe('model requirements', () => {
  it('fewer than 3 standards for regression statistics', () => {
    expect(validationErrors(() => parseStudy({ standards: points([1, 2], [1, 2]) }))[0]).toMatchObject({
      field: 'standards',
      code: 'too_few',
    });
    expect(validationErrors(() => parseStudy({ standards: [] }))[0]).toMatchObject({ code: 'too_few' });
  });

  it('excluded standards do not count', () => {
    const standards = [...points([1, 2], [1, 2]), { x: 3, y: 3, excluded: { reason: 'vial broken' } }];
    expect(validationErrors(() => parseStudy({ standards }))[0]).toMatchObject({ code: 'too_few' });
  });

  it('all x equal', () => {
    expect(validationErrors(() => parseStudy({ standards: points([2, 2, 2], [1, 2, 3]) }))[0]).toMatchObject({ code: 'all_x_equal' });
  });

  it('quadratic needs 4 standards at 3 distinct x', () => {
    expect(validationErrors(() => parseStudy({ model: 'quadratic', standards: points([1, 2, 3], [1, 4, 9]) }))[0].code).toBe('too_few');
    expect(validationErrors(() => parseStudy({ model: 'quadratic', standards: points([1, 1, 2, 2], [1, 1, 4, 4]) }))[0].code).toBe(
      'too_few_levels',
    );
  });

  it('x <= 0 with 1/x or 1/x2 weighting, weighting with an unweightable model', () => {
    const errors = validationErrors(() => parseStudy({ weighting: '1/x', standards: points([0, 1, 2], [0, 1, 2]) }));
    expect(errors[0]).toMatchObject({ field: 'standards[0].x', code: 'not_positive' });
    const incompatible = validationErrors(() => parseStudy({ weighting: '1/x2', model: 'two-point', standards: points([1, 2], [1, 2]) }));
    expect(incompatible[0]).toMatchObject({ field: 'weighting', code: 'incompatible' });
  });

  it('1/s2 weighting needs the SD of every standard', () => {
    const errors = validationErrors(() =>
      parseStudy({ weighting: '1/s2', standards: [...line.slice(0, 3).map((p) => ({ ...p, sd: 0.1 })), line[3]] }),
    );
    expect(errors[0]).toMatchObject({ field: 'standards[3].sd', code: 'required' });
  });

  it('one-point: a zero or negative standard, or more than one level', () => {
    expect(validationErrors(() => parseStudy({ model: 'one-point', standards: [{ x: 0, y: 1 }] }))[0].code).toBe('not_positive');
    expect(validationErrors(() => parseStudy({ model: 'one-point', standards: points([1, 2], [1, 2]) }))[0].code).toBe('too_many_levels');
  });

  it('two-point: both standards at the same x, or three levels without bracketing', () => {
    expect(validationErrors(() => parseStudy({ model: 'two-point', standards: points([3, 3], [1, 2]) }))[0].code).toBe('all_x_equal');
    expect(validationErrors(() => parseStudy({ model: 'two-point', standards: points([1, 2, 3], [1, 2, 3]) }))[0].code).toBe(
      'too_many_levels',
    );
    expect(() => parseStudy({ model: 'two-point', twoPoint: { bracketing: true }, standards: points([1, 2, 3], [1, 2, 3]) })).not.toThrow();
  });

  it('unknowns without standards', () => {
    expect(validationErrors(() => parseStudy({ unknowns: [{ id: 'A', y: [1] }] }))[0]).toMatchObject({
      field: 'standards',
      code: 'required',
    });
  });
});

describe('errors found while fitting', () => {
  it('zero slope', () => {
    expect(validationErrors(() => evaluateStudy({ standards: points([1, 2, 3], [5, 5, 5]) }))[0].code).toBe('zero_slope');
    expect(validationErrors(() => evaluateStudy({ model: 'one-point', standards: [{ x: 2, y: 0 }] }))[0].code).toBe('zero_slope');
    expect(validationErrors(() => evaluateStudy({ model: 'two-point', standards: points([1, 2], [3, 3]) }))[0].code).toBe('zero_slope');
  });

  it("an unknown response outside the quadratic's invertible range", () => {
    const standards = points([0, 1, 2, 3, 4], [0, 3.9, 6.1, 7.4, 8.0]);
    const errors = validationErrors(() =>
      evaluateStudy({
        model: 'quadratic',
        standards,
        unknowns: [
          { id: 'A', y: [1] },
          { id: 'B', y: [20] },
        ],
      }),
    );
    expect(errors[0]).toMatchObject({ field: 'unknowns[1].y', code: 'not_invertible' });
  });

  it('a bracketing two-point calibration whose responses do not rise steadily', () => {
    const errors = validationErrors(() =>
      fitCalibration(points([0, 1, 2], [0, 2, 1]), { model: 'two-point', twoPoint: { bracketing: true } }),
    );
    expect(errors[0].code).toBe('not_monotonic');
  });

  it('values so large that no finite calibration exists', () => {
    const errors = validationErrors(() => evaluateStudy({ standards: points([1e300, 2e300, 3e300], [1, 2, 3.1]) }));
    expect(errors[0].code).toBe('not_computable');
  });
});
