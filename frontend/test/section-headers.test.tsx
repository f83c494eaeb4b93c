import { SECTION_HEADER_ALIASES, type ImportSection } from '@meritline/shared';
import { sectionColumns } from '@/features/studies/utils/grid-sections';
import { matchColumns } from '@/features/studies/utils/paste-parser';

const SECTIONS: ImportSection[] = ['standards', 'blanks', 'recovery', 'precision', 'unknowns', 'lowSpikes'];
const units = { x: 'mg/L', y: 'µS·min' };

describe('column headers of each section', () => {
  it.each(SECTIONS)('%s: the headers the grid shows map back to their own columns', (section) => {
    const columns = sectionColumns(section, units);
    const headers = columns.map((c) => (c.unit ? `${c.label} (${c.unit})` : c.label));
    expect(matchColumns(headers, headers.length, columns)).toEqual(columns.map((c) => c.key));
  });

  it.each(SECTIONS)('%s: the template headers (the field names) map back to their own columns', (section) => {
    const columns = sectionColumns(section, units);
    const keys = columns.map((c) => c.key).filter((key) => key in SECTION_HEADER_ALIASES[section]);
    expect(matchColumns(keys, keys.length, columns)).toEqual(keys);
  });

  it('reads a "Spike" header as the spiked sample, not as the amount added', () => {
    const columns = sectionColumns('recovery', units);
    expect(matchColumns(['Spike', 'Level', 'Added (mg/L)', 'Found (mg/L)'], 4, columns)).toEqual(['id', 'level', 'added', 'found']);
  });
});
