import { evaluateStudy } from '../evaluate.js';
import type { CalibrationResult, PrecisionResultSection } from '../result.js';
import { ENGINE_VERSION } from '../version.js';
import { halfLastDigit, workedExampleChecks } from './example-checks.js';
import { AOAC_HORWITZ_PRINTED, EPA_MDL_T_PRINTED } from './printed-tables.js';
import { studentQuantile } from '../engine/distributions.js';
import { horwitzRsd } from '../engine/precision.js';
import { ATMWTAG, NOINT1, NOINT2, NORRIS, PONTIUS, SIRSTV, type AnovaReference, type RegressionReference } from './nist-strd.js';

/** Digits of agreement are capped here: the certified values carry 15 significant digits. */
export const MAX_DIGITS = 15;

/** One published value and how the engine is asked to reproduce it. */
export interface QualificationCheckDefinition {
  /** Stable across releases, e.g. `norris.slope`. */
  id: string;
  /** The quantity in words. */
  quantity: string;
  /** The published source, named. */
  source: string;
  /** The published value, as printed. */
  expected: string;
  /** Largest difference accepted (0: exact, for counts): relative to the published value, or absolute for rounded printed tables. */
  tolerance: number;
  toleranceKind?: 'relative' | 'absolute';
  compute: () => number | null;
}

export interface QualificationCheckResult {
  id: string;
  quantity: string;
  source: string;
  expected: string;
  obtained: number | null;
  /** −log10 of the relative difference (the LRE of the StRD documentation), capped at 15; null when nothing was obtained. */
  digits: number | null;
  tolerance: number;
  toleranceKind: 'relative' | 'absolute';
  /** Digits of agreement the tolerance asks for (relative tolerances). */
  requiredDigits: number;
  pass: boolean;
}

export interface QualificationSummary {
  engineVersion: string;
  checks: QualificationCheckResult[];
  passed: number;
  failed: number;
  allPassed: boolean;
  /** The fewest digits of agreement over the certified values (printed tables are rounded, so they are left out). */
  minDigits: number | null;
}

/** NIST asks 6 digits of its sets; the engine is held to 9 (ANOVA sets shifted before summing, see the engine). */
const NINE_DIGITS = 1e-9;

const calibrationOf = (ref: RegressionReference): (() => CalibrationResult) => {
  let cached: CalibrationResult | null = null;
  return () => {
    cached ??= evaluateStudy({ model: ref.model, standards: ref.x.map((x, i) => ({ x, y: ref.y[i] })) }).calibration!;
    return cached;
  };
};

const precisionOf = (ref: AnovaReference): (() => PrecisionResultSection) => {
  let cached: PrecisionResultSection | null = null;
  return () => {
    cached ??= evaluateStudy({ precision: ref.group.map((g, i) => ({ group: `instrument ${g}`, value: ref.value[i] })) }).precision!;
    return cached;
  };
};

const PARAMETER_FIELDS = {
  B0: { estimate: 'intercept', sd: 'seIntercept', words: 'intercept' },
  B1: { estimate: 'slope', sd: 'seSlope', words: 'slope' },
  B2: { estimate: 'curvature', sd: 'seCurvature', words: 'quadratic coefficient' },
} as const;

/** A check of one StRD set: its id and words start with the set's name, and the set's certified source stands beside it. */
const checkOfSet =
  (ref: { name: string; source: string }) =>
  (
    key: string,
    quantity: string,
    expected: string | number,
    compute: () => number | null,
    tolerance = NINE_DIGITS,
  ): QualificationCheckDefinition => ({
    id: `${ref.name.toLowerCase()}.${key}`,
    quantity: `${ref.name}: ${quantity}`,
    source: ref.source,
    expected: String(expected),
    tolerance,
    compute,
  });

function regressionChecks(ref: RegressionReference): QualificationCheckDefinition[] {
  const cal = calibrationOf(ref);
  const check = checkOfSet(ref);
  const { parameters, anova } = ref.certified;
  return [
    ...Object.entries(parameters).flatMap(([name, value]) => {
      const fields = PARAMETER_FIELDS[name as keyof typeof PARAMETER_FIELDS];
      return [
        check(fields.estimate, `${fields.words} (${name})`, value.estimate, () => cal()[fields.estimate]),
        check(fields.sd, `standard deviation of the ${fields.words}`, value.sd, () => cal()[fields.sd]),
      ];
    }),
    check('residual-sd', 'residual standard deviation', ref.certified.residualSd, () => cal().sYX),
    check('r2', ref.model === 'linear-through-origin' ? 'R² (uncentred)' : 'R²', ref.certified.rSquared, () => cal().r2),
    check('df-regression', 'degrees of freedom, regression', anova.regression.df, () => cal().anova?.dfRegression ?? null, 0),
    check('df-residual', 'degrees of freedom, residual', anova.residual.df, () => cal().anova?.dfResidual ?? null, 0),
    check('ss-regression', 'sum of squares, regression', anova.regression.ss, () => cal().anova?.ssRegression ?? null),
    check('ms-regression', 'mean square, regression', anova.regression.ms, () => cal().anova?.msRegression ?? null),
    check('f', 'F statistic', anova.regression.F, () => cal().anova?.F ?? null),
    check('ss-residual', 'sum of squares, residual', anova.residual.ss, () => cal().anova?.ssResidual ?? null),
    check('ms-residual', 'mean square, residual', anova.residual.ms, () => cal().anova?.msResidual ?? null),
  ];
}

