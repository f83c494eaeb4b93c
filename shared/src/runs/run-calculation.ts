import {
  RUN_DATA_KEYS,
  RUN_MODELS,
  type ModelChoice,
  type OnePointBias,
  type RunBlankInput,
  type RunBlankResult,
  type RunCheck,
  type RunFlag,
  type RunModel,
  type RunPreviewDto,
  type RunQcSampleInput,
  type RunQcSampleResult,
  type RunRecordedData,
  type RunResultUncertainty,
  type RunUnknown,
  type ValidationBasis,
} from '../api/runs.js';
import type { FieldError } from '../api/common.js';
import { withUnit } from '../catalogue/format.js';
import { routineUncertainty } from '../engine/routine-uncertainty.js';
import { StudyValidationError } from '../errors.js';
import { evaluateStudy } from '../evaluate.js';
import type { CalibrationResult } from '../result.js';
import type { StudyInput } from '../study.js';
import type { RunContext } from './run-context.js';
import { formatRunInterval, formatRunPct, formatRunSignificant } from './reported-numbers.js';

const MAX_ROWS = 500;
const MAX_READINGS = 100;
const MAX_ID = 80;

/** Method blanks and QC samples: their shape checked here, so the engine only ever sees well-formed readings. */
function readControls(data: Json): { blanks: RunBlankInput[]; qcSamples: RunQcSampleInput[]; errors: FieldError[] } {
  const errors: FieldError[] = [];
  const fail = (field: string, code: string, message: string) => errors.push({ field: `data.${field}`, code, message });
  const positive = (value: unknown) => typeof value === 'number' && Number.isFinite(value) && value > 0 && value < 1e12;
  const rows = (key: 'blanks' | 'qcSamples', what: string) => {
    const value = data[key];
    if (value === undefined) return [];
    if (!Array.isArray(value)) return (fail(key, 'not_array', `The ${what} must be a list.`), []);
    if (value.length > MAX_ROWS) return (fail(key, 'too_many', `At most ${MAX_ROWS} ${what} per run.`), []);
    const seen = new Set<string>();
    return value.flatMap((item: unknown, i) => {
      const field = `${key}[${i}]`;
      if (!isObject(item)) return (fail(field, 'not_object', `Each of the ${what} needs a name and readings.`), []);
      const allowed = key === 'blanks' ? ['id', 'y', 'limit'] : ['id', 'known', 'y', 'dilution'];
      for (const k of Object.keys(item)) if (!allowed.includes(k)) fail(`${field}.${k}`, 'unknown_field', `${k} is not part of ${what}.`);
      const id = typeof item.id === 'string' ? item.id.trim() : '';
      if (!id || id.length > MAX_ID) fail(`${field}.id`, 'invalid', `Give each of the ${what} a name of 1 to ${MAX_ID} characters.`);
      else if (seen.has(id)) fail(`${field}.id`, 'duplicate', `The name “${id}” is used twice among the ${what}.`);
      seen.add(id);
      const y = item.y;
      if (!Array.isArray(y) || y.length === 0 || y.length > MAX_READINGS || !y.every((v) => typeof v === 'number' && Number.isFinite(v)))
        fail(`${field}.y`, 'invalid', `${id || `Row ${i + 1}`}: give 1 to ${MAX_READINGS} responses, each a number.`);
      return [{ ...item, id }];
    });
  };
  const blanks = rows('blanks', 'method blanks') as unknown as RunBlankInput[];
  blanks.forEach((b, i) => {
    if (b.limit !== undefined && !positive(b.limit))
      fail(`blanks[${i}].limit`, 'not_positive', `${b.id}: the limit must be a concentration above zero (or left empty for the LOD).`);
  });
  const qcSamples = rows('qcSamples', 'QC samples') as unknown as RunQcSampleInput[];
  qcSamples.forEach((q, i) => {
    if (!positive(q.known)) fail(`qcSamples[${i}].known`, 'not_positive', `${q.id}: the known value must be a concentration above zero.`);
    if (q.dilution !== undefined && !positive(q.dilution))
      fail(`qcSamples[${i}].dilution`, 'not_positive', `${q.id}: the dilution factor must be a number above zero.`);
  });
  return { blanks, qcSamples, errors };
}

