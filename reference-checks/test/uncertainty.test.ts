import {
  accuracyProfile,
  betaExpectationInterval,
  biasUncertainty,
  combineTopDown,
  crmBiasUncertainty,
  fitCalibration,
  predictUnknown,
  preparationUncertainty,
  toleranceToStandard,
  topDownUncertainty,
} from '@meritline/shared';
import { describe, expect, it } from 'vitest';
import { expectAbs, expectRel, loadJson, standards } from './helpers.js';

const TIGHT = 1e-9;

// Eurachem/CITAC QUAM 3rd ed., Example A1, read through the MSL NZ GTC documentation (see the data file).
describe('QUAM example A1: cadmium calibration standard', () => {
  const ref = loadJson('uncertainty_quam_a1_cadmium_standard.json');
  const i = ref.inputs;
  const result = preparationUncertainty({
    source: { purity: i.purity, uPurity: toleranceToStandard(i.purity_half_width_rectangular, 'rectangular') },
    stock: {
      mass: i.mass_mg,
      uMass: i.u_mass_mg,
      massUnit: 'mg',
      volume: i.volume_mL,
      volumeTolerance: i.volume_half_width_triangular_mL,
      volumeDistribution: 'triangular',
      volumeRepeatability: i.volume_repeatability_sd_mL,
      temperatureRange: i.temperature_range_degC,
      expansionCoefficient: i.expansion_coefficient_per_degC,
    },
  });

  it('c and u_c (recomputed, unrounded) and the printed c = 1002.7 mg/L', () => {
    expectRel(result.stock.concentration, ref.recomputed.c_mg_per_L, TIGHT, 'c');
    expectRel(result.stock.u, ref.recomputed.u_c_mg_per_L, TIGHT, 'u_c');
    expectRel(result.stock.relativeU, ref.recomputed.u_rel, TIGHT, 'u_c/c');
    expect(result.stock.concentration.toFixed(1)).toBe(ref.printed.c_mg_per_L);
    expect(result.stock.unit).toBe('mg/L');
  });

  it('every budget contribution |∂c/∂x|·u(x)', () => {
    for (const [quantity, expected] of Object.entries(ref.recomputed.contributions_mg_per_L)) {
      const entry = result.stock.budget.find((b) => b.quantity === quantity);
      expectRel(entry?.contribution, expected as number, TIGHT, quantity);
    }
    expectRel(result.stock.budget.find((b) => b.quantity === 'volume')!.u, ref.recomputed.u_V_mL, TIGHT, 'u(V)');
    expectRel(result.stock.budget.find((b) => b.quantity === 'purity')!.u, ref.recomputed.u_P, TIGHT, 'u(P)');
  });

  it("the printed u_c = 0.9 mg/L through the guide's rounding of the relative uncertainties", () => {
    const rounded = Math.hypot(0.000058, 0.0005, 0.0007) * result.stock.concentration;
    expect(rounded.toFixed(1)).toBe(ref.printed.u_c_mg_per_L);
    expect(result.stock.u.toFixed(3)).toBe('0.835');
  });
});

// Eurachem/CITAC QUAM 3rd ed., Example A5 calibration, read through the MSL NZ GTC documentation.
describe('QUAM example A5: concentration read off the calibration line', () => {
  const ref = loadJson('uncertainty_quam_a5_cadmium_release.json');
  const fit = fitCalibration(standards(ref.x_mg_per_L, ref.absorbance));
  const p = predictUnknown(fit, ref.sample_absorbances);

  it('B1, B0, S and their uncertainties (recomputed) and as printed', () => {
    expectRel(fit.calibration.slope, ref.recomputed.B1_slope, TIGHT, 'B1');
    expectRel(fit.calibration.intercept, ref.recomputed.B0_intercept, 1e-8, 'B0');
    expectRel(fit.calibration.sYX, ref.recomputed.S_residual_sd, TIGHT, 'S');
    expectRel(fit.calibration.seSlope, ref.recomputed.u_B1, TIGHT, 'u(B1)');
    expectRel(fit.calibration.seIntercept, ref.recomputed.u_B0, TIGHT, 'u(B0)');
    expect(fit.calibration.slope.toFixed(4)).toBe(ref.printed.B1);
    expect(fit.calibration.intercept.toFixed(4)).toBe(ref.printed.B0);
  });

  it('c0 and u(c0) for p = 2 readings (recomputed) and as printed', () => {
    expectRel(p.x0, ref.recomputed.c0_mg_per_L, TIGHT, 'c0');
    expectRel(p.sX0, ref.recomputed.u_c0_mg_per_L, TIGHT, 'u(c0)');
    expect(p.x0.toFixed(3)).toBe(ref.printed.c0_mg_per_L);
    expect(p.sX0!.toFixed(3)).toBe(ref.printed.u_c0_mg_per_L);
  });
});

