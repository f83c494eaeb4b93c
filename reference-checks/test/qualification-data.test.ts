import {
  COCHRAN_ROWS,
  DIXON_ROWS,
  F_ROWS,
  GRUBBS_ISO_ROWS,
  MILLER_FLUORESCENCE,
  MILLER_WEIGHTED,
  NCSS_TOST,
  NIST_F_TEST,
  NIST_WELCH,
  QUALIFICATION_CHECKS,
  QUAM_A1,
  QUAM_A5,
  STUDENT_T_975_ROWS,
  UCLA_TWO_SLOPES,
} from '@meritline/shared';
import { describe, expect, it } from 'vitest';
import { hasSharedReference, loadCsv, loadJson, loadSharedJson } from './helpers.js';

/** Recomputed values are stated in the list to 15 significant digits. */
const to15 = (value: unknown): unknown =>
  typeof value === 'number' || typeof value === 'string' ? Number(Number(value).toPrecision(15)) : value;
const rounded = (values: unknown[]): unknown[] => values.map((v) => (Array.isArray(v) ? rounded(v) : to15(v)));

// The self-qualification list (run by nist-strd.test.ts and by the server) states its worked examples and table rows
// in shared/src/qualification; here they are held to the reference files they were taken from.
describe('the worked examples of the list are those of the reference files', () => {
  it('covers the textbook, table, comparison and uncertainty examples', () => {
    const ids = QUALIFICATION_CHECKS.map((c) => c.id);
    expect(new Set(ids).size).toBe(ids.length);
    for (const prefix of [
      'miller-fluorescence',
      'miller-weighted',
      'student-t',
      'f',
      'grubbs',
      'dixon',
      'cochran',
      'ucla-slopes',
      'nist-f-test',
      'nist-welch',
      'ncss-tost',
      'quam-a1',
      'quam-a5',
    ]) {
      expect(ids.filter((id) => id.startsWith(`${prefix}.`)).length, prefix).toBeGreaterThanOrEqual(2);
    }
  });

  it('Miller & Miller fluorescence (calibration_miller_fluorescence.json)', () => {
    const ref = loadJson('calibration_miller_fluorescence.json');
    expect(MILLER_FLUORESCENCE.x).toEqual(ref.data.x);
    expect(MILLER_FLUORESCENCE.y).toEqual(ref.data.y);
    const c = ref.computed;
    expect(rounded(Object.values(MILLER_FLUORESCENCE.recomputed))).toEqual(
      rounded([c.slope_b, c.intercept_a, c.r, c['s_y/x'], c.s_b, c.s_a]),
    );
    expect(rounded(MILLER_FLUORESCENCE.unknowns.map((u) => [u.y0, u.m, u.x0, u.sX0]))).toEqual(
      rounded(c.inverse_prediction.map((u: Record<string, number>) => [u.y0, u.m_replicates_of_unknown, u.x0, u.s_x0])),
    );
    const book = Object.fromEntries(
      (ref.book_comparison as { quantity: string; printed_from_memory: number }[]).map((row) => [row.quantity, row.printed_from_memory]),
    );
    const p = MILLER_FLUORESCENCE.printed;
    expect([p.r, p.slope, p.intercept, p.seSlope].map(Number)).toEqual([book.r, book.b, book.a, book.s_b]);
  });

  it('Miller & Miller weighted (calibration_miller_weighted.json)', () => {
    const ref = loadJson('calibration_miller_weighted.json');
    expect([MILLER_WEIGHTED.x, MILLER_WEIGHTED.y, MILLER_WEIGHTED.s]).toEqual([ref.data.x, ref.data.y, ref.data.s]);
    const c = ref.computed;
    expect(rounded(Object.values(MILLER_WEIGHTED.recomputed))).toEqual(
      rounded([c.weighted_slope_b_w, c.weighted_intercept_a_w, c['s_(y/x)w']]),
    );
    expect(rounded(MILLER_WEIGHTED.unknowns.map((u) => [u.y0, u.x0, u.sX0]))).toEqual(
      rounded(c.inverse_prediction.map((u: Record<string, number>) => [u.y0, u.weighted_x0, u.weighted_s_x0w])),
    );
  });

  it('QUAM A1 and A5 (uncertainty_quam_a1/a5 files)', () => {
    const a1 = loadJson('uncertainty_quam_a1_cadmium_standard.json');
    const i = a1.inputs;
    expect(Object.values(QUAM_A1.inputs)).toEqual([
      i.mass_mg,
      i.u_mass_mg,
      i.purity,
      i.purity_half_width_rectangular,
      i.volume_mL,
      i.volume_half_width_triangular_mL,
      i.volume_repeatability_sd_mL,
      i.temperature_range_degC,
      i.expansion_coefficient_per_degC,
    ]);
    expect(rounded([QUAM_A1.recomputed.c, QUAM_A1.recomputed.u])).toEqual(rounded([a1.recomputed.c_mg_per_L, a1.recomputed.u_c_mg_per_L]));
    expect(QUAM_A1.printed.c).toBe(a1.printed.c_mg_per_L);
    const a5 = loadJson('uncertainty_quam_a5_cadmium_release.json');
    expect([QUAM_A5.x, QUAM_A5.y, QUAM_A5.samples]).toEqual([a5.x_mg_per_L, a5.absorbance, a5.sample_absorbances]);
    const r = a5.recomputed;
    expect(rounded(Object.values(QUAM_A5.recomputed))).toEqual(
      rounded([r.B1_slope, r.B0_intercept, r.S_residual_sd, r.u_B1, r.u_B0, r.c0_mg_per_L, r.u_c0_mg_per_L]),
    );
    expect(QUAM_A5.printed).toEqual({
      slope: a5.printed.B1,
      intercept: a5.printed.B0,
      c0: a5.printed.c0_mg_per_L,
      uC0: a5.printed.u_c0_mg_per_L,
    });
  });
});

