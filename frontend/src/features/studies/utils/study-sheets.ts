import {
  accuracyProfileErrors,
  IMPORT_SECTIONS,
  MODELS,
  WEIGHTINGS,
  type AccuracyItem,
  type CalibrationModel,
  type ImportSection,
  type Weighting,
} from '@meritline/shared';
import { newRow, rowProblems, sectionColumns, type GridRow, type SectionUnits } from './grid-sections';
import { isNotDetected, parseDecimal } from './parse-number';

export type Sheets = Record<ImportSection, GridRow[]>;

export interface StudySettings {
  model: CalibrationModel;
  weighting: Weighting;
  confidence: number;
  alpha: number;
  /** As typed; the Horwitz prediction needs it as a mass fraction (1 mg/kg = 1e-6). */
  massFraction: string;
  accuracy: AccuracyOptions;
}

/** The accuracy-profile, reference-material and uncertainty options, as typed; empty means the method version's. */
export interface AccuracyOptions {
  beta: string;
  lambda: string;
  coverageFactor: string;
  relativeAbove: string;
  uReferencePct: string;
  certified: string;
  uCertified: string;
  /** Results on the reference material, separated by spaces or semicolons. */
  referenceResults: string;
}

/** The editable form of a study's data: grids of text cells plus the settings; `extras` keeps what the wizard does not edit. */
export interface DataDraft {
  settings: StudySettings;
  sheets: Sheets;
  extras: Record<string, unknown>;
}

const MANAGED = new Set<string>([
  'model',
  'weighting',
  'confidence',
  'alpha',
  'massFraction',
  'accuracyProfile',
  'referenceMaterial',
  'uncertainty',
  ...IMPORT_SECTIONS,
]);

type Exclusion = { reason: string; test?: string };
const exclusionOf = (excluded: Exclusion | undefined): Exclusion | undefined =>
  excluded ? { reason: excluded.reason, ...(excluded.test ? { test: excluded.test } : {}) } : undefined;
const exclusionField = (row: GridRow) => (row.excluded ? { excluded: exclusionOf(row.excluded) } : {});

/** A low-level spike or MDL blank as stored: a value (null: no numerical result) or the value with its exclusion. */
type LowSpikeEntry = number | null | { value: number | null; excluded?: Exclusion };
const entryOf = (entry: LowSpikeEntry) =>
  entry !== null && typeof entry === 'object' ? { value: entry.value, excluded: exclusionOf(entry.excluded) } : { value: entry };

const text = (value: unknown) => (value === undefined || value === null ? '' : String(value));
const list = <T>(value: unknown): T[] => (Array.isArray(value) ? (value as T[]) : []);

