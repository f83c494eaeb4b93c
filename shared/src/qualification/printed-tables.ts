/**
 * Values printed in published tables, as printed. Taken from the project's reference files
 * (reference-checks/data/epa_mdl_t_values.csv and horwitz_horrat.json), which name the stored copies.
 */

/** US EPA, 40 CFR Part 136 Appendix B, Revision 2: one-sided 99th percentile Student t, t(n − 1, 0.99), for the MDL. */
export const EPA_MDL_T_PRINTED = {
  source: 'US EPA 40 CFR Part 136 Appendix B, Revision 2 (method detection limit), table of t(n − 1, 0.99)',
  rows: [
    { n: 7, t: '3.143' },
    { n: 8, t: '2.998' },
    { n: 9, t: '2.896' },
    { n: 10, t: '2.821' },
    { n: 11, t: '2.764' },
    { n: 16, t: '2.602' },
    { n: 21, t: '2.528' },
    { n: 26, t: '2.485' },
    { n: 31, t: '2.457' },
    { n: 61, t: '2.39' },
  ],
} as const;

/** AOAC Official Methods of Analysis (2012), Appendix F, Table D1: predicted reproducibility RSD (%) by mass fraction (Horwitz). */
export const AOAC_HORWITZ_PRINTED = {
  source: 'AOAC Official Methods of Analysis (2012), Appendix F, Table D1 (Horwitz 1980 predicted RSD of reproducibility)',
  rows: [
    { massFraction: 1, rsdPercent: '2' },
    { massFraction: 1e-2, rsdPercent: '4' },
    { massFraction: 1e-4, rsdPercent: '8' },
    { massFraction: 1e-6, rsdPercent: '16' },
    { massFraction: 1e-8, rsdPercent: '32' },
    { massFraction: 1e-9, rsdPercent: '45' },
  ],
} as const;