describe('the table rows of the list are those of the reference files', () => {
  it('Student t (student_t_quantiles.csv)', () => {
    const rows = loadCsv('student_t_quantiles.csv').filter((r) => r.df !== 'inf');
    expect(STUDENT_T_975_ROWS.map((r) => [String(r.df), r.t])).toEqual(rows.map((r) => [r.df, r.two_sided_95]));
  });

  it('F (f_quantiles.csv, rows with a printed value)', () => {
    const rows = loadCsv('f_quantiles.csv').filter((r) => r.printed);
    expect(F_ROWS.map((r) => [String(r.p), String(r.df1), String(r.df2), r.F])).toEqual(rows.map((r) => [r.p, r.df1, r.df2, r.F]));
    expect(rows.find((r) => r.df1 === '18' && r.df2 === '20')?.printed).toBe('2.15');
  });

  it('Grubbs, ISO 5725-2 Table 5 (grubbs_critical_values.csv)', () => {
    const rows = loadCsv('grubbs_critical_values.csv').filter((r) => r.iso5725_2_5pct);
    expect(GRUBBS_ISO_ROWS.map((r) => [String(r.n), r.at5, r.at1])).toEqual(rows.map((r) => [r.n, r.iso5725_2_5pct, r.iso5725_2_1pct]));
  });

  it('Dixon r10, Rorabacher 1991 (dixon_q_critical_values.csv)', () => {
    const rows = loadCsv('dixon_q_critical_values.csv').filter((r) => Number(r.n) <= 10);
    expect(DIXON_ROWS.map((r) => [String(r.n), r.q])).toEqual(rows.map((r) => [r.n, r.rorabacher_95]));
  });

  it('Cochran C, duplicates and five replicates (cochran_c_critical_values.csv)', () => {
    const rows = loadCsv('cochran_c_critical_values.csv').filter((r) => r.nu === '1' || r.nu === '4');
    expect(COCHRAN_ROWS.map((r) => [String(r.alpha), String(r.nu), String(r.k), r.C])).toEqual(
      rows.map((r) => [r.alpha, r.nu, r.k_groups, r.printed]),
    );
  });
});

// The comparison examples are stated in the list itself; where the shared reference data are installed they are checked against them.
describe('the comparison examples of the list are those of the shared reference data', () => {
  it.skipIf(!hasSharedReference('compare_two_slopes_ucla_example.json'))('UCLA two slopes', () => {
    const ref = loadSharedJson('compare_two_slopes_ucla_example.json');
    expect(UCLA_TWO_SLOPES.female).toEqual(ref.data.female);
    expect(UCLA_TWO_SLOPES.male).toEqual(ref.data.male);
    const p = ref.computed.pooled_slope_test;
    const r = UCLA_TWO_SLOPES.recomputed;
    expect(rounded([r.df, r.difference, r.se, r.t, r.p])).toEqual(
      rounded([p.df, p.difference_b_male_minus_b_female, p.se_difference, p.t, p.p_two_sided]),
    );
  });

  it.skipIf(!hasSharedReference('compare_two_variances_f_test.json'))('NIST JAHANMI2 F test', () => {
    const ex = loadSharedJson('compare_two_variances_f_test.json').examples.jahanmi2_batches;
    expect([NIST_F_TEST.n1, NIST_F_TEST.sd1, NIST_F_TEST.n2, NIST_F_TEST.sd2]).toEqual([
      ex.inputs.n1,
      Number(ex.inputs.sd1),
      ex.inputs.n2,
      Number(ex.inputs.sd2),
    ]);
  });

  it.skipIf(!hasSharedReference('compare_two_means_nist_auto83b.json'))('NIST AUTO83B Welch', () => {
    const s = loadSharedJson('compare_two_means_nist_auto83b.json').published_summary_statistics;
    expect(NIST_WELCH.us).toEqual({ n: s.n1, mean: Number(s.mean1), sd: Number(s.sd1) });
    expect(NIST_WELCH.japan).toEqual({ n: s.n2, mean: Number(s.mean2), sd: Number(s.sd2) });
  });

  it.skipIf(!hasSharedReference('equivalence_tost.json'))('NCSS yields TOST', () => {
    const ex = loadSharedJson('equivalence_tost.json').examples.ncss_yield_two_sample;
    expect([NCSS_TOST.a, NCSS_TOST.b, NCSS_TOST.margin]).toEqual([ex.data.A, ex.data.B, ex.margin.theta_U]);
    for (const c of NCSS_TOST.cases) {
      const e = ex.computed[`${c.pooled ? 'pooled' : 'welch'}_alpha_${c.alpha}`];
      expect(rounded([c.se, c.df, c.pLower, c.pUpper]), c.key).toEqual(rounded([e.se, e.df, e.p_lower, e.p_upper]));
    }
  });
});