export function dataToDraft(data: Record<string, unknown>): DataDraft {
  const extras = Object.fromEntries(Object.entries(data).filter(([key]) => !MANAGED.has(key)));
  const standards = list<{ x: number; y: number; id?: string; preparationId?: string; excluded?: Exclusion }>(data.standards).map((s) => ({
    ...newRow({ x: text(s.x), y: text(s.y), ...(s.id ? { id: s.id } : {}) }, exclusionOf(s.excluded)),
    ...(s.preparationId ? { preparationId: s.preparationId } : {}),
  }));
  const unknowns = list<{ id: string; y: number[]; dilution?: number }>(data.unknowns).flatMap((u) =>
    (u.y.length > 0 ? u.y : [NaN]).map((y) => newRow({ id: u.id, y: Number.isNaN(y) ? '' : text(y), dilution: text(u.dilution) })),
  );
  const spikes = (data.lowSpikes ?? {}) as { spiked?: LowSpikeEntry[]; blanks?: LowSpikeEntry[] };
  const spiked = spikes.spiked ?? [];
  const spikeBlanks = spikes.blanks ?? [];
  const lowSpikes = Array.from({ length: Math.max(spiked.length, spikeBlanks.length) }, (_, i) => {
    const spike = i < spiked.length ? entryOf(spiked[i]) : undefined;
    const blank = i < spikeBlanks.length ? entryOf(spikeBlanks[i]) : undefined;
    const excludedCells = {
      ...(spike?.excluded ? { spiked: spike.excluded } : {}),
      ...(blank?.excluded ? { blank: blank.excluded } : {}),
    };
    return {
      ...newRow({ spiked: text(spike?.value), blank: blank ? (blank.value === null ? 'ND' : text(blank.value)) : '' }),
      ...(Object.keys(excludedCells).length > 0 ? { excludedCells } : {}),
    };
  });
  const profile = (data.accuracyProfile ?? {}) as { beta?: number; lambda?: number };
  const uncertainty = (data.uncertainty ?? {}) as { coverageFactor?: number; relativeAbove?: number; uReferencePct?: number };
  const reference = (data.referenceMaterial ?? {}) as { certified?: number; uCertified?: number; results?: number[] };
  const model = MODELS.includes(data.model as CalibrationModel) ? (data.model as CalibrationModel) : 'linear';
  const weighting = WEIGHTINGS.includes(data.weighting as Weighting) ? (data.weighting as Weighting) : 'none';
  return {
    extras,
    settings: {
      model,
      weighting,
      confidence: typeof data.confidence === 'number' ? data.confidence : 0.95,
      alpha: typeof data.alpha === 'number' ? data.alpha : 0.05,
      massFraction: text(data.massFraction),
      accuracy: {
        beta: text(profile.beta),
        lambda: text(profile.lambda),
        coverageFactor: text(uncertainty.coverageFactor),
        relativeAbove: text(uncertainty.relativeAbove),
        uReferencePct: text(uncertainty.uReferencePct),
        certified: text(reference.certified),
        uCertified: text(reference.uCertified),
        referenceResults: (reference.results ?? []).join('; '),
      },
    },
    sheets: {
      standards,
      unknowns,
      blanks: list<number | { value: number; excluded?: Exclusion }>(data.blanks).map((b) =>
        typeof b === 'object' && b !== null ? newRow({ value: text(b.value) }, exclusionOf(b.excluded)) : newRow({ value: text(b) }),
      ),
      lowSpikes,
      recovery: list<{ id: string; level?: string; added: number; found: number; native?: number; excluded?: Exclusion }>(
        data.recovery,
      ).map((r) =>
        newRow(
          { id: r.id, level: text(r.level), added: text(r.added), found: text(r.found), native: text(r.native) },
          exclusionOf(r.excluded),
        ),
      ),
      precision: list<{ group: string; value: number; excluded?: Exclusion }>(data.precision).map((p) =>
        newRow({ group: p.group, value: text(p.value) }, exclusionOf(p.excluded)),
      ),
      accuracy: list<{ level: string; series: string; nominal: number; found: number }>(data.accuracy).map((a) =>
        newRow({ level: text(a.level), series: text(a.series), nominal: text(a.nominal), found: text(a.found) }),
      ),
    },
  };
}

/** Rows that are complete and hold numbers where numbers belong; the others stay in the grid, marked, and are not sent. */
export function usableRows(section: ImportSection, rows: readonly GridRow[], units: SectionUnits = {}): GridRow[] {
  const columns = sectionColumns(section, units);
  return rows.filter(
    (row) => columns.some((c) => (row.cells[c.key] ?? '').trim() !== '') && Object.keys(rowProblems(row, columns)).length === 0,
  );
}

export function countSkippedRows(section: ImportSection, rows: readonly GridRow[]): number {
  const columns = sectionColumns(section, {});
  return rows.filter(
    (row) => columns.some((c) => (row.cells[c.key] ?? '').trim() !== '') && Object.keys(rowProblems(row, columns)).length > 0,
  ).length;
}

