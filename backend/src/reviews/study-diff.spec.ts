import { describe, expect, it } from 'vitest';
import { diffStudyData } from './study-diff.js';

const before = {
  model: 'linear',
  weighting: 'none',
  standards: [
    { x: 1, y: 0.12 },
    { x: 2, y: 0.24 },
  ],
  recovery: [{ id: 'R1', added: 1, found: 0.98 }],
  lowSpikes: { spiked: [0.2, 0.21] },
};

describe('diffStudyData', () => {
  it('should report nothing for identical data, whatever the key order', () => {
    const reordered = {
      lowSpikes: { spiked: [0.2, 0.21] },
      recovery: [{ found: 0.98, added: 1, id: 'R1' }],
      standards: before.standards,
      weighting: 'none',
      model: 'linear',
    };
    expect(diffStudyData(before, reordered)).toEqual({ settings: [], sections: [] });
  });

  it('should list changed settings and changed fields of rows matched by position', () => {
    const after = {
      ...before,
      weighting: '1/x',
      standards: [
        { x: 1, y: 0.12, excluded: { reason: 'bubble' } },
        { x: 2, y: 0.25 },
      ],
    };
    const diff = diffStudyData(before, after);
    expect(diff.settings).toEqual([{ field: 'weighting', from: 'none', to: '1/x' }]);
    expect(diff.sections).toEqual([
      {
        section: 'standards',
        added: [],
        removed: [],
        changed: [
          { key: '#1', field: 'excluded', from: null, to: { reason: 'bubble' } },
          { key: '#2', field: 'y', from: 0.24, to: 0.25 },
        ],
      },
    ]);
  });

  it('should match rows that carry an id by that id and report added and removed rows', () => {
    const after = {
      ...before,
      recovery: [
        { id: 'R2', added: 1, found: 1.01 },
        { id: 'R1', added: 1, found: 0.98 },
      ],
      lowSpikes: { spiked: [0.2] },
    };
    const diff = diffStudyData(before, after);
    expect(diff.sections).toEqual([
      { section: 'recovery', added: [{ key: 'R2', row: { id: 'R2', added: 1, found: 1.01 } }], removed: [], changed: [] },
      { section: 'lowSpikes.spiked', added: [], removed: [{ key: '#2', row: 0.21 }], changed: [] },
    ]);
  });

  it('should show a low-level spike or blank newly excluded as its exclusion, not as a new value', () => {
    const reason = { reason: 'spiked twice by mistake' };
    const after = {
      ...before,
      lowSpikes: { spiked: [0.2, { value: 0.21, excluded: reason }], blanks: [{ value: null, excluded: reason }] },
    };
    const withBlank = { ...before, lowSpikes: { spiked: [0.2, 0.21], blanks: [null] } };
    expect(diffStudyData(withBlank, after).sections).toEqual([
      { section: 'lowSpikes.spiked', added: [], removed: [], changed: [{ key: '#2', field: 'excluded', from: null, to: reason }] },
      { section: 'lowSpikes.blanks', added: [], removed: [], changed: [{ key: '#1', field: 'excluded', from: null, to: reason }] },
    ]);
  });
});
