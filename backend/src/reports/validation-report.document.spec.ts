import { describe, expect, it } from 'vitest';
import { reportFileName } from './validation-report.document.js';

describe('report file names', () => {
  it('should be meritline-<method>-v<version>-<short id>.pdf in plain ASCII', () => {
    expect(reportFileName('Chlorpyrifos in apples by LC-MS/MS', 3, '78790571-32ca-489b-8dbe-4e0bf87f9bd1', 'ignored')).toBe(
      'meritline-chlorpyrifos-in-apples-by-lc-ms-ms-v3-78790571.pdf',
    );
    expect(reportFileName('Nitrat in Trinkwasser (Ionenchromatographie), Größe µ', 1, null, '9b0c6d52-1e7f-4a3b-8c2d-5f6e7a8b9c01')).toBe(
      'meritline-nitrat-in-trinkwasser-ionenchromatographie-grosse-v1-9b0c6d52-draft.pdf',
    );
    expect(reportFileName('Σ', 2, 'abcdef01-0000-4000-8000-000000000000', 'x')).toBe('meritline-method-v2-abcdef01.pdf');
  });
});