const blankId = (i: number) => `internal:method-blank:${i}`;
const qcId = (i: number) => `internal:qc-sample:${i}`;

/** The engine reads blanks and QC samples as extra unknowns; its field paths point back to their own lists. */
function controlField(field: string, unknowns: number, blanks: number): string {
  const m = /^unknowns\[(\d+)\](.*)$/.exec(field);
  if (!m || Number(m[1]) < unknowns) return field;
  const i = Number(m[1]) - unknowns;
  return i < blanks ? `blanks[${i}]${m[2]}` : `qcSamples[${i - blanks}]${m[2]}`;
}

function namedControls(message: string, controls: { blanks: RunBlankInput[]; qcSamples: RunQcSampleInput[] }): string {
  return message
    .replace(/internal:method-blank:(\d+)/g, (_, i: string) => `method blank ${controls.blanks[Number(i)]?.id ?? ''}`)
    .replace(/internal:qc-sample:(\d+)/g, (_, i: string) => `QC sample ${controls.qcSamples[Number(i)]?.id ?? ''}`);
}

const DILUTION_STEPS = [2, 5, 10, 20, 50, 100, 200, 500, 1000, 2000, 5000, 10000];
/** A re-measured dilution should land below this share of the top standard, leaving headroom. */
const DILUTION_TARGET = 0.8;

type Json = Record<string, unknown>;
const isObject = (value: unknown): value is Json => typeof value === 'object' && value !== null && !Array.isArray(value);

function prefixed(errors: FieldError[]): StudyValidationError {
  return new StudyValidationError(errors.map((e) => ({ ...e, field: e.field === 'study' ? 'data' : `data.${e.field}` })));
}

/** Refusals the engine would word generally, given here against the exact field. */
function checkRunShape(data: Json, choices: ModelChoice[]): { model: RunModel; choice: ModelChoice } {
  const errors: FieldError[] = [];
  for (const key of Object.keys(data)) {
    if (!(RUN_DATA_KEYS as readonly string[]).includes(key))
      errors.push({ field: `data.${key}`, code: 'unknown_field', message: `${key} is not part of a run.` });
  }
  const model = data.model as RunModel;
  const choice = choices.find((c) => c.model === model);
  if (!RUN_MODELS.includes(model) || !choice) {
    errors.push({ field: 'data.model', code: 'invalid_value', message: `Choose one of ${RUN_MODELS.join(', ')}.` });
    throw new StudyValidationError(errors);
  }
  if (!choice.allowed)
    errors.push({ field: 'data.model', code: 'not_allowed', message: choice.reason ?? `${model} is not allowed on this version.` });
  if (data.weighting !== undefined && data.weighting !== (choice.weighting ?? 'none')) {
    errors.push({
      field: 'data.weighting',
      code: 'not_validated',
      message: choice.weighting
        ? `This version was validated with weighting ${choice.weighting}; a ${model} run uses the same.`
        : `A ${model} calibration takes no weighting.`,
    });
  }
  if (data.twoPoint !== undefined && model !== 'two-point') {
    errors.push({ field: 'data.twoPoint', code: 'incompatible', message: 'Bracketing applies to two-point calibrations only.' });
  }
  for (const key of ['checks', 'unknowns'] as const) {
    if (!Array.isArray(data[key]) || data[key].length === 0) {
      const what =
        key === 'checks' ? 'at least one check standard, which decides whether the calibration still holds' : 'at least one sample';
      errors.push({ field: `data.${key}`, code: 'required', message: `A run needs ${what}.` });
    }
  }
  const standards = Array.isArray(data.standards) ? data.standards : [];
  const used = standards.map((s, index) => ({ s, index })).filter(({ s }) => isObject(s) && !s.excluded && typeof s.x === 'number');
  if (model === 'one-point') {
    for (const { s, index } of used) {
      if (((s as Json).x as number) <= 0) {
        errors.push({
          field: `data.standards[${index}].x`,
          code: 'not_positive',
          message: 'The one-point standard needs a concentration above zero.',
        });
      }
    }
  }
  if (model === 'two-point' && used.length >= 2 && used.every(({ s }) => (s as Json).x === (used[0].s as Json).x)) {
    errors.push({
      field: `data.standards[${used[1].index}].x`,
      code: 'all_x_equal',
      message: `Both standards are at the same concentration (${String((used[0].s as Json).x)}): a two-point line needs two different concentrations.`,
    });
  }
  if (errors.length > 0) throw new StudyValidationError(errors);
  return { model, choice };
}

