import { StudyValidationError, type StudyFieldError } from './errors.js';
import {
  CRITERION_OPS,
  MODELS,
  STUDY_LIMITS,
  WEIGHTINGS,
  type Blank,
  type BlankResult,
  type CheckStandard,
  type Criterion,
  type CriterionOp,
  type Exclusion,
  type LowSpikes,
  type MdlBlank,
  type MdlBlankResult,
  type PrecisionResult,
  type RecoveryItem,
  type Spike,
  type StandardPoint,
  type Study,
  type UnknownSample,
  type Units,
} from './study.js';

import { parseUncertaintySections, UNCERTAINTY_KEYS } from './validate-uncertainty.js';

type Json = Record<string, unknown>;

const TOP_LEVEL_KEYS = new Set([
  'units',
  'model',
  'weighting',
  'confidence',
  'alpha',
  'standards',
  'twoPoint',
  'blanks',
  'unknowns',
  'checks',
  'recovery',
  'precision',
  'lowSpikes',
  'massFraction',
  'criteria',
  ...UNCERTAINTY_KEYS,
]);

class Collector {
  readonly errors: StudyFieldError[] = [];

  add(field: string, code: string, message: string): void {
    this.errors.push({ field, code, message });
  }

  isObject(value: unknown, field: string): value is Json {
    if (typeof value === 'object' && value !== null && !Array.isArray(value)) return true;
    this.add(field, value === undefined ? 'required' : 'not_object', `${field} must be an object`);
    return false;
  }

  isArray(value: unknown, field: string): value is unknown[] {
    if (!Array.isArray(value)) {
      this.add(field, value === undefined ? 'required' : 'not_array', `${field} must be an array`);
      return false;
    }
    if (value.length > STUDY_LIMITS.rows) {
      this.add(field, 'too_many', `${field} holds ${value.length} entries; a study takes at most ${STUDY_LIMITS.rows} per list`);
      return false;
    }
    return true;
  }

  number(value: unknown, field: string): number | undefined {
    if (typeof value !== 'number') {
      this.add(field, value === undefined ? 'required' : 'not_number', `${field} must be a number`);
      return undefined;
    }
    if (!Number.isFinite(value)) {
      this.add(field, 'not_finite', `${field} must be a finite number`);
      return undefined;
    }
    return value;
  }

  positive(value: unknown, field: string): number | undefined {
    const v = this.number(value, field);
    if (v !== undefined && v <= 0) {
      this.add(field, 'not_positive', `${field} must be greater than zero`);
      return undefined;
    }
    return v;
  }

  text(value: unknown, field: string): string | undefined {
    if (typeof value === 'string' && value.trim() !== '') return value;
    this.add(field, value === undefined ? 'required' : 'not_string', `${field} must be a non-empty text`);
    return undefined;
  }

  numbers(value: unknown, field: string, minLength = 0): number[] | undefined {
    if (!this.isArray(value, field)) return undefined;
    const out = value.map((v, i) => this.number(v, `${field}[${i}]`));
    if (value.length < minLength) {
      this.add(field, 'too_few', `${field} needs at least ${minLength} value${minLength > 1 ? 's' : ''}`);
    }
    return out.every((v) => v !== undefined) ? (out as number[]) : undefined;
  }

  onlyKeys(value: Json, allowed: readonly string[], field: string): void {
    for (const key of Object.keys(value)) {
      if (!allowed.includes(key)) this.add(`${field}.${key}`, 'unknown_field', `${field}.${key} is not a study field`);
    }
  }

  oneOf<T extends string>(value: unknown, options: readonly T[], field: string, fallback: T): T {
    if (value === undefined) return fallback;
    if (typeof value === 'string' && (options as readonly string[]).includes(value)) return value as T;
    this.add(field, 'invalid_value', `${field} must be one of ${options.join(', ')}`);
    return fallback;
  }
}

