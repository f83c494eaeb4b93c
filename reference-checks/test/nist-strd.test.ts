import {
  AOAC_HORWITZ_PRINTED,
  ATMWTAG,
  EPA_MDL_T_PRINTED,
  evaluateStudy,
  NOINT1,
  NOINT2,
  NORRIS,
  PONTIUS,
  QUALIFICATION_CHECKS,
  runCheck,
  SIRSTV,
  type AnovaReference,
  type RegressionReference,
} from '@meritline/shared';
import { describe, expect, it } from 'vitest';
import { expectRel, loadCsv, loadJson, standards } from './helpers.js';

// The published checks are the self-qualification list of the engine (shared/src/qualification), which the server runs
// too: NIST StRD certified values (15 digits, required to at least 9, counts exactly), printed tables (EPA MDL t,
// AOAC Horwitz Table D1, ISO 5725-2 Grubbs, Rorabacher Dixon, Cochran) within their printed rounding, and the worked
// examples (Miller & Miller, QUAM A1/A5, two-sample comparisons) named in shared/src/qualification/worked-examples.ts.
describe('published values: the self-qualification list', () => {
  it.each(QUALIFICATION_CHECKS.map((check) => [check.id, check] as const))('%s', (_id, check) => {
    const result = runCheck(check);
    expect(result.obtained, `${check.quantity}: no value`).not.toBeNull();
    expect(
      result.pass,
      `${check.quantity} (${check.source}): got ${result.obtained}, expected ${check.expected}, ${result.digits?.toFixed(1)} digits`,
    ).toBe(true);
  });

  it('covers every certified value of the six sets and both printed tables', () => {
    const ids = QUALIFICATION_CHECKS.map((c) => c.id);
    expect(new Set(ids).size).toBe(ids.length);
    for (const prefix of ['norris', 'pontius', 'noint1', 'noint2', 'sirstv', 'atmwtag', 'epa-mdl', 'aoac-horwitz']) {
      expect(ids.filter((id) => id.startsWith(`${prefix}.`)).length).toBeGreaterThanOrEqual(6);
    }
  });
});

describe('the data of the list are those of the reference files', () => {
  it.each([
    ['nist_strd_norris.json', NORRIS],
    ['nist_strd_pontius.json', PONTIUS],
    ['nist_strd_noint1.json', NOINT1],
    ['nist_strd_noint2.json', NOINT2],
  ] as [string, RegressionReference][])('%s', (file, embedded) => {
    const ref = loadJson(file);
    expect(embedded.x).toEqual(ref.data.x);
    expect(embedded.y).toEqual(ref.data.y);
    const cert = ref.certified;
    expect(embedded.certified).toEqual({
      parameters: cert.parameters,
      residualSd: cert.residual_standard_deviation,
      rSquared: cert.r_squared,
      anova: cert.anova,
    });
  });

  it.each([
    ['nist_strd_anova_sirstv.json', SIRSTV],
    ['nist_strd_anova_atmwtag.json', ATMWTAG],
  ] as [string, AnovaReference][])('%s', (file, embedded) => {
    const ref = loadJson(file);
    expect(embedded.group).toEqual(ref.data.group);
    expect(embedded.value).toEqual(ref.data.value);
    const cert = ref.certified;
    expect(embedded.certified).toEqual({
      between: cert.between,
      within: cert.within,
      rSquared: cert.r_squared,
      residualSd: cert.residual_sd,
    });
  });
});

describe('the printed tables of the list are those of the reference files', () => {
  it('EPA MDL t values (epa_mdl_t_values.csv, rows confirmed from a stored copy)', () => {
    const printed = loadCsv('epa_mdl_t_values.csv').filter((row) => row.printed_source === 'stored');
    expect(EPA_MDL_T_PRINTED.rows.map((row) => [String(row.n), row.t])).toEqual(printed.map((row) => [row.n, row.printed_table]));
  });

  it('AOAC Table D1 (horwitz_horrat.json)', () => {
    const printed = (loadJson('horwitz_horrat.json').table as Record<string, number | null>[]).filter(
      (row) => row.AOAC_Table_D1_printed !== null,
    );
    expect(AOAC_HORWITZ_PRINTED.rows.map((row) => [row.massFraction, Number(row.rsdPercent)])).toEqual(
      printed.map((row) => [row.C_mass_fraction, row.AOAC_Table_D1_printed]),
    );
  });
});

describe.each(['nist_strd_noint1.json', 'nist_strd_noint2.json'])('NIST StRD %s: line through the origin', (file) => {
  it('keeps the intercept at exactly zero', () => {
    const ref = loadJson(file);
    const cal = evaluateStudy({ model: 'linear-through-origin', standards: standards(ref.data.x, ref.data.y) }).calibration!;
    expect(cal.intercept).toBe(0);
  });
});

describe('NIST StRD ANOVA SiRstv: derived precision estimates', () => {
  it('derives s_r, s_L and s_R as recomputed in the reference file (ISO 5725-2 one-way model; recomputed, not certified)', () => {
    const ref = loadJson('nist_strd_anova_sirstv.json');
    const precision = ref.data.group.map((g: number, i: number) => ({ group: `instrument ${g}`, value: ref.data.value[i] }));
    const result = evaluateStudy({ precision }).precision!;
    const derived = ref.derived_precision_estimates_not_certified;
    expectRel(result.sR, derived.s_r, 1e-9, 's_r');
    expectRel(result.sBetween, derived.s_L, 1e-9, 's_L');
    expectRel(result.sI, derived.s_R, 1e-9, 's_R');
    expectRel(result.grandMean, derived.grand_mean, 1e-12, 'grand mean');
    expectRel(result.p, derived['F_p_value (upper tail, scipy)'], 1e-9, 'p');
  });
});