/** Where a routine result's U comes from, in words (or that the validation states none). */
export function uncertaintyBasisText(basis: ValidationBasis, unit: string | undefined): string {
  const u = basis.uncertainty;
  if (!u || (!u.absolute && !u.relative))
    return `The validation study “${basis.studyTitle}” has no measurement uncertainty, so none is stated with the results.`;
  const k = `k = ${u.coverageFactor}`;
  const parts: string[] = [];
  if (u.absolute) {
    const level = u.absolute.below !== null && u.relative ? ` below ${withUnit(formatRunSignificant(u.absolute.below, 3), unit)}` : '';
    parts.push(
      `${withUnit(formatRunSignificant(u.absolute.U, 2), unit)} absolute${level} in the measured solution, times the dilution factor`,
    );
  }
  if (u.relative) {
    const level = u.relative.from !== null && u.absolute ? ` at and above ${withUnit(formatRunSignificant(u.relative.from, 3), unit)}` : '';
    parts.push(`${formatRunSignificant(u.relative.UPct, 2)} % of the result${level}`);
  }
  return `Expanded uncertainty U (${k}) from the top-down uncertainty of the validation study “${basis.studyTitle}” (intermediate precision and bias): ${parts.join('; ')}.`;
}

function suggestDilution(x0Undiluted: number, top: number, dilution: number): number {
  const step = DILUTION_STEPS.find((f) => x0Undiluted / f <= DILUTION_TARGET * top) ?? DILUTION_STEPS[DILUTION_STEPS.length - 1];
  return step * dilution;
}

function readUnknown(
  u: { id: string; m: number; yMean: number; dilution: number; x0: number; sX0: number | null; ci: [number, number] | null },
  calibration: CalibrationResult,
  basis: ValidationBasis,
  unit: string | undefined,
  reportable: boolean,
): RunUnknown {
  const x0Undiluted = u.x0 / u.dilution;
  const { lod, loq, validatedRange: range } = basis;
  const flags: RunFlag[] = [];
  const remarks: string[] = [];
  const inSample = (x: number) => withUnit(formatRunSignificant(x, 2), unit);
  if (lod !== null && x0Undiluted < lod) {
    flags.push('belowLod');
    remarks.push(`Not detected: below the LOD (${inSample(lod)} in the measured solution).`);
  }
  if (loq !== null && x0Undiluted < loq) {
    flags.push('belowLoq');
    if (!flags.includes('belowLod'))
      remarks.push(`Detected but below the LOQ (${inSample(loq)} in the measured solution): not quantified.`);
  }
  const belowLimits = flags.length > 0;
  let suggestedDilution: number | null = null;
  if (x0Undiluted > calibration.xMax) {
    flags.push('aboveTopStandard');
    suggestedDilution = suggestDilution(x0Undiluted, calibration.xMax, u.dilution);
    remarks.push(
      `Above the top standard (${withUnit(formatRunSignificant(calibration.xMax, 3), unit)}): dilute and measure again, e.g. at a total dilution factor of ${suggestedDilution}.`,
    );
  }
  if (range && !belowLimits && (x0Undiluted < range.low || x0Undiluted > range.high)) {
    flags.push('outsideValidatedRange');
    remarks.push(
      `Outside the validated range (${formatRunSignificant(range.low, 3)} to ${withUnit(formatRunSignificant(range.high, 3), unit)}).`,
    );
  }
  if (!reportable) remarks.push('Not reportable: the run was rejected.');

  const quantified = !belowLimits && !flags.includes('aboveTopStandard');
  const expanded = quantified && basis.uncertainty ? routineUncertainty(basis.uncertainty, x0Undiluted, u.dilution) : null;
  const uncertainty: RunResultUncertainty = { value: expanded, basis: uncertaintyBasisText(basis, unit) };

  let reported: string;
  const limit = loq ?? lod;
  if (belowLimits && limit !== null) reported = `< ${withUnit(formatRunSignificant(limit * u.dilution, 2), unit)}`;
  else if (flags.includes('aboveTopStandard')) reported = `> ${withUnit(formatRunSignificant(calibration.xMax * u.dilution, 3), unit)}`;
  else if (expanded) reported = formatRunInterval(u.x0, expanded.U, unit);
  else if (u.ci) reported = formatRunInterval(u.x0, (u.ci[1] - u.ci[0]) / 2, unit);
  else reported = withUnit(formatRunSignificant(u.x0, 3), unit);

  return { ...u, x0Undiluted, flags, reported, remarks, suggestedDilution, reportable, uncertainty };
}