// Mee (1984) / SFSTP accuracy profile: formula from memory, no published numbers; values recomputed (see the data file).
describe('β-expectation tolerance interval (formula from memory, recomputed values)', () => {
  const ref = loadJson('tolerance_interval_accuracy_profile.json');

  it('NIST StRD SiRstv as 5 series × 5 replicates, β = 0.95', () => {
    const sir = loadJson('nist_strd_anova_sirstv.json').data;
    const series = [1, 2, 3, 4, 5].map((g) => sir.value.filter((_: number, j: number) => sir.group[j] === g));
    const ti = betaExpectationInterval(series, 0.95);
    const e = ref.sirstv_beta_0_95;
    expectRel(ti.mean, e.mean, TIGHT, 'mean');
    expectRel(ti.msb, e.MSB, 1e-8, 'MSB');
    expectRel(ti.msw, e.MSW, 1e-8, 'MSW');
    expectRel(ti.sI, e.s_IP, 1e-8, 's_IP');
    expectRel(ti.R, e.R, 1e-7, 'R');
    expectRel(ti.B, e.B, 1e-8, 'B');
    expectRel(ti.nu, e.nu, 1e-8, 'ν');
    expectRel(ti.k, e.k, 1e-8, 'k');
    expectRel(ti.lower, e.lower, TIGHT, 'lower');
    expectRel(ti.upper, e.upper, TIGHT, 'upper');
  });

  it('synthetic 3-level profile (own numbers), β = 0.95, λ = 5 %', () => {
    const levels = ref.synthetic_profile.levels as { nominal: number; y: number[][]; [k: string]: unknown }[];
    const items = levels.flatMap((l) =>
      l.y.flatMap((s, si) => s.map((found) => ({ level: String(l.nominal), series: `s${si}`, nominal: l.nominal, found }))),
    );
    const profile = accuracyProfile(items, { beta: ref.synthetic_profile.beta, lambda: ref.synthetic_profile.lambda_pct });
    levels.forEach((e, i) => {
      const got = profile.levels[i];
      const at = `level ${e.nominal}`;
      expectRel(got.mean, e.mean as number, TIGHT, `${at} mean`);
      expectRel(got.sI, e.s_IP as number, 1e-8, `${at} s_IP`);
      expectAbs(got.R, e.R as number, 1e-8, `${at} R`);
      expectRel(got.nu, e.nu as number, 1e-8, `${at} ν`);
      expectRel(got.k, e.k as number, 1e-8, `${at} k`);
      expectAbs(got.biasPct, e.relative_bias_pct as number, 1e-8, `${at} bias %`);
      expectRel(got.lowerPct, e.rel_tolerance_lower_pct as number, 1e-8, `${at} lower %`);
      expectRel(got.upperPct, e.rel_tolerance_upper_pct as number, 1e-8, `${at} upper %`);
      expectRel(got.recoveryPct, e.recovery_pct as number, TIGHT, `${at} recovery`);
      expect(got.within, at).toBe(e.within_acceptance);
    });
    // Level 10 fails, 50 passes: the lower end is interpolated between them; 100 is the top level.
    expect(profile.validFrom!).toBeGreaterThan(10);
    expect(profile.validFrom!).toBeLessThan(50);
    expect(profile.validTo).toBe(100);
  });

  it('mean coverage of the interval is close to β (seeded simulation, 2000 draws per design)', () => {
    let seed = 20240601;
    const uniform = () => {
      seed = (seed + 0x6d2b79f5) | 0;
      let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
      t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
      return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
    };
    const normal = () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
    // Abramowitz & Stegun 7.1.26 (|error| < 1.5e-7), ample for a coverage fraction.
    const phi = (z: number) => {
      const x = Math.abs(z) / Math.SQRT2;
      const t = 1 / (1 + 0.3275911 * x);
      const erf = 1 - t * (0.254829592 + t * (-0.284496736 + t * (1.421413741 + t * (-1.453152027 + t * 1.061405429)))) * Math.exp(-x * x);
      return z >= 0 ? 0.5 * (1 + erf) : 0.5 * (1 - erf);
    };
    for (const d of ref.coverage_simulation_designs) {
      const total = Math.hypot(d.sigma_between, d.sigma_within);
      let coverage = 0;
      const draws = 2000;
      for (let n = 0; n < draws; n++) {
        const series = Array.from({ length: d.I_series }, () => {
          const b = d.sigma_between * normal();
          return Array.from({ length: d.J_replicates }, () => b + d.sigma_within * normal());
        });
        const ti = betaExpectationInterval(series, 0.95);
        coverage += phi(ti.upper / total) - phi(ti.lower / total);
      }
      expectAbs(coverage / draws, 0.95, 0.02, `I = ${d.I_series}, J = ${d.J_replicates}, σB = ${d.sigma_between}`);
    }
  });
});