function anovaChecks(ref: AnovaReference): QualificationCheckDefinition[] {
  const result = precisionOf(ref);
  const check = checkOfSet(ref);
  const { between, within } = ref.certified;
  return [
    check('df-between', 'degrees of freedom, between groups', between.df, () => result().dfBetween, 0),
    check('df-within', 'degrees of freedom, within groups', within.df, () => result().dfWithin, 0),
    check('ss-between', 'sum of squares, between groups', between.ss, () => result().ssBetween),
    check('ms-between', 'mean square, between groups', between.ms, () => result().msBetween),
    check('f', 'F statistic', between.F, () => result().F),
    check('ss-within', 'sum of squares, within groups', within.ss, () => result().ssWithin),
    check('ms-within', 'mean square, within groups', within.ms, () => result().msWithin),
    check('residual-sd', 'residual standard deviation', ref.certified.residualSd, () => result().sR),
    check('r2', 'R²', ref.certified.rSquared, () => {
      const r = result();
      return r.ssBetween === null ? null : r.ssBetween / (r.ssBetween + r.ssWithin);
    }),
  ];
}

function printedTableChecks(): QualificationCheckDefinition[] {
  return [
    ...EPA_MDL_T_PRINTED.rows.map((row) => ({
      id: `epa-mdl.t-${row.n}`,
      quantity: `EPA MDL: t(${row.n - 1}, 0.99) for ${row.n} samples`,
      source: EPA_MDL_T_PRINTED.source,
      expected: row.t,
      tolerance: halfLastDigit(row.t),
      toleranceKind: 'absolute' as const,
      compute: () => studentQuantile(0.99, row.n - 1),
    })),
    ...AOAC_HORWITZ_PRINTED.rows.map((row) => ({
      id: `aoac-horwitz.c-${row.massFraction.toExponential(0).replace('+', '')}`,
      quantity: `Horwitz: predicted RSD of reproducibility (%) at mass fraction ${row.massFraction.toFixed(Math.max(0, -Math.floor(Math.log10(row.massFraction))))}`,
      source: AOAC_HORWITZ_PRINTED.source,
      expected: row.rsdPercent,
      tolerance: halfLastDigit(row.rsdPercent),
      toleranceKind: 'absolute' as const,
      compute: () => horwitzRsd(row.massFraction),
    })),
  ];
}

/**
 * The published checks of the calculations, defined once: the reference-checks tests and the server's
 * self-qualification run this same list through the same engine build.
 */
export const QUALIFICATION_CHECKS: readonly QualificationCheckDefinition[] = [
  ...regressionChecks(NORRIS),
  ...regressionChecks(PONTIUS),
  ...regressionChecks(NOINT1),
  ...regressionChecks(NOINT2),
  ...anovaChecks(SIRSTV),
  ...anovaChecks(ATMWTAG),
  ...printedTableChecks(),
  ...workedExampleChecks(),
];

/** Correct significant digits of `obtained` against `expected` (the StRD log relative error), capped at 15. */
export function digitsOfAgreement(obtained: number, expected: number): number {
  const difference = Math.abs(obtained - expected) / (expected === 0 ? 1 : Math.abs(expected));
  if (difference === 0) return MAX_DIGITS;
  return Math.min(MAX_DIGITS, Math.max(0, -Math.log10(difference)));
}

export function runCheck(definition: QualificationCheckDefinition): QualificationCheckResult {
  const expected = Number(definition.expected);
  let obtained: number | null;
  try {
    obtained = definition.compute();
  } catch {
    obtained = null;
  }
  const finite = obtained !== null && Number.isFinite(obtained);
  const digits = finite ? digitsOfAgreement(obtained as number, expected) : null;
  const toleranceKind = definition.toleranceKind ?? 'relative';
  const scale = toleranceKind === 'absolute' || expected === 0 ? 1 : Math.abs(expected);
  const difference = finite ? Math.abs((obtained as number) - expected) / scale : Infinity;
  return {
    id: definition.id,
    quantity: definition.quantity,
    source: definition.source,
    expected: definition.expected,
    obtained: finite ? (obtained as number) : null,
    digits,
    tolerance: definition.tolerance,
    toleranceKind,
    requiredDigits: definition.tolerance === 0 ? MAX_DIGITS : Math.round(-Math.log10(definition.tolerance)),
    pass: difference <= definition.tolerance,
  };
}

export function runQualification(checks: readonly QualificationCheckDefinition[] = QUALIFICATION_CHECKS): QualificationSummary {
  const results = checks.map(runCheck);
  const passed = results.filter((r) => r.pass).length;
  const digits = results
    .filter((r) => r.toleranceKind === 'relative' && r.tolerance > 0)
    .map((r) => r.digits)
    .filter((d): d is number => d !== null);
  return {
    engineVersion: ENGINE_VERSION,
    checks: results,
    passed,
    failed: results.length - passed,
    allPassed: passed === results.length,
    minDigits: digits.length ? Math.min(...digits) : null,
  };
}