/**
 * The bias a line forced through the origin makes at each unknown. The reference is the
 * validation's straight line rescaled to pass through today's standard, so that day-to-day
 * sensitivity drops out and only the intercept remains: bias = (x_s − x)·a / (a + b·x_s)
 * for a standard at x_s on a response y = a + b·x (common practice).
 */
function onePointBias(calibration: CalibrationResult, unknowns: RunUnknown[], basis: ValidationBasis): OnePointBias | null {
  const level = calibration.levels[0];
  const intercept = basis.model === 'linear' ? basis.intercept : (basis.interceptTest?.intercept ?? 0);
  const interceptAsConcentration = intercept / basis.slope;
  if (!level || !(level.x + interceptAsConcentration > 0)) return null;
  const slope = level.yMean / (level.x + interceptAsConcentration);
  const referenceLine = { slope, intercept: slope * interceptAsConcentration };
  return {
    referenceLine,
    interceptAsConcentration,
    items: unknowns.map((u) => {
      const regression = ((u.yMean - referenceLine.intercept) / slope) * u.dilution;
      const bias = u.x0 - regression;
      return { id: u.id, yMean: u.yMean, onePoint: u.x0, regression, bias, biasPct: regression === 0 ? null : (100 * bias) / regression };
    }),
  };
}

function checkOutcome(
  check: { id: string; nominal: number; found: number; recoveryPct: number },
  ys: number[],
  tolerancePct: number,
): RunCheck {
  const yMean = ys.reduce((sum, y) => sum + y, 0) / ys.length;
  // A recovery that rounds onto the limit passes: the window is inclusive.
  const pass = Math.abs(check.recoveryPct - 100) <= tolerancePct + 1e-9;
  return { ...check, yMean, pass };
}