function parseUnits(c: Collector, value: unknown): Units | undefined {
  if (value === undefined) return undefined;
  if (!c.isObject(value, 'units')) return undefined;
  const units: Units = {};
  for (const axis of ['x', 'y'] as const) {
    const v = value[axis];
    if (v === undefined) continue;
    if (typeof v === 'string') units[axis] = v;
    else c.add(`units.${axis}`, 'not_string', `units.${axis} must be a text`);
  }
  return units;
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** An excluded row keeps its data and says why it is left out of the figures. */
function parseExclusion(c: Collector, value: unknown, field: string): Exclusion | undefined {
  if (value === undefined || value === null || value === false) return undefined;
  if (!c.isObject(value, `${field}.excluded`)) return undefined;
  const reason = c.text(value.reason, `${field}.excluded.reason`);
  const exclusion: Exclusion = { ...value, reason: reason ?? '' };
  if (value.test !== undefined) exclusion.test = c.text(value.test, `${field}.excluded.test`);
  return exclusion;
}

function parseBlanks(c: Collector, value: unknown): Blank[] {
  if (!c.isArray(value, 'blanks')) return [];
  const blanks: Blank[] = [];
  value.forEach((item, i) => {
    const field = `blanks[${i}]`;
    if (typeof item !== 'object' || item === null || Array.isArray(item)) {
      blanks.push(c.number(item, field) ?? NaN);
      return;
    }
    if (!c.isObject(item, field)) return;
    c.onlyKeys(item, ['value', 'excluded'], field);
    const blank: BlankResult = { value: c.number(item.value, `${field}.value`) ?? NaN };
    const excluded = parseExclusion(c, item.excluded, field);
    if (excluded) blank.excluded = excluded;
    blanks.push(blank);
  });
  return blanks;
}

function parseStandards(c: Collector, value: unknown): StandardPoint[] {
  if (!c.isArray(value, 'standards')) return [];
  const standards: StandardPoint[] = [];
  value.forEach((item, i) => {
    const field = `standards[${i}]`;
    if (!c.isObject(item, field)) return;
    c.onlyKeys(item, ['x', 'y', 'id', 'sd', 'excluded', 'preparationId'], field);
    const x = c.number(item.x, `${field}.x`);
    const y = c.number(item.y, `${field}.y`);
    const point: StandardPoint = { x: x ?? NaN, y: y ?? NaN };
    if (item.id !== undefined) point.id = c.text(item.id, `${field}.id`);
    if (item.sd !== undefined) point.sd = c.positive(item.sd, `${field}.sd`);
    if (item.preparationId !== undefined && item.preparationId !== null) {
      const preparationId = c.text(item.preparationId, `${field}.preparationId`);
      if (preparationId !== undefined && !UUID.test(preparationId)) {
        c.add(`${field}.preparationId`, 'invalid_value', `${field}.preparationId must be the id of a saved preparation`);
      } else point.preparationId = preparationId;
    }
    const excluded = parseExclusion(c, item.excluded, field);
    if (excluded) point.excluded = excluded;
    standards.push(point);
  });
  return standards;
}

function parseUnknowns(c: Collector, value: unknown): UnknownSample[] | undefined {
  if (value === undefined) return undefined;
  if (!c.isArray(value, 'unknowns')) return undefined;
  const seen = new Set<string>();
  return value.flatMap((item, i) => {
    const field = `unknowns[${i}]`;
    if (!c.isObject(item, field)) return [];
    c.onlyKeys(item, ['id', 'y', 'dilution'], field);
    const id = c.text(item.id, `${field}.id`) ?? '';
    if (seen.has(id)) c.add(`${field}.id`, 'duplicate', `${field}.id "${id}" is used twice`);
    seen.add(id);
    const y = c.numbers(item.y, `${field}.y`);
    if (y && y.length === 0) c.add(`${field}.y`, 'empty', `${field} has no responses`);
    const unknown: UnknownSample = { id, y: y ?? [] };
    if (item.dilution !== undefined) unknown.dilution = c.positive(item.dilution, `${field}.dilution`);
    return [unknown];
  });
}

function parseChecks(c: Collector, value: unknown): CheckStandard[] | undefined {
  if (value === undefined) return undefined;
  if (!c.isArray(value, 'checks')) return undefined;
  return value.flatMap((item, i) => {
    const field = `checks[${i}]`;
    if (!c.isObject(item, field)) return [];
    c.onlyKeys(item, ['id', 'nominal', 'y'], field);
    const y = c.numbers(item.y, `${field}.y`);
    if (y && y.length === 0) c.add(`${field}.y`, 'empty', `${field} has no responses`);
    return [
      {
        id: c.text(item.id, `${field}.id`) ?? '',
        nominal: c.positive(item.nominal, `${field}.nominal`) ?? NaN,
        y: y ?? [],
      },
    ];
  });
}

function parseRecovery(c: Collector, value: unknown): RecoveryItem[] | undefined {
  if (value === undefined) return undefined;
  if (!c.isArray(value, 'recovery')) return undefined;
  return value.flatMap((item, i) => {
    const field = `recovery[${i}]`;
    if (!c.isObject(item, field)) return [];
    c.onlyKeys(item, ['id', 'level', 'added', 'found', 'native', 'excluded'], field);
    const recovery: RecoveryItem = {
      id: c.text(item.id, `${field}.id`) ?? '',
      added: c.positive(item.added, `${field}.added`) ?? NaN,
      found: c.number(item.found, `${field}.found`) ?? NaN,
    };
    if (item.level !== undefined) recovery.level = c.text(item.level, `${field}.level`);
    if (item.native !== undefined) recovery.native = c.number(item.native, `${field}.native`);
    const excluded = parseExclusion(c, item.excluded, field);
    if (excluded) recovery.excluded = excluded;
    return [recovery];
  });
}

function parsePrecision(c: Collector, value: unknown): PrecisionResult[] | undefined {
  if (value === undefined) return undefined;
  if (!c.isArray(value, 'precision')) return undefined;
  return value.flatMap((item, i) => {
    const field = `precision[${i}]`;
    if (!c.isObject(item, field)) return [];
    c.onlyKeys(item, ['group', 'value', 'excluded'], field);
    const group = typeof item.group === 'number' ? String(item.group) : c.text(item.group, `${field}.group`);
    const result: PrecisionResult = { group: group ?? '', value: c.number(item.value, `${field}.value`) ?? NaN };
    const excluded = parseExclusion(c, item.excluded, field);
    if (excluded) result.excluded = excluded;
    return [result];
  });
}

/** One entry of a low-level spike list: a value as such, or `{ value, excluded }` (`nullable`: a blank without a number). */
function parseLowSpikeEntry(c: Collector, item: unknown, field: string, nullable: boolean): MdlBlank {
  const value = (v: unknown, at: string) => (nullable && v === null ? null : (c.number(v, at) ?? (nullable ? null : NaN)));
  if (typeof item !== 'object' || item === null || Array.isArray(item)) return value(item, field);
  c.onlyKeys(item as Json, ['value', 'excluded'], field);
  const entry: MdlBlankResult = { value: value((item as Json).value, `${field}.value`) };
  const excluded = parseExclusion(c, (item as Json).excluded, field);
  if (excluded) entry.excluded = excluded;
  return entry;
}

function parseLowSpikes(c: Collector, value: unknown): LowSpikes | undefined {
  if (value === undefined) return undefined;
  if (!c.isObject(value, 'lowSpikes')) return undefined;
  c.onlyKeys(value, ['spiked', 'blanks'], 'lowSpikes');
  const spiked = c.isArray(value.spiked, 'lowSpikes.spiked')
    ? value.spiked.map((s, i) => parseLowSpikeEntry(c, s, `lowSpikes.spiked[${i}]`, false) as Spike)
    : [];
  const result: LowSpikes = { spiked };
  if (value.blanks !== undefined && c.isArray(value.blanks, 'lowSpikes.blanks')) {
    result.blanks = value.blanks.map((b, i) => parseLowSpikeEntry(c, b, `lowSpikes.blanks[${i}]`, true));
  }
  return result;
}

function parseCriteria(c: Collector, value: unknown): Criterion[] | undefined {
  if (value === undefined) return undefined;
  if (!c.isArray(value, 'criteria')) return undefined;
  return value.flatMap((item, i) => {
    const field = `criteria[${i}]`;
    if (!c.isObject(item, field)) return [];
    c.onlyKeys(item, ['figure', 'op', 'value'], field);
    const figure = c.text(item.figure, `${field}.figure`) ?? '';
    const op = c.oneOf<CriterionOp>(item.op, CRITERION_OPS, `${field}.op`, '>=');
    if (item.op === undefined) c.add(`${field}.op`, 'required', `${field}.op is required`);
    let threshold: number | [number, number] = NaN;
    if (op === 'between') {
      const pair = c.numbers(item.value, `${field}.value`);
      if (pair && pair.length !== 2) c.add(`${field}.value`, 'invalid_value', `${field}.value must be [low, high]`);
      else if (pair && pair[0] > pair[1]) c.add(`${field}.value`, 'invalid_value', `${field}.value low exceeds high`);
      else if (pair) threshold = [pair[0], pair[1]];
    } else {
      threshold = c.number(item.value, `${field}.value`) ?? NaN;
    }
    return [{ figure, op, value: threshold }];
  });
}

/** Model requirements that need only the study's shape (the fit itself checks the rest). */
function checkModelRequirements(c: Collector, study: Study): void {
  if (!study.standards) {
    if (study.unknowns?.length) c.add('standards', 'required', 'unknowns can only be read off a calibration: standards are missing');
    if (study.checks?.length) c.add('standards', 'required', 'check standards need a calibration: standards are missing');
    return;
  }
  const used = study.standards.filter((s) => !s.excluded && Number.isFinite(s.x) && Number.isFinite(s.y));
  const levels = new Set(used.map((s) => s.x));
  const n = used.length;
  switch (study.model) {
    case 'one-point':
      if (n < 1) c.add('standards', 'too_few', 'a one-point calibration needs one standard');
      else if (levels.size > 1) {
        c.add('standards', 'too_many_levels', 'a one-point calibration takes one standard level (replicates allowed)');
      } else if (used[0].x <= 0) {
        c.add('standards', 'not_positive', 'the one-point standard must have a concentration above zero');
      }
      break;
    case 'two-point':
      if (n < 2) c.add('standards', 'too_few', 'a two-point calibration needs two standards');
      else if (levels.size < 2) c.add('standards', 'all_x_equal', 'the two standards of a two-point calibration have the same x');
      else if (levels.size > 2 && !study.twoPoint?.bracketing) {
        c.add(
          'standards',
          'too_many_levels',
          'a two-point calibration takes two standard levels; set twoPoint.bracketing to read unknowns between adjacent levels',
        );
      }
      break;
    case 'linear':
    case 'linear-through-origin':
      if (n < 3) c.add('standards', 'too_few', `regression statistics need at least 3 standards (${n} given)`);
      else if (levels.size < 2) c.add('standards', 'all_x_equal', 'all standards have the same x');
      break;
    case 'quadratic':
      if (n < 4) c.add('standards', 'too_few', `a quadratic calibration needs at least 4 standards (${n} given)`);
      else if (levels.size < 3) c.add('standards', 'too_few_levels', 'a quadratic calibration needs at least 3 distinct x');
      break;
  }
  if (study.weighting !== 'none') {
    if (study.model !== 'linear' && study.model !== 'quadratic') {
      c.add('weighting', 'incompatible', `weighting ${study.weighting} applies only to the linear and quadratic models`);
    }
    study.standards.forEach((s, i) => {
      if (s.excluded) return;
      if (study.weighting === '1/s2') {
        if (s.sd === undefined) c.add(`standards[${i}].sd`, 'required', 'weighting 1/s2 needs the SD of every standard');
      } else if (s.x <= 0) {
        c.add(`standards[${i}].x`, 'not_positive', `weighting ${study.weighting} needs every standard above zero`);
      }
    });
  }
}

/** Checks the structure, types and finiteness of a study and fills in the defaults. */
export function parseStudy(input: unknown): Study {
  const c = new Collector();
  if (!c.isObject(input, 'study')) throw new StudyValidationError(c.errors);
  for (const key of Object.keys(input)) {
    if (!TOP_LEVEL_KEYS.has(key)) c.add(key, 'unknown_field', `${key} is not a study field`);
  }
  const study: Study = {
    model: c.oneOf(input.model, MODELS, 'model', 'linear'),
    weighting: c.oneOf(input.weighting, WEIGHTINGS, 'weighting', 'none'),
    confidence: 0.95,
    alpha: 0.05,
  };
  if (input.standards !== undefined) study.standards = parseStandards(c, input.standards);
  const units = parseUnits(c, input.units);
  if (units) study.units = units;
  if (input.confidence !== undefined) {
    const v = c.number(input.confidence, 'confidence');
    if (v !== undefined && (v <= 0.5 || v >= 1)) c.add('confidence', 'out_of_range', 'confidence must lie between 0.5 and 1');
    else if (v !== undefined) study.confidence = v;
  }
  if (input.alpha !== undefined) {
    const v = c.number(input.alpha, 'alpha');
    if (v !== undefined && (v <= 0 || v >= 0.5)) c.add('alpha', 'out_of_range', 'alpha must lie between 0 and 0.5');
    else if (v !== undefined) study.alpha = v;
  }
  if (input.twoPoint !== undefined && c.isObject(input.twoPoint, 'twoPoint')) {
    c.onlyKeys(input.twoPoint, ['bracketing'], 'twoPoint');
    if (typeof input.twoPoint.bracketing !== 'boolean') {
      c.add('twoPoint.bracketing', 'not_boolean', 'twoPoint.bracketing must be true or false');
    } else study.twoPoint = { bracketing: input.twoPoint.bracketing };
  }
  if (input.blanks !== undefined) study.blanks = parseBlanks(c, input.blanks);
  const optional = {
    unknowns: parseUnknowns(c, input.unknowns),
    checks: parseChecks(c, input.checks),
    recovery: parseRecovery(c, input.recovery),
    precision: parsePrecision(c, input.precision),
    lowSpikes: parseLowSpikes(c, input.lowSpikes),
    criteria: parseCriteria(c, input.criteria),
  };
  for (const [key, value] of Object.entries(optional)) {
    if (value !== undefined) Object.assign(study, { [key]: value });
  }
  if (input.massFraction !== undefined) {
    const v = c.positive(input.massFraction, 'massFraction');
    if (v !== undefined && v > 1) c.add('massFraction', 'out_of_range', 'massFraction is a fraction: at most 1 (1 mg/kg = 1e-6)');
    else if (v !== undefined) study.massFraction = v;
  }
  parseUncertaintySections(c, input, study);
  if (c.errors.length === 0) checkModelRequirements(c, study);
  if (c.errors.length > 0) throw new StudyValidationError(c.errors);
  return study;
}
