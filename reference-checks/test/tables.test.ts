import {
  cochranCritical,
  evaluateStudy,
  DIXON_R10_95,
  fQuantile,
  grubbsCritical,
  horwitzRsd,
  normalQuantile,
  studentQuantile,
} from '@meritline/shared';
import { describe, expect, it } from 'vitest';
import { expectAbs, expectRel, loadCsv, loadJson } from './helpers.js';

describe('Student t quantiles (student_t_quantiles.csv: scipy to 6 decimals; 3-decimal printed tables from memory)', () => {
  const rows = loadCsv('student_t_quantiles.csv').filter((r) => r.df !== 'inf');
  it.each(rows)('df $df', (row) => {
    const df = Number(row.df);
    expectAbs(studentQuantile(0.975, df), row.two_sided_95, 5.1e-7, 'two-sided 95 %');
    expectAbs(studentQuantile(0.995, df), row.two_sided_99, 5.1e-7, 'two-sided 99 %');
    expectAbs(studentQuantile(0.95, df), row.one_sided_95, 5.1e-7, 'one-sided 95 %');
    expectAbs(studentQuantile(0.99, df), row.one_sided_99, 5.1e-7, 'one-sided 99 %');
    if (row.printed_two_sided_95) expect(Number(studentQuantile(0.975, df).toFixed(3))).toBeCloseTo(Number(row.printed_two_sided_95), 3);
    if (row.printed_one_sided_99) expect(Number(studentQuantile(0.99, df).toFixed(3))).toBeCloseTo(Number(row.printed_one_sided_99), 3);
  });

  it('normal quantiles in the last row', () => {
    const inf = loadCsv('student_t_quantiles.csv').find((r) => r.df === 'inf')!;
    expectAbs(normalQuantile(0.975), inf.two_sided_95, 5.1e-7, 'z 0.975');
    expectAbs(normalQuantile(0.99), inf.one_sided_99, 5.1e-7, 'z 0.99');
  });
});

describe('EPA MDL t(n − 1, 0.99) table (40 CFR 136 App. B Rev. 2; epa_mdl_t_values.csv)', () => {
  it.each(loadCsv('epa_mdl_t_values.csv'))('n = $n', (row) => {
    const t = studentQuantile(0.99, Number(row.df));
    expectAbs(t, row['t_0.99'], 5.1e-7, 'scipy');
    if (row.printed_table) expect(Math.abs(t - Number(row.printed_table))).toBeLessThanOrEqual(5e-4 + 1e-12);
  });
});

describe('F quantiles (f_quantiles.csv: scipy to 6 decimals; F(0.95; 18, 20) = 2.15 printed in the e-Handbook)', () => {
  it.each(loadCsv('f_quantiles.csv'))('F($p; $df1, $df2)', (row) => {
    const f = fQuantile(Number(row.p), Number(row.df1), Number(row.df2));
    expectAbs(f, row.F, 5.1e-7 * Math.max(1, Number(row.F) / 10), 'scipy');
    if (row.printed) expect(Math.abs(f - Number(row.printed))).toBeLessThanOrEqual(0.051);
  });
});

describe('Grubbs critical values (grubbs_critical_values.csv; ISO 5725-2 Table 5 printed values)', () => {
  it.each(loadCsv('grubbs_critical_values.csv'))('n = $n', (row) => {
    const n = Number(row.n);
    expectAbs(grubbsCritical(n, 0.05), row['formula_two_sided_0.05'], 5.1e-6, 'two-sided 5 %');
    expectAbs(grubbsCritical(n, 0.01), row['formula_two_sided_0.01'], 5.1e-6, 'two-sided 1 %');
    // The reference file: printed ISO values agree with the formula to within 0.0008.
    if (row.iso5725_2_5pct) expectAbs(grubbsCritical(n, 0.05), row.iso5725_2_5pct, 8e-4, 'ISO 5725-2 5 %');
    if (row.iso5725_2_1pct) expectAbs(grubbsCritical(n, 0.01), row.iso5725_2_1pct, 8e-4, 'ISO 5725-2 1 %');
  });
});

describe('Dixon r10 critical values at 95 % (Rorabacher 1991, dixon_q_critical_values.csv)', () => {
  it.each(loadCsv('dixon_q_critical_values.csv').filter((r) => Number(r.n) <= 10))('n = $n', (row) => {
    expect(DIXON_R10_95[Number(row.n)]).toBe(Number(row.rorabacher_95));
    expectAbs(DIXON_R10_95[Number(row.n)], row['mc_either_end_0.95'], 3e-3, 'Monte Carlo check');
  });
});

describe("Cochran's C critical values (cochran_c_critical_values.csv: formula; classical 4-decimal table)", () => {
  it.each(loadCsv('cochran_c_critical_values.csv'))('alpha $alpha, nu $nu, k $k_groups', (row) => {
    const c = cochranCritical(Number(row.k_groups), Number(row.nu), Number(row.alpha));
    expectAbs(c, row.formula, 5.1e-6, 'formula');
    // The reference file: the printed table agrees with the formula to within 0.00022.
    expectAbs(c, row.printed, 2.3e-4, 'printed table');
  });
});

describe('Horwitz function (Horwitz 1980; AOAC OMA Appendix F 2012 Table D1, horwitz_horrat.json)', () => {
  it('HorRat examples of the reference file', () => {
    for (const ex of loadJson('horwitz_horrat.json').examples) {
      const predicted = horwitzRsd(ex.C);
      expectRel(predicted, ex.PRSD_R_pct ?? ex.PRSD_R_pct_Horwitz, 1e-12, `PRSD_R at C = ${ex.C}`);
      const observed = ex.observed_RSD_R_pct ?? ex.observed_RSD_r_pct;
      expectRel(observed / predicted, ex.HorRat_R ?? ex.HorRat_r ?? ex.HorRat_R_Horwitz, 1e-12, `HorRat at C = ${ex.C}`);
    }
  });

  it('the engine reports HorRat = RSD_I / PRSD_R for a precision study', () => {
    const precision = [1.0, 1.2, 0.9, 1.1, 1.3, 0.8].map((value, i) => ({ group: `day ${i % 2}`, value }));
    const result = evaluateStudy({ precision, massFraction: 1e-6 }).precision!;
    expectRel(result.horwitz!.predictedRsd, 16, 1e-12, 'PRSD_R at 1 mg/kg (AOAC Table D1: 16 %)');
    expectRel(result.horwitz!.horRat, result.rsdI! / 16, 1e-12, 'HorRat');
  });

  const ref = loadJson('horwitz_horrat.json');
  const table: Record<string, number | null>[] = ref.table;
  it.each(table)('C = $C_mass_fraction', (row) => {
    const rsd = horwitzRsd(row.C_mass_fraction as number);
    expectRel(rsd, row['RSD_R_pct_2^(1-0.5log10C)'] as number, 1e-12, '2^(1 − 0.5 log10 C)');
    if (row.AOAC_Table_D1_printed !== null) expect(Math.round(rsd)).toBe(row.AOAC_Table_D1_printed);
  });
});