/** Calibrates a routine run, reads its unknowns and judges its check standards. */
export function evaluateRun(input: unknown, context: RunContext): RunPreviewDto {
  if (!isObject(input)) throw new StudyValidationError([{ field: 'data', code: 'not_object', message: 'The run data must be an object.' }]);
  const { model, choice } = checkRunShape(input, context.choices);
  const { basis, settings, units, qcWindow } = context;
  const controls = readControls(input);
  if (controls.errors.length) throw new StudyValidationError(controls.errors);
  const missingLimit = controls.blanks.findIndex((b) => b.limit === undefined);
  if (missingLimit >= 0 && basis.lod === null)
    throw new StudyValidationError([
      {
        field: `data.blanks[${missingLimit}].limit`,
        code: 'required',
        message: `${controls.blanks[missingLimit].id}: the validation has no LOD, so give the limit the blank must stay below.`,
      },
    ]);
  const data = {
    units,
    model,
    weighting: choice.weighting ?? 'none',
    confidence: basis.confidence,
    ...(input.twoPoint !== undefined ? { twoPoint: input.twoPoint } : {}),
    standards: input.standards,
    checks: input.checks,
    unknowns: input.unknowns,
    ...(controls.blanks.length ? { blanks: controls.blanks } : {}),
    ...(controls.qcSamples.length ? { qcSamples: controls.qcSamples } : {}),
  } as RunRecordedData;
  const unknownCount = Array.isArray(input.unknowns) ? input.unknowns.length : 0;
  const engineInput = {
    ...data,
    blanks: undefined,
    qcSamples: undefined,
    unknowns: [
      ...(input.unknowns as unknown[]),
      ...controls.blanks.map((b, i) => ({ id: blankId(i), y: b.y })),
      ...controls.qcSamples.map((q, i) => ({ id: qcId(i), y: q.y, ...(q.dilution !== undefined ? { dilution: q.dilution } : {}) })),
    ],
  };
  let engine;
  try {
    engine = evaluateStudy(JSON.parse(JSON.stringify(engineInput)) as StudyInput);
  } catch (error) {
    if (error instanceof StudyValidationError)
      throw prefixed(error.errors.map((e) => ({ ...e, field: controlField(e.field, unknownCount, controls.blanks.length) })));
    throw error;
  }
  for (const w of engine.warnings ?? []) w.message = namedControls(w.message, controls);
  const calibration = engine.calibration as CalibrationResult;
  const tolerancePct = settings.checkTolerancePct;
  const checks = (engine.checks ?? []).map((c, i) => checkOutcome(c, (input.checks as { y: number[] }[])[i].y, tolerancePct));
  const rejectionReasons = checks
    .filter((c) => !c.pass)
    .map(
      (c) =>
        `Check standard ${c.id} recovered ${formatRunPct(c.recoveryPct)} of its nominal ${withUnit(String(c.nominal), units.x)}, outside the acceptance window of ${100 - tolerancePct} to ${100 + tolerancePct} %.`,
    );
  const read = engine.unknowns ?? [];
  const blanks: RunBlankResult[] = controls.blanks.map((b, i) => {
    const r = read.find((u) => u.id === blankId(i))!;
    const limit = b.limit ?? (basis.lod as number);
    return { id: b.id, yMean: r.yMean, found: r.x0, limit, limitBasis: b.limit !== undefined ? 'set' : 'lod', pass: r.x0 < limit };
  });
  const qcSamples: RunQcSampleResult[] = controls.qcSamples.map((q, i) => {
    const r = read.find((u) => u.id === qcId(i))!;
    const recoveryPct = (100 * r.x0) / q.known;
    // Inclusive window, as for the check standards.
    const pass = recoveryPct >= qcWindow.low - 1e-9 && recoveryPct <= qcWindow.high + 1e-9;
    return { id: q.id, known: q.known, dilution: q.dilution ?? 1, yMean: r.yMean, found: r.x0, recoveryPct, pass };
  });
  for (const b of blanks.filter((b) => !b.pass))
    rejectionReasons.push(
      `Method blank ${b.id} read ${withUnit(formatRunSignificant(b.found, 3), units.x)}, not below ${b.limitBasis === 'lod' ? 'the LOD of the validation' : 'its set limit'} of ${withUnit(formatRunSignificant(b.limit, 3), units.x)}: the run may be contaminated.`,
    );
  for (const q of qcSamples.filter((q) => !q.pass))
    rejectionReasons.push(
      `QC sample ${q.id} recovered ${formatRunPct(q.recoveryPct)} of its known ${withUnit(String(q.known), units.x)}, outside the window of ${qcWindow.low} to ${qcWindow.high} % (${qcWindow.basis}).`,
    );
  const status = rejectionReasons.length === 0 ? 'accepted' : 'rejected';
  const unknowns = read.slice(0, unknownCount).map((u) => readUnknown(u, calibration, basis, units.x, status === 'accepted'));
  return {
    data,
    status,
    rejectionReasons,
    result: {
      ...engine,
      unknowns,
      checks,
      onePointBias: model === 'one-point' ? onePointBias(calibration, unknowns, basis) : null,
      acceptance: { tolerancePct, low: 100 - tolerancePct, high: 100 + tolerancePct },
      validation: basis,
      blanks,
      qcSamples,
      qcWindow,
    },
  };
}
