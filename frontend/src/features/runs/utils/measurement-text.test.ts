import { buildRunInput, emptyRunForm, toFormError } from '../api/create-run';
import { ApiError } from '@/lib/api-client';
import { parseChecks, parseStandards, parseUnknowns, readNumber, standardsText, unknownsText } from './measurement-text';

describe('measurements typed or pasted into a run', () => {
  it('reads spreadsheet tabs, semicolons with decimal commas and a header row', () => {
    expect(parseStandards('Concentration\tResponse\n1\t0.155\n50\t7.62').rows).toEqual([
      { x: 1, y: 0.155 },
      { x: 50, y: 7.62 },
    ]);
    expect(parseStandards('0,5;0,0791\n10;1,527').rows).toEqual([
      { x: 0.5, y: 0.0791 },
      { x: 10, y: 1.527 },
    ]);
    expect(readNumber('−0,25')).toBe(-0.25);
    expect(readNumber('1e-3')).toBe(0.001);
    expect(readNumber('0.4x')).toBeNull();
  });

  it('says which line cannot be read and why', () => {
    expect(parseStandards('1\t0.155\n2\tabc').errors).toEqual(['Line 2: the response “abc” is not a number.']);
    expect(parseUnknowns('W-1\t0\t1.2').errors).toEqual(['Line 1: the dilution factor “0” must be a number above zero.']);
    expect(parseChecks('CCV\t10').errors).toEqual(['Line 1: needs at least 3 values.']);
  });

  it('takes replicate responses and an empty dilution as undiluted, and writes them back the same way', () => {
    const unknowns = parseUnknowns('W-2811 tap water\t\t1.893\t1.897\nW-2814 well\t2\t4.709');
    expect(unknowns.rows).toEqual([
      { id: 'W-2811 tap water', y: [1.893, 1.897] },
      { id: 'W-2814 well', y: [4.709], dilution: 2 },
    ]);
    expect(parseUnknowns(unknownsText(unknowns.rows)).rows).toEqual(unknowns.rows);
    expect(parseStandards(standardsText([{ x: 1, y: 2, sd: 0.1 }])).rows).toEqual([{ x: 1, y: 2, sd: 0.1 }]);
  });

  it('keeps the standards a one-point or two-point line does not use, marked with the reason', () => {
    const values = {
      ...emptyRunForm,
      methodVersionId: 'v',
      title: 'T',
      standards: '1\t0.15\n10\t1.5\n50\t7.6',
      checks: 'C\t10\t1.5',
      unknowns: 'U\t1\t1',
    };
    const onePoint = buildRunInput({ ...values, model: 'one-point', calibrant: '10' }, { model: 'one-point', allowed: true });
    expect(onePoint?.data.standards.map((s) => Boolean(s.excluded))).toEqual([true, false, true]);
    const twoPoint = buildRunInput({ ...values, model: 'two-point' }, { model: 'two-point', allowed: true });
    expect(twoPoint?.data.standards.map((s) => Boolean(s.excluded))).toEqual([false, true, false]);
    const bracketed = buildRunInput({ ...values, model: 'two-point', bracketing: true }, { model: 'two-point', allowed: true });
    expect(bracketed?.data).toMatchObject({ twoPoint: { bracketing: true } });
    expect(bracketed?.data.standards.some((s) => s.excluded)).toBe(false);
    const weighted = buildRunInput({ ...values, model: 'linear' }, { model: 'linear', allowed: true, weighting: '1/x' }, 3);
    expect(weighted).toMatchObject({ data: { weighting: '1/x' }, methodVersionLockVersion: 3 });
  });

  it('puts the server’s field errors on the form fields they belong to', () => {
    const error = toFormError(
      new ApiError({
        statusCode: 422,
        message: 'The run cannot be calculated from these data.',
        errors: [
          { field: 'data.unknowns[1].y', code: 'empty', message: 'unknowns[1] has no responses' },
          { field: 'data.model', code: 'not_allowed', message: 'No.' },
        ],
      }),
    ) as ApiError;
    expect(error.body.errors).toEqual([
      { field: 'unknowns', code: 'empty', message: 'Sample 2: unknowns[1] has no responses' },
      { field: 'model', code: 'not_allowed', message: 'No.' },
    ]);
  });
});