const num = (value: string | undefined) => parseDecimal(value ?? '') as number;
const optionalNum = (value: string | undefined) => ((value ?? '').trim() === '' ? undefined : num(value));

/** The study data (engine input format) for a draft: only usable rows, numbers as numbers. */
export function draftToData({ settings, sheets, extras }: DataDraft): Record<string, unknown> {
  const data: Record<string, unknown> = {
    ...extras,
    model: settings.model,
    weighting: settings.weighting,
    confidence: settings.confidence,
    alpha: settings.alpha,
    standards: usableRows('standards', sheets.standards).map((row) => ({
      x: num(row.cells.x),
      y: num(row.cells.y),
      ...(row.cells.id ? { id: row.cells.id } : {}),
      ...(row.preparationId ? { preparationId: row.preparationId } : {}),
      ...exclusionField(row),
    })),
  };
  // A blank is written as a plain number unless it is excluded, so data without exclusions keep their old shape.
  const blanks = usableRows('blanks', sheets.blanks).map((row) =>
    row.excluded ? { value: num(row.cells.value), ...exclusionField(row) } : num(row.cells.value),
  );
  if (blanks.length > 0) data.blanks = blanks;

  const unknowns = new Map<string, { id: string; y: number[]; dilution?: number }>();
  for (const row of usableRows('unknowns', sheets.unknowns)) {
    const id = row.cells.id.trim();
    const sample = unknowns.get(id) ?? { id, y: [] };
    sample.y.push(num(row.cells.y));
    const dilution = optionalNum(row.cells.dilution);
    if (dilution !== undefined && sample.dilution === undefined) sample.dilution = dilution;
    unknowns.set(id, sample);
  }
  if (unknowns.size > 0) data.unknowns = [...unknowns.values()];

  // Like blanks, a low-level spike or MDL blank is written as a plain value unless it is excluded.
  const spikeRows = usableRows('lowSpikes', sheets.lowSpikes);
  const withExclusion = <T>(row: GridRow, key: string, value: T) => {
    const excluded = exclusionOf(row.excludedCells?.[key]);
    return excluded ? { value, excluded } : value;
  };
  const spiked = spikeRows.flatMap((row) =>
    optionalNum(row.cells.spiked) === undefined ? [] : [withExclusion(row, 'spiked', num(row.cells.spiked))],
  );
  const spikeBlanks = spikeRows.flatMap((row) => {
    const cell = (row.cells.blank ?? '').trim();
    if (cell === '') return [];
    return [withExclusion(row, 'blank', isNotDetected(cell) ? null : num(cell))];
  });
  if (spiked.length > 0 || spikeBlanks.length > 0) data.lowSpikes = { spiked, ...(spikeBlanks.length > 0 ? { blanks: spikeBlanks } : {}) };

  const recovery = usableRows('recovery', sheets.recovery).map((row, i) => ({
    id: row.cells.id?.trim() || `R${i + 1}`,
    ...(row.cells.level?.trim() ? { level: row.cells.level.trim() } : {}),
    added: num(row.cells.added),
    found: num(row.cells.found),
    ...(optionalNum(row.cells.native) !== undefined ? { native: num(row.cells.native) } : {}),
    ...exclusionField(row),
  }));
  if (recovery.length > 0) data.recovery = recovery;

  const precision = usableRows('precision', sheets.precision).map((row) => ({
    group: row.cells.group.trim(),
    value: num(row.cells.value),
    ...exclusionField(row),
  }));
  if (precision.length > 0) data.precision = precision;

  const massFraction = parseDecimal(settings.massFraction);
  if (massFraction !== null && massFraction > 0 && massFraction <= 1) data.massFraction = massFraction;

  const accuracy = accuracyItems(sheets.accuracy);
  const complete = accuracy.length > 0 && accuracyDesignProblems(accuracy).length === 0;
  if (complete) data.accuracy = accuracy;
  Object.assign(data, accuracyOptionsToData(settings.accuracy, complete));
  return data;
}

