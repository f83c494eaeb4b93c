import { evaluateStudy } from '@meritline/shared';
import { describe, expect, it } from 'vitest';
import { expectRel, loadJson } from './helpers.js';

describe('Recovery (recovery_examples.json: synthetic numbers, recomputed with scipy)', () => {
  const ref = loadJson('recovery_examples.json');

  it('spike recovery: %R, mean, SD, 95 % interval and t-test against 100 %', () => {
    const ex = ref.spike_recovery;
    const recovery = evaluateStudy({
      recovery: ex.c_spiked.map((found: number, i: number) => ({
        id: `S${i + 1}`,
        level: 'mid',
        added: ex.c_added,
        found,
        native: ex.c_unspiked,
      })),
    }).recovery!;
    recovery.items.forEach((item, i) => expectRel(item.pct, ex.recoveries_pct[i], 1e-12, `item ${i + 1}`));
    const g = recovery.overall;
    expect(g.n).toBe(ex.n);
    expectRel(g.meanPct, ex.mean_recovery_pct, 1e-12, 'mean');
    expectRel(g.sdPct, ex.sd_recovery_pct, 1e-12, 'SD');
    expectRel(g.t, ex.t_statistic, 1e-11, 't');
    expectRel(g.p, ex.p_value_two_sided, 1e-9, 'p');
    expectRel(g.ci![0], ex.CI95_mean_recovery_pct[0], 1e-12, 'CI low');
    expectRel(g.ci![1], ex.CI95_mean_recovery_pct[1], 1e-12, 'CI high');
    expect(g.significant).toBe(ex['significant_bias_at_0.05']);
    expect(recovery.byLevel[0]).toEqual({ ...g, level: 'mid' });
  });

  it('CRM trueness as recovery against the certified value: recovery % and one-sample t', () => {
    const ex = ref.crm_trueness;
    const g = evaluateStudy({
      recovery: ex.results.map((found: number, i: number) => ({ id: `CRM${i + 1}`, added: ex.c_CRM, found })),
    }).recovery!.overall;
    expectRel(g.meanPct, ex.recovery_pct, 1e-12, 'recovery %');
    expectRel(g.t, ex.t_one_sample, 1e-11, 't');
    expect(g.significant).toBe(ex.bias_significant_t_test);
  });
});

describe('Outlier tests (outlier_tests_examples.json)', () => {
  const ref = loadJson('outlier_tests_examples.json');
  const flagsFor = (blanks: number[]) => evaluateStudy({ blanks }).outliers!.filter((f) => f.set === 'blanks');

  it('Grubbs and Dixon on the synthetic set of 7: 10.45 flagged', () => {
    const g = ref.grubbs_example_synthetic;
    const flags = flagsFor(g.data);
    const grubbs = flags.find((f) => f.test === 'grubbs')!;
    expectRel(grubbs.statistic, g.G, 1e-12, 'G');
    expectRel(grubbs.critical, g.G_crit_two_sided_0_05, 1e-12, 'G crit');
    expect(grubbs.value).toBe(g.suspect_value);
    expect(grubbs.outlier).toBe(true);
    const d = ref.dixon_example_synthetic;
    const dixon = flags.find((f) => f.test === 'dixon')!;
    expectRel(dixon.statistic, d.Q, 1e-12, 'Q');
    expect(dixon.critical).toBe(d['Q_crit_95 (Rorabacher)']);
    expect(dixon.outlier).toBe(d.outlier_at_95);
  });

  it('Miller & Miller nitrite (data and printed results from memory): 0.380 retained by both tests', () => {
    const ex = ref.dixon_example_miller_nitrite;
    const flags = flagsFor(ex.data);
    const dixon = flags.find((f) => f.test === 'dixon')!;
    expectRel(dixon.statistic, ex.Q, 1e-12, 'Q');
    expect(dixon.value).toBe(0.38);
    expect(dixon.outlier).toBe(false);
    const grubbs = flags.find((f) => f.test === 'grubbs')!;
    expectRel(grubbs.statistic, ex.grubbs.G, 1e-12, 'G');
    expectRel(grubbs.critical, ex.grubbs.G_crit_two_sided_0_05, 1e-12, 'G crit');
    expect(grubbs.outlier).toBe(false);
  });

  it("Cochran's C across 5 series of 4 (synthetic): the third series flagged", () => {
    const ex = ref.cochran_example_synthetic;
    const precision = ex.data_5_labs_x_4_replicates.flatMap((values: number[], lab: number) =>
      values.map((value) => ({ group: `lab ${lab + 1}`, value })),
    );
    const cochran = evaluateStudy({ precision }).outliers!.find((f) => f.test === 'cochran')!;
    expectRel(cochran.statistic, ex.C, 1e-12, 'C');
    expectRel(cochran.critical, ex.C_crit_0_05_formula, 1e-12, 'C crit');
    expect(cochran.index).toBe(2);
    expect(cochran.outlier).toBe(true);
  });
});
