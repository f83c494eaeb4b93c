import { detectionDelta, evaluateStudy, normalQuantile } from '@meritline/shared';
import { describe, expect, it } from 'vitest';
import { expectAbs, expectRel, loadCsv, loadJson, standards } from './helpers.js';

const ref = loadJson('detection_limits.json');
const miller = loadJson('calibration_miller_fluorescence.json');
const millerStandards = standards(miller.data.x, miller.data.y);

describe('ICH Q2(R2) DL = 3.3σ/S, QL = 10σ/S (detection_limits.json)', () => {
  it('simple example: σ = 0.0025 (SD of blank responses), S = 1250', () => {
    const ex = ref.ICH_Q2.example_simple;
    const d = evaluateStudy({
      standards: standards([0, 1, 2], [0, 1250, 2500]),
      blanks: [-ex.sigma, 0, ex.sigma],
    }).detection!;
    expectRel(d.blankSd!.sigma, ex.sigma, 1e-12, 'σ');
    expectRel(d.blankSd!.lod, ex.DL, 1e-12, 'DL');
    expectRel(d.blankSd!.loq, ex.QL, 1e-12, 'QL');
  });

  it('Miller & Miller fluorescence: σ = s_y/x and σ = s_a', () => {
    const ex = ref.ICH_Q2.example_miller_fluorescence;
    const d = evaluateStudy({ standards: millerStandards }).detection!;
    expectRel(d.sdResidual!.lod, ex.DL_residual_sd, 1e-12, 'DL s_y/x');
    expectRel(d.sdResidual!.loq, ex.QL_residual_sd, 1e-12, 'QL s_y/x');
    expectRel(d.sdIntercept!.lod, ex.DL_se_intercept, 1e-12, 'DL s_a');
    expectRel(d.sdIntercept!.loq, ex.QL_se_intercept, 1e-12, 'QL s_a');
  });
});

describe('ISO 11843-2 critical and minimum detectable values (formulas from memory; example recomputed)', () => {
  it('Miller & Miller fluorescence, K = 1, ν = 5, non-central t δ', () => {
    const ex = ref.ISO_11843_2.example_miller_fluorescence_K1;
    const iso = evaluateStudy({ standards: millerStandards }).detection!.iso11843!;
    expect(iso.df).toBe(ex.nu);
    expectRel(iso.delta, ex.delta_exact_noncentral_t, 1e-12, 'δ');
    expectRel(iso.criticalResponse, ex.y_c, 1e-12, 'y_c');
    expectRel(iso.criticalX, ex.x_c, 1e-12, 'x_c');
    expectRel(iso.detectableX, ex.x_d, 1e-12, 'x_d');
  });

  it('Currie / IUPAC constants: z(0.95), and δ for ν = 9', () => {
    const c = ref.Currie_IUPAC;
    expectRel(normalQuantile(0.95), c.constants['z(0.95)'], 1e-14, 'z(0.95)');
    expectRel(2 * normalQuantile(0.95), c.constants['L_D/sigma_0'], 1e-14, 'L_D/σ0 = 3.29');
    expectRel(detectionDelta(9, 0.05, 0.05), c.example.estimated_s0_nu_9.delta_nct, 1e-12, 'δ(ν = 9)');
  });
});

describe('Hubaux & Vos (1970) decision and detection limits (procedure from memory; example recomputed)', () => {
  it('Miller & Miller fluorescence, m = 1', () => {
    const ex = ref.Hubaux_Vos.example_miller_fluorescence_m1;
    const hv = evaluateStudy({ standards: millerStandards }).detection!.hubauxVos!;
    expectRel(hv.criticalResponse, ex.y_C_decision_limit_signal, 1e-12, 'y_C');
    expectRel(hv.criticalX, ex.x_C_decision_limit_conc, 1e-12, 'x_C');
    expectRel(hv.detectableX, ex.x_D_detection_limit_conc, 1e-12, 'x_D');
  });
});