// Nordtest TR 537: FORMULAS ONLY, from memory; the numbers are synthetic (own construction), not published values.
describe('top-down uncertainty (Nordtest TR 537 formulas from memory, synthetic numbers)', () => {
  const ref = loadJson('uncertainty_top_down_nordtest_formulas.json');

  it('proficiency-testing route, relative %', () => {
    const pt = ref.pt_route_relative_pct;
    const uBias = biasUncertainty({ biases: pt.pt_bias_pct, uReference: pt.u_Cref_mean_pct });
    expectRel(uBias, pt.u_bias_pct, TIGHT, 'u(bias)');
    const { uc, U } = combineTopDown(pt.u_Rw_pct, uBias);
    expectRel(uc, pt.u_c_pct, TIGHT, 'u_c');
    expectRel(U, pt.U_k2_pct, TIGHT, 'U');
  });

  it('single reference material route, absolute', () => {
    const crm = ref.single_crm_route_absolute;
    // A set of n results with the stated mean and SD.
    const half = crm.sd * Math.sqrt((crm.n - 1) / crm.n);
    const results = Array.from({ length: crm.n }, (_, i) => crm.mean + (i % 2 === 0 ? half : -half));
    const uBias = crmBiasUncertainty(results, crm.C_ref, crm.U_Cref / crm.k_cert);
    expectRel(uBias, crm.u_bias, TIGHT, 'u(bias)');
    expectRel(combineTopDown(crm.u_Rw_abs, uBias).U, crm.U_k2, TIGHT, 'U');
  });

  it('recovery route, relative %, through the per-level function', () => {
    const rec = ref.recovery_route_pct;
    const r = topDownUncertainty([
      {
        level: 'all',
        concentration: 100,
        sRw: 0,
        biasPct: rec.recoveries_pct.map((x: number) => x - 100),
        uReferencePct: Math.hypot(rec.u_conc_pct, rec.u_vol_pct),
      },
    ]);
    expectRel(r.byLevel[0].rmsBiasPct, rec.RMS_bias_pct, TIGHT, 'RMS bias');
    expectRel(r.byLevel[0].uBiasPct, rec.u_bias_pct, TIGHT, 'u(bias)');
  });
});
