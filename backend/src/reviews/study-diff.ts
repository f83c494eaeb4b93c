import { canonicalJson, type FieldChanges, type RowChange, type SectionDiff, type StudyDiffDto } from '@meritline/shared';

type Data = Record<string, unknown>;

const SETTINGS = ['units', 'model', 'weighting', 'confidence', 'alpha', 'twoPoint', 'massFraction'] as const;
const same = (a: unknown, b: unknown) => canonicalJson(a ?? null) === canonicalJson(b ?? null);
const isRecord = (value: unknown): value is Record<string, unknown> => typeof value === 'object' && value !== null && !Array.isArray(value);

function rowKey(row: unknown, index: number): string {
  if (isRecord(row)) {
    if (typeof row.id === 'string' && row.id) return row.id;
  }
  return `#${index + 1}`;
}

function keyed(rows: unknown[]): Map<string, unknown> {
  const map = new Map<string, unknown>();
  rows.forEach((row, index) => {
    let key = rowKey(row, index);
    while (map.has(key)) key = `${key}′`;
    map.set(key, row);
  });
  return map;
}

/** A plain value next to its `{ value, excluded }` form is the same row: the change is its exclusion, not its value. */
const asRecord = (row: unknown, other: unknown) => (!isRecord(row) && isRecord(other) && 'value' in other ? { value: row } : row);

function rowChanges(key: string, rowBefore: unknown, rowAfter: unknown): RowChange[] {
  const before = asRecord(rowBefore, rowAfter);
  const after = asRecord(rowAfter, rowBefore);
  if (!isRecord(before) || !isRecord(after)) return same(before, after) ? [] : [{ key, field: 'value', from: before, to: after }];
  const fields = [...new Set([...Object.keys(before), ...Object.keys(after)])].sort();
  return fields
    .filter((field) => !same(before[field], after[field]))
    .map((field) => ({ key, field, from: before[field] ?? null, to: after[field] ?? null }));
}

function diffRows(section: string, beforeRows: unknown[], afterRows: unknown[]): SectionDiff | null {
  const before = keyed(beforeRows);
  const after = keyed(afterRows);
  const diff: SectionDiff = { section, added: [], removed: [], changed: [] };
  for (const [key, row] of before) {
    if (!after.has(key)) diff.removed.push({ key, row });
    else diff.changed.push(...rowChanges(key, row, after.get(key)));
  }
  for (const [key, row] of after) if (!before.has(key)) diff.added.push({ key, row });
  return diff.added.length || diff.removed.length || diff.changed.length ? diff : null;
}

/** Lists of rows per section; `lowSpikes` holds two lists of its own. */
function sectionsOf(data: Data): Map<string, unknown[]> {
  const sections = new Map<string, unknown[]>();
  for (const [name, value] of Object.entries(data)) {
    if (Array.isArray(value)) sections.set(name, value);
  }
  if (isRecord(data.lowSpikes)) {
    for (const [name, value] of Object.entries(data.lowSpikes)) if (Array.isArray(value)) sections.set(`lowSpikes.${name}`, value);
  }
  return sections;
}

/** What changed in the study data between two submissions: settings, then added, removed and changed rows per section. */
export function diffStudyData(before: Data, after: Data): Pick<StudyDiffDto, 'settings' | 'sections'> {
  const settings = SETTINGS.filter((field) => !same(before[field], after[field])).map((field) => ({
    field,
    from: before[field] ?? null,
    to: after[field] ?? null,
  }));
  const beforeSections = sectionsOf(before);
  const afterSections = sectionsOf(after);
  const names = [...new Set([...beforeSections.keys(), ...afterSections.keys()])];
  const sections = names
    .map((name) => diffRows(name, beforeSections.get(name) ?? [], afterSections.get(name) ?? []))
    .filter((diff): diff is SectionDiff => diff !== null);
  return { settings, sections };
}

/** Record fields (title, conclusion, instrument, dates) that differ; both sides as stored, absent ones as null. */
export function diffStudyMeta(before: Data, after: Data): StudyDiffDto['meta'] {
  const fields = [...new Set([...Object.keys(before), ...Object.keys(after)])].sort();
  return fields
    .filter((field) => !same(before[field], after[field]))
    .map((field) => ({ field, from: before[field] ?? null, to: after[field] ?? null }));
}

/** The data diff as audit changes: `data.<setting>`, `data.<section>[<row>]` (added or removed) and `data.<section>[<row>].<field>`. */
export function dataChangeEntries(before: Data, after: Data): FieldChanges {
  const { settings, sections } = diffStudyData(before, after);
  const changes: FieldChanges = {};
  for (const s of settings) changes[`data.${s.field}`] = { from: s.from, to: s.to };
  for (const section of sections) {
    for (const row of section.added) changes[`data.${section.section}[${row.key}]`] = { from: null, to: row.row };
    for (const row of section.removed) changes[`data.${section.section}[${row.key}]`] = { from: row.row, to: null };
    for (const c of section.changed) changes[`data.${section.section}[${c.key}].${c.field}`] = { from: c.from, to: c.to };
  }
  return changes;
}
