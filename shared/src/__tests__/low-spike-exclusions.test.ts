import { describe, expect, it } from 'vitest';
import { evaluateStudy } from '../evaluate.js';
import { parseStudy } from '../validate.js';
import { typicalStudy, validationErrors } from './helpers.js';

// Invented low-level spikes (mg/L): the third replicate is made high, as a spiking error would make it.
const spiked = [0.21, 0.18, 0.31, 0.2, 0.17, 0.22, 0.19, 0.23, 0.2];
const blanks = [0.02, null, 0.09, 0.01, null, 0.02, 0.04];
const spikingError = { reason: 'spiked twice by mistake' };
const contaminated = { reason: 'contaminated vial' };
const base = { units: typicalStudy.units, lowSpikes: { spiked, blanks } };

describe('excluded low-level spike results and MDL blanks', () => {
  it('leave the MDL exactly as if the rows were not there, and list them with their reasons', () => {
    const withExclusions = evaluateStudy({
      ...base,
      lowSpikes: {
        spiked: spiked.map((value, i) => (i === 2 ? { value, excluded: spikingError } : value)),
        blanks: blanks.map((value, i) => (i === 2 ? { value, excluded: contaminated } : value)),
      },
    });
    const without = evaluateStudy({
      ...base,
      lowSpikes: { spiked: spiked.filter((_, i) => i !== 2), blanks: blanks.filter((_, i) => i !== 2) },
    });
    const { excludedSpikes, excludedMdlBlanks, ...figures } = withExclusions.detection!;
    expect(figures).toEqual(without.detection);
    expect(without.detection).not.toHaveProperty('excludedSpikes');
    expect(excludedSpikes).toEqual([{ index: 2, label: 'spike 3', value: 0.31, reason: spikingError.reason }]);
    expect(excludedMdlBlanks).toEqual([{ index: 2, label: 'method blank 3', value: 0.09, reason: contaminated.reason }]);
    expect(figures.epaMdl).toMatchObject({ nSpiked: 8, nBlanks: 6 });
    expect(withExclusions.warnings).toEqual(
      expect.arrayContaining([
        { section: 'detection', code: 'excluded', message: '1 low-level spike result excluded by the analyst: spiked twice by mistake' },
        { section: 'detection', code: 'excluded', message: '1 method blank of the MDL excluded by the analyst: contaminated vial' },
      ]),
    );
  });

  it('keep plain numbers and entries written as objects without exclusion unchanged', () => {
    const plain = evaluateStudy(base);
    const asObjects = evaluateStudy({
      ...base,
      lowSpikes: { spiked: spiked.map((value) => ({ value })), blanks: blanks.map((value) => ({ value })) },
    });
    expect(asObjects.detection).toEqual(plain.detection);
    expect(plain.detection).not.toHaveProperty('excludedMdlBlanks');
    expect(parseStudy(base).lowSpikes).toEqual(base.lowSpikes);
  });

  it('judge the count of at least 7 spiked samples on the results used, saying how many were excluded', () => {
    const seven = spiked.slice(0, 7).map((value, i) => (i === 2 ? { value, excluded: spikingError } : value));
    const result = evaluateStudy({ lowSpikes: { spiked: seven } });
    expect(result.detection?.epaMdl?.nSpiked).toBe(6);
    expect(result.warnings).toContainEqual({
      section: 'detection',
      code: 'too_few_spikes',
      message: 'the MDL procedure asks for at least 7 spiked samples (6 used, 1 excluded)',
    });
  });

  it('answer no MDL, with a warning, when exclusions leave too few results', () => {
    const result = evaluateStudy({ lowSpikes: { spiked: [{ value: 0.2, excluded: spikingError }, 0.21] } });
    expect(result.detection).toBeNull();
    expect(result.warnings).toContainEqual({
      section: 'detection',
      code: 'too_few_spikes',
      message: 'MDL_s needs at least 2 spiked samples (1 used, 1 excluded)',
    });
    const allOut = evaluateStudy({ lowSpikes: { spiked: [0.2, 0.21, 0.19], blanks: [{ value: 0.01, excluded: contaminated }] } });
    expect(allOut.detection?.epaMdl?.mdlBlank).toBeNull();
    expect(allOut.warnings).toContainEqual({
      section: 'detection',
      code: 'all_excluded',
      message: 'every method blank of the MDL is excluded',
    });
  });

  it('may exclude a blank without a numerical result, which then leaves the highest-blank rule', () => {
    const result = evaluateStudy({ lowSpikes: { spiked, blanks: [0.02, { value: null, excluded: contaminated }, 0.03] } });
    expect(result.detection?.epaMdl?.blankRule).toBe('mean-plus-t-sd');
    expect(result.detection?.excludedMdlBlanks).toEqual([{ index: 1, label: 'method blank 2', value: null, reason: contaminated.reason }]);
  });

  it('refuse an entry without a number, with an unknown field or without a reason in words, naming the field', () => {
    const errorsOf = (lowSpikes: unknown) => validationErrors(() => parseStudy({ lowSpikes }));
    expect(errorsOf({ spiked: [0.2, { value: 'high' }] })).toContainEqual(expect.objectContaining({ field: 'lowSpikes.spiked[1].value' }));
    expect(errorsOf({ spiked: [{ value: null, excluded: spikingError }] })).toContainEqual(
      expect.objectContaining({ field: 'lowSpikes.spiked[0].value', code: 'not_number' }),
    );
    expect(errorsOf({ spiked: [{ value: 0.2, note: 'x' }] })).toContainEqual(
      expect.objectContaining({ field: 'lowSpikes.spiked[0].note', code: 'unknown_field' }),
    );
    expect(errorsOf({ spiked: [0.2], blanks: [{ value: 0.01, excluded: { reason: 3 } }] })).toContainEqual(
      expect.objectContaining({ field: 'lowSpikes.blanks[0].excluded.reason' }),
    );
    expect(errorsOf({ spiked: [0.2], blanks: [{ value: 0.01, excluded: { reason: '  ' } }] })).toContainEqual(
      expect.objectContaining({ field: 'lowSpikes.blanks[0].excluded.reason', code: 'not_string' }),
    );
    expect(errorsOf({ spiked: [0.2], blanks: [{ excluded: contaminated }] })).toContainEqual(
      expect.objectContaining({ field: 'lowSpikes.blanks[0].value', code: 'required' }),
    );
    expect(errorsOf({ spiked: [0.2], blanks: ['ND'] })).toContainEqual(expect.objectContaining({ field: 'lowSpikes.blanks[0]' }));
  });
});
