/** Words for the parts of a study's data and record, as the history and the review's list of changes name them. */

export const STUDY_SECTION_WORDS: Record<string, string> = {
  standards: 'Calibration standards',
  blanks: 'Blanks',
  unknowns: 'Samples',
  checks: 'Check standards',
  recovery: 'Recovery',
  precision: 'Precision',
  criteria: 'Acceptance criteria',
  'lowSpikes.spiked': 'Low-level spikes',
  'lowSpikes.blanks': 'Method blanks (detection limit)',
};

export const STUDY_FIELD_WORDS: Record<string, string> = {
  x: 'concentration',
  y: 'response',
  sd: 'standard deviation',
  id: 'sample',
  level: 'level',
  added: 'amount added',
  found: 'amount found',
  native: 'amount present before spiking',
  group: 'series',
  value: 'value',
  dilution: 'dilution factor',
  excluded: 'excluded',
  model: 'calibration model',
  weighting: 'weighting',
  confidence: 'confidence level',
  alpha: 'false-positive rate (α)',
  units: 'units',
  twoPoint: 'two-point reading',
  massFraction: 'mass fraction',
};

export const STUDY_META_WORDS: Record<string, string> = {
  title: 'Title',
  instrument: 'Instrument',
  startedOn: 'Started on',
  finishedOn: 'Finished on',
  conclusion: 'Conclusion',
};

const MAX_TEXT = 160;

/** A value as a reader would say it: numbers as typed, an exclusion by its reason, text quoted and cut short. */
export function describeValue(value: unknown): string {
  if (value === null || value === undefined || value === '') return 'nothing';
  if (typeof value === 'number') return String(value);
  if (typeof value === 'string') return `“${value.length > MAX_TEXT ? `${value.slice(0, MAX_TEXT)}…` : value}”`;
  if (Array.isArray(value)) return value.map(describeValue).join(', ');
  if (typeof value === 'object') {
    const reason = (value as { reason?: unknown }).reason;
    if (typeof reason === 'string') return `excluded (${reason})`;
    return Object.entries(value as Record<string, unknown>)
      .map(([key, v]) => `${STUDY_FIELD_WORDS[key] ?? key} ${describeValue(v)}`)
      .join(', ');
  }
  return String(value);
}

/** A row of a section by its own id, or by its position (`#3` is the third row). */
export const describeRow = (key: string) =>
  key.startsWith('#') ? `row ${key.slice(1)}` : /^\d+$/.test(key) ? `row ${Number(key) + 1}` : key;

/**
 * One change of an audit entry in words. Paths are `title`, `meta.<field>`, `data.<setting>`,
 * `data.<section>[<row>]` (a row added or removed) and `data.<section>[<row>].<field>`; exclusion entries
 * write `<section>[<index from 0>].excluded`.
 */
export function describeStudyChange(path: string, from: unknown, to: unknown): string | null {
  const fromTo = `${describeValue(from)} → ${describeValue(to)}`;
  if (path === 'title') return `Title: ${fromTo}`;
  if (path === 'author') return `Author: ${fromTo}`;
  if (path === 'file') return `File: ${describeValue(to)}`;
  if (path === 'rowCount') return `Rows: ${fromTo}`;
  if (path === 'section') return `Section: ${STUDY_SECTION_WORDS[String(to)] ?? describeValue(to)}`;
  const meta = /^meta\.(\w+)$/.exec(path);
  if (meta) return `${STUDY_META_WORDS[meta[1]] ?? meta[1]}: ${fromTo}`;
  const row = /^(?:data\.)?([\w.]+)\[(.+)\](?:\.(\w+))?$/.exec(path);
  if (row) {
    const [, section, key, field] = row;
    const where = `${STUDY_SECTION_WORDS[section] ?? section}, ${describeRow(key)}`;
    if (field) return `${where}, ${STUDY_FIELD_WORDS[field] ?? field}: ${fromTo}`;
    if (from === null || from === undefined) return `${where} added: ${describeValue(to)}`;
    return `${where} removed (was ${describeValue(from)})`;
  }
  const setting = /^data\.(\w+)$/.exec(path);
  if (setting) {
    const word = STUDY_FIELD_WORDS[setting[1]] ?? setting[1];
    return `${word.charAt(0).toUpperCase()}${word.slice(1)}: ${fromTo}`;
  }
  return null;
}

/** One excluded row of a detection-limit list, named alike on the result screen and in the report. */
export const EXCLUDED_DETECTION_ROW_WORDS = {
  blanks: 'Method blank',
  'lowSpikes.spiked': 'Low-level spike',
  'lowSpikes.blanks': 'Method blank for the MDL',
} as const;

/** A method blank entered as ND: it has no numerical result. */
export const NOT_DETECTED_WORDS = 'not detected';
