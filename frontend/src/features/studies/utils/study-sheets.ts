import { MODELS, WEIGHTINGS, type CalibrationModel, type Weighting, IMPORT_SECTIONS, type ImportSection } from '@meritline/shared';
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
}

/** The editable form of a study's data: grids of text cells plus the settings; `extras` keeps what the wizard does not edit. */
export interface DataDraft {
  settings: StudySettings;
  sheets: Sheets;
  extras: Record<string, unknown>;
}

const MANAGED = new Set<string>(['model', 'weighting', 'confidence', 'alpha', 'massFraction', ...IMPORT_SECTIONS]);

type Exclusion = { reason: string; test?: string };
const exclusionOf = (excluded: Exclusion | undefined): Exclusion | undefined =>
  excluded ? { reason: excluded.reason, ...(excluded.test ? { test: excluded.test } : {}) } : undefined;
const exclusionField = (row: GridRow) => (row.excluded ? { excluded: exclusionOf(row.excluded) } : {});

const text = (value: unknown) => (value === undefined || value === null ? '' : String(value));
const list = <T>(value: unknown): T[] => (Array.isArray(value) ? (value as T[]) : []);

export function dataToDraft(data: Record<string, unknown>): DataDraft {
  const extras = Object.fromEntries(Object.entries(data).filter(([key]) => !MANAGED.has(key)));
  const standards = list<{ x: number; y: number; id?: string; excluded?: Exclusion }>(data.standards).map((s) =>
    newRow({ x: text(s.x), y: text(s.y), ...(s.id ? { id: s.id } : {}) }, exclusionOf(s.excluded)),
  );
  const unknowns = list<{ id: string; y: number[]; dilution?: number }>(data.unknowns).flatMap((u) =>
    (u.y.length > 0 ? u.y : [NaN]).map((y) => newRow({ id: u.id, y: Number.isNaN(y) ? '' : text(y), dilution: text(u.dilution) })),
  );
  const spikes = (data.lowSpikes ?? {}) as { spiked?: number[]; blanks?: (number | null)[] };
  const spiked = spikes.spiked ?? [];
  const spikeBlanks = spikes.blanks ?? [];
  const lowSpikes = Array.from({ length: Math.max(spiked.length, spikeBlanks.length) }, (_, i) =>
    newRow({ spiked: text(spiked[i]), blank: i < spikeBlanks.length ? (spikeBlanks[i] === null ? 'ND' : text(spikeBlanks[i])) : '' }),
  );
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
    },
    sheets: {
      standards,
      unknowns,
      blanks: list<number>(data.blanks).map((v) => newRow({ value: text(v) })),
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
      ...exclusionField(row),
    })),
  };
  const blanks = usableRows('blanks', sheets.blanks).map((row) => num(row.cells.value));
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

  const spikeRows = usableRows('lowSpikes', sheets.lowSpikes);
  const spiked = spikeRows.flatMap((row) => (optionalNum(row.cells.spiked) === undefined ? [] : [num(row.cells.spiked)]));
  const spikeBlanks = spikeRows.flatMap((row) => {
    const cell = (row.cells.blank ?? '').trim();
    if (cell === '') return [];
    return [isNotDetected(cell) ? null : num(cell)];
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
  return data;
}