describe('EPA MDL, 40 CFR 136 App. B Rev. 2 (rules from memory; synthetic examples of the reference file)', () => {
  const epa = ref.EPA_MDL_Rev2;
  const mdlOf = (spiked: number[], blanks: (number | null)[]) => evaluateStudy({ lowSpikes: { spiked, blanks } }).detection!.epaMdl!;

  it('all blanks numeric, MDL_s governs', () => {
    const ex = epa['example_B_all_blanks_numeric (synthetic, my own numbers)'];
    const r = mdlOf(ex.spiked, ex.blanks);
    expectRel(r.mdlSpiked, ex.MDL_s, 1e-12, 'MDL_s');
    expectRel(r.mdlBlank, ex.MDL_b, 1e-12, 'MDL_b');
    expectRel(r.mdl, ex.MDL, 1e-12, 'MDL');
    expect(r.governing).toBe('spiked');
    expect(r.blankRule).toBe('mean-plus-t-sd');
  });

  it('all blanks numeric, MDL_b governs', () => {
    const ex = epa['example_B2_all_blanks_numeric_blank_governs (synthetic)'];
    const r = mdlOf(ex.spiked, ex.blanks);
    expectRel(r.mdlBlank, ex.MDL_b, 1e-12, 'MDL_b');
    expectRel(r.mdl, ex.MDL, 1e-12, 'MDL');
    expect(r.governing).toBe('blank');
  });

  it('some blanks without a numerical result: the highest blank', () => {
    const ex = epa['example_C_some_blanks_nondetect (synthetic)'];
    const r = mdlOf(epa['example_B_all_blanks_numeric (synthetic, my own numbers)'].spiked, ex['blanks (null = no numerical result)']);
    expect(r.blankRule).toBe('highest');
    expect(r.mdlBlank).toBe(ex['MDL_b = highest blank']);
    expect(r.mdl).toBe(ex.MDL);
  });

  it('negative blank mean is replaced by zero', () => {
    const ex = epa['example_D_negative_blank_mean (synthetic)'];
    const r = mdlOf([], ex.blanks);
    expectRel(r.mdlBlank, ex.MDL_b, 1e-12, 'MDL_b');
  });

  it('more than 100 blanks, some non-numeric: the result at rank round(0.99 n_b)', () => {
    const ex = epa["example_E_more_than_100_blanks (regulation's own illustration, from memory)"];
    const top: number[] = ex.highest_ranked_results_ranks_160_to_164;
    const blanks: (number | null)[] = [...Array(ex.n_blanks - top.length - 20).fill(0.5), ...Array(20).fill(null), ...top];
    const r = mdlOf([], blanks);
    expect(r.blankRule).toBe('rank');
    expect(r.mdlBlank).toBe(ex.MDL_b);
  });

  it('an excluded spiked replicate or method blank: the MDL of the rows left (common practice: an excluded result enters no figure)', () => {
    // Example B of the reference file is synthetic (no published MDL data set is stored); an eighth spiked result and
    // an eighth blank, invented and gross, are excluded, so the seven left of each are example B's own.
    const ex = epa['example_B_all_blanks_numeric (synthetic, my own numbers)'];
    const spiked = [...ex.spiked.slice(0, 3), { value: 2.4, excluded: { reason: 'spiked twice' } }, ...ex.spiked.slice(3)];
    const blanks = [{ value: 0.9, excluded: { reason: 'contaminated vial' } }, ...ex.blanks];
    const d = evaluateStudy({ lowSpikes: { spiked, blanks } }).detection!;
    expect(d.epaMdl).toEqual(mdlOf(ex.spiked, ex.blanks));
    expectRel(d.epaMdl!.mdlSpiked, ex.MDL_s, 1e-12, 'MDL_s of the seven left');
    expectRel(d.epaMdl!.mdlBlank, ex.MDL_b, 1e-12, 'MDL_b of the seven left');
    // The multiplier is t(6, 0.99) of the regulation's printed table (n = 7 kept, not n = 8 entered).
    const printed = loadCsv('epa_mdl_t_values.csv').find((row) => row.n === '7')!;
    expectAbs(d.epaMdl!.mdlSpiked! / ex.S_s, printed.printed_table, 5e-4, 't(6, 0.99), printed');
    expect(d.excludedSpikes).toEqual([{ index: 3, label: 'spike 4', value: 2.4, reason: 'spiked twice' }]);
    expect(d.excludedMdlBlanks).toEqual([{ index: 0, label: 'method blank 1', value: 0.9, reason: 'contaminated vial' }]);
  });

  it('no blank with a numerical result: MDL_b does not apply', () => {
    const r = mdlOf(epa['example_B_all_blanks_numeric (synthetic, my own numbers)'].spiked, [null, null, null]);
    expect(r.blankRule).toBe('none-numeric');
    expect(r.mdlBlank).toBeNull();
    expect(r.governing).toBe('spiked');
  });
});
