import { describe, expect, it } from 'vitest';
import { auditFieldLabel, describeStudyChange } from '../catalogue/index.js';

describe('changes of a study in words', () => {
  it('names the part changed and says before and after, never a path', () => {
    const lines = [
      describeStudyChange('meta.conclusion', null, 'Fit for purpose.'),
      describeStudyChange('title', 'Nitrate', 'Nitrate (rev. 2)'),
      describeStudyChange('data.standards[#2].y', 0.24, 0.25),
      describeStudyChange('data.recovery[S3]', null, { id: 'S3', added: 1, found: 0.61 }),
      describeStudyChange('data.precision[#4]', { group: 'day 2', value: 5.9 }, null),
      describeStudyChange('data.weighting', 'none', '1/x'),
      describeStudyChange('recovery[2].excluded', null, { reason: 'vial spilt' }),
    ];
    expect(lines).toEqual([
      'Conclusion: nothing → “Fit for purpose.”',
      'Title: “Nitrate” → “Nitrate (rev. 2)”',
      'Calibration standards, row 2, response: 0.24 → 0.25',
      'Recovery, S3 added: sample “S3”, amount added 1, amount found 0.61',
      'Precision, row 4 removed (was series “day 2”, value 5.9)',
      'Weighting: “none” → “1/x”',
      'Recovery, row 3, excluded: nothing → excluded (vial spilt)',
    ]);
    expect(lines.join(' ')).not.toMatch(/\[|\]|meta\.|data\./);
  });

  it('says which low-level spike or MDL blank was excluded, in the audit trail and in the review', () => {
    expect(describeStudyChange('lowSpikes.spiked[2].excluded', null, { reason: 'spiked twice' })).toBe(
      'Low-level spikes, row 3, excluded: nothing → excluded (spiked twice)',
    );
    expect(describeStudyChange('data.lowSpikes.blanks[#1].excluded', { reason: 'contaminated vial' }, null)).toBe(
      'Method blanks (detection limit), row 1, excluded: excluded (contaminated vial) → nothing',
    );
    expect(auditFieldLabel('lowSpikes.spiked[2].excluded')).toBe('Low-level spike 3 excluded');
    expect(auditFieldLabel('lowSpikes.blanks[0].excluded')).toBe('Method blank (detection limit) 1 excluded');
  });
});
