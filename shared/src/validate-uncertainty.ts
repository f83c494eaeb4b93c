import { accuracyProfileErrors } from './engine/accuracy-profile.js';
import type { Study } from './study.js';
import type { AccuracyItem, AccuracyProfileOptions, ReferenceMaterialInput, UncertaintyStudyOptions } from './uncertainty-types.js';
type Json = Record<string, unknown>;

/** The part of the study parser's error collector these sections use. */
interface Collector {
  readonly errors: readonly unknown[];
  add(field: string, code: string, message: string): void;
  isObject(value: unknown, field: string): value is Json;
  isArray(value: unknown, field: string): value is unknown[];
  number(value: unknown, field: string): number | undefined;
  positive(value: unknown, field: string): number | undefined;
  text(value: unknown, field: string): string | undefined;
  numbers(value: unknown, field: string, minLength?: number): number[] | undefined;
  onlyKeys(value: Json, allowed: readonly string[], field: string): void;
}

export const UNCERTAINTY_KEYS = ['accuracy', 'referenceMaterial', 'uncertainty', 'accuracyProfile'] as const;

function label(c: Collector, value: unknown, field: string): string {
  return typeof value === 'number' ? String(value) : (c.text(value, field) ?? '');
}

function nonNegative(c: Collector, value: unknown, field: string): number | undefined {
  const v = c.number(value, field);
  if (v !== undefined && v < 0) {
    c.add(field, 'negative', `${field} must not be negative`);
    return undefined;
  }
  return v;
}

/** Parses the optional accuracy, reference-material and uncertainty sections into the study. */
export function parseUncertaintySections(c: Collector, input: Json, study: Study): void {
  if (input.accuracy !== undefined && c.isArray(input.accuracy, 'accuracy')) {
    study.accuracy = input.accuracy.flatMap((item, i): AccuracyItem[] => {
      const field = `accuracy[${i}]`;
      if (!c.isObject(item, field)) return [];
      c.onlyKeys(item, ['level', 'series', 'nominal', 'found'], field);
      return [
        {
          level: label(c, item.level, `${field}.level`),
          series: label(c, item.series, `${field}.series`),
          nominal: c.positive(item.nominal, `${field}.nominal`) ?? NaN,
          found: c.number(item.found, `${field}.found`) ?? NaN,
        },
      ];
    });
  }
  if (input.referenceMaterial !== undefined && c.isObject(input.referenceMaterial, 'referenceMaterial')) {
    const rm = input.referenceMaterial;
    c.onlyKeys(rm, ['certified', 'uCertified', 'results'], 'referenceMaterial');
    const results = c.numbers(rm.results, 'referenceMaterial.results', 2);
    const value: ReferenceMaterialInput = {
      certified: c.positive(rm.certified, 'referenceMaterial.certified') ?? NaN,
      uCertified: nonNegative(c, rm.uCertified, 'referenceMaterial.uCertified') ?? NaN,
      results: results ?? [],
    };
    study.referenceMaterial = value;
  }
  if (input.uncertainty !== undefined && c.isObject(input.uncertainty, 'uncertainty')) {
    const u = input.uncertainty;
    c.onlyKeys(u, ['coverageFactor', 'relativeAbove', 'uReferencePct'], 'uncertainty');
    const options: UncertaintyStudyOptions = {};
    if (u.coverageFactor !== undefined) options.coverageFactor = c.positive(u.coverageFactor, 'uncertainty.coverageFactor');
    if (u.relativeAbove !== undefined) options.relativeAbove = c.positive(u.relativeAbove, 'uncertainty.relativeAbove');
    if (u.uReferencePct !== undefined) options.uReferencePct = nonNegative(c, u.uReferencePct, 'uncertainty.uReferencePct');
    study.uncertainty = options;
  }
  if (input.accuracyProfile !== undefined && c.isObject(input.accuracyProfile, 'accuracyProfile')) {
    const p = input.accuracyProfile;
    c.onlyKeys(p, ['beta', 'lambda'], 'accuracyProfile');
    const options: AccuracyProfileOptions = {};
    if (p.beta !== undefined) options.beta = c.number(p.beta, 'accuracyProfile.beta');
    if (p.lambda !== undefined) options.lambda = c.number(p.lambda, 'accuracyProfile.lambda');
    study.accuracyProfile = options;
    if (!study.accuracy) c.add('accuracy', 'required', 'an accuracy profile needs the accuracy results');
  }
  if (study.accuracy && c.errors.length === 0) {
    for (const e of accuracyProfileErrors(study.accuracy, study.accuracyProfile)) c.add(e.field, e.code, e.message);
  }
}