export function accuracyItems(rows: readonly GridRow[]): AccuracyItem[] {
  return usableRows('accuracy', rows).map((row) => ({
    level: row.cells.level.trim(),
    series: row.cells.series.trim(),
    nominal: num(row.cells.nominal),
    found: num(row.cells.found),
  }));
}

/**
 * What keeps an accuracy design from being saved: series or replicates missing, unbalanced series, a level
 * with two nominal values. The server refuses such a design, so the wizard saves nothing while it is typed
 * and leaves it out of the live figures; fewer than 3 levels is only unfinished and is saved.
 */
export function accuracyDesignProblems(items: readonly AccuracyItem[]): string[] {
  return accuracyProfileErrors(items)
    .filter((e) => e.code !== 'too_few_levels')
    .map((e) => e.message.charAt(0).toUpperCase() + e.message.slice(1));
}

/** What is wrong with each accuracy option as typed, by option; empty options are fine (the method version's apply). */
export function accuracyOptionProblems(options: AccuracyOptions): Partial<Record<keyof AccuracyOptions, string>> {
  const problems: Partial<Record<keyof AccuracyOptions, string>> = {};
  const check = (key: keyof AccuracyOptions, ok: (v: number) => boolean, words: string) => {
    if (options[key].trim() === '') return;
    const value = parseDecimal(options[key]);
    if (value === null) problems[key] = 'Not a number';
    else if (!ok(value)) problems[key] = words;
  };
  check('beta', (v) => v > 0 && v < 1, 'β lies between 0 and 1');
  check('lambda', (v) => v > 0 && v <= 100, 'λ lies above 0 and at most 100 %');
  check('coverageFactor', (v) => v >= 1 && v <= 5, 'k lies from 1 to 5');
  check('relativeAbove', (v) => v > 0, 'Must be above zero');
  check('uReferencePct', (v) => v >= 0 && v <= 50, 'From 0 to 50 %');
  check('certified', (v) => v > 0, 'Must be above zero');
  check('uCertified', (v) => v >= 0, 'Must not be negative');
  const results = referenceResults(options.referenceResults);
  if (results === null) problems.referenceResults = 'Write numbers separated by spaces or semicolons';
  return problems;
}

/** Reference-material results as typed ("5.12; 5.18 5.09"); null when one of them is not a number. */
export function referenceResults(text: string): number[] | null {
  const parts = text.split(/[;\s]+/).filter((part) => part !== '');
  const values = parts.map(parseDecimal);
  return values.every((v): v is number => v !== null) ? values : null;
}

function accuracyOptionsToData(options: AccuracyOptions, hasAccuracy: boolean): Record<string, unknown> {
  const problems = accuracyOptionProblems(options);
  const value = (key: keyof AccuracyOptions) =>
    options[key].trim() === '' || problems[key] ? undefined : (parseDecimal(options[key]) as number);
  const out: Record<string, unknown> = {};
  const profile = { beta: value('beta'), lambda: value('lambda') };
  if (hasAccuracy && (profile.beta !== undefined || profile.lambda !== undefined))
    out.accuracyProfile = Object.fromEntries(Object.entries(profile).filter(([, v]) => v !== undefined));
  const uncertainty = {
    coverageFactor: value('coverageFactor'),
    relativeAbove: value('relativeAbove'),
    uReferencePct: value('uReferencePct'),
  };
  if (Object.values(uncertainty).some((v) => v !== undefined))
    out.uncertainty = Object.fromEntries(Object.entries(uncertainty).filter(([, v]) => v !== undefined));
  // The engine needs the whole reference material; a part of it waits in the form until the rest is typed.
  const certified = value('certified');
  const uCertified = value('uCertified');
  const results = referenceResults(options.referenceResults);
  if (certified !== undefined && uCertified !== undefined && results && results.length >= 2)
    out.referenceMaterial = { certified, uCertified, results };
  return out;
}
