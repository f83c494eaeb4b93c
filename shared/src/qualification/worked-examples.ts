/**
 * Worked examples of textbooks, guides and handbooks: their data and the values the engine must reproduce, stated
 * here with their sources. Taken from the project's reference files (reference-checks/data) and from the shared
 * reference data of the installation (compare_*.json, equivalence_tost.json), which say for each value whether it
 * is printed, recomputed (numpy/scipy, R) or recalled from memory. Recomputed values are stated to 15 significant digits.
 */

export const MILLER_FLUORESCENCE = {
  source:
    'Miller & Miller, Statistics and Chemometrics for Analytical Chemistry, fluorescence calibration example (data from memory, confirmed in stored copies; values recomputed with numpy/scipy)',
  sourcePrinted:
    'Miller & Miller, Statistics and Chemometrics for Analytical Chemistry, fluorescence calibration example (printed results recalled from memory, checked at their printed precision)',
  x: [0, 2, 4, 6, 8, 10, 12],
  y: [2.1, 5.0, 9.0, 12.6, 17.3, 21.0, 24.7],
  recomputed: {
    slope: '1.93035714285714',
    intercept: '1.51785714285714',
    r: '0.99887956534852',
    sYX: '0.432847713240053',
    seSlope: '0.0409002644570064',
    seIntercept: '0.294936001359548',
  },
  /** y0, number of readings m, x0 and s_x0 (recomputed). */
  unknowns: [
    { y0: 2.9, m: 1, x0: '0.716003700277522', sX0: '0.264569770969905' },
    { y0: 13.5, m: 1, x0: '6.20721554116559', sX0: '0.239754222702991' },
    { y0: 23.0, m: 1, x0: '11.1285846438483', sX0: '0.263193259254646' },
    { y0: 13.5, m: 4, x0: '6.20721554116559', sX0: '0.140613361813757' },
    { y0: 2.9, m: 3, x0: '0.716003700277522', sX0: '0.190990027410631' },
  ],
  /** The book's rounded results that the recomputation reproduces (from memory). */
  printed: { r: '0.9989', slope: '1.93', intercept: '1.52', seSlope: '0.0409' },
} as const;

export const MILLER_WEIGHTED = {
  source:
    'Miller & Miller, Statistics and Chemometrics for Analytical Chemistry, weighted regression example (data confirmed in a stored public test file; values recomputed with numpy/scipy, w0 interpolated at x0)',
  x: [0.0, 2.0, 4.0, 6.0, 8.0, 10.0],
  y: [0.009, 0.158, 0.301, 0.472, 0.577, 0.739],
  s: [0.001, 0.004, 0.01, 0.013, 0.017, 0.022],
  recomputed: { slope: '0.0737599662370502', intercept: '0.00908390777317043', sYX: '0.00249548117670538' },
  unknowns: [
    { y0: 0.1, x0: '1.23259400546148', sX0: '0.0455893991282664' },
    { y0: 0.6, x0: '8.01133897387832', sX0: '0.269721909831317' },
  ],
} as const;

export const QUAM_A1 = {
  source:
    'Eurachem/CITAC QUAM 3rd ed. (2012), Example A1, cadmium calibration standard (inputs as in the guide, read through the MSL NZ GTC documentation; ΔT and γ from memory; results recomputed)',
  sourcePrinted: 'Eurachem/CITAC QUAM 3rd ed. (2012), Example A1, cadmium calibration standard (printed c = 1002.7 mg/L)',
  inputs: {
    mass: 100.28,
    uMass: 0.05,
    purity: 0.9999,
    purityHalfWidth: 0.0001,
    volume: 100.0,
    volumeHalfWidth: 0.1,
    volumeRepeatability: 0.02,
    temperatureRange: 4,
    expansionCoefficient: 0.00021,
  },
  recomputed: { c: '1002.69972', u: '0.835199226768439' },
  printed: { c: '1002.7' },
} as const;

export const QUAM_A5 = {
  source:
    'Eurachem/CITAC QUAM 3rd ed. (2012), Example A5, cadmium released from ceramic ware, calibration (data read through the MSL NZ GTC documentation; values recomputed)',
  sourcePrinted: 'Eurachem/CITAC QUAM 3rd ed. (2012), Example A5 as printed: B1 0.2410, B0 0.0087, c0 0.260 mg/L, u(c0) 0.018 mg/L',
  x: [0.1, 0.1, 0.1, 0.3, 0.3, 0.3, 0.5, 0.5, 0.5, 0.7, 0.7, 0.7, 0.9, 0.9, 0.9],
  y: [0.028, 0.029, 0.029, 0.084, 0.083, 0.081, 0.135, 0.131, 0.133, 0.18, 0.181, 0.183, 0.215, 0.23, 0.216],
  samples: [0.0712, 0.0716],
  recomputed: {
    slope: '0.241',
    intercept: '0.00870000000000007',
    sYX: '0.00548564560396566',
    seSlope: '0.00500768639961841',
    seIntercept: '0.00287669682368244',
    c0: '0.260165975103734',
    uC0: '0.0178446111255831',
  },
  printed: { slope: '0.2410', intercept: '0.0087', c0: '0.260', uC0: '0.018' },
} as const;

/** UCLA IDRE statistics FAQ, "How can I compare regression coefficients between two groups?" (fictional data). */
export const UCLA_TWO_SLOPES = {
  source:
    'UCLA IDRE statistical consulting FAQ, comparing regression coefficients of two groups (fictional data; pooled-slope t recomputed with scipy)',
  sourcePrinted: 'UCLA IDRE statistical consulting FAQ, comparing regression coefficients of two groups (per-group slopes printed by SAS)',
  female: { x: [56, 60, 64, 68, 72, 54, 62, 65, 65, 70], y: [117, 125, 133, 141, 149, 109, 128, 131, 131, 145] },
  male: { x: [64, 68, 72, 76, 80, 62, 69, 74, 75, 82], y: [211, 223, 235, 247, 259, 201, 228, 245, 241, 269] },
  printed: { femaleSlope: '2.095872170', maleSlope: '3.189727463' },
  recomputed: { df: 16, difference: '1.09385529287295', se: '0.167777409404318', t: '6.51968162314944', p: '7.06512706820799e-6' },
} as const;

/** NIST/SEMATECH e-Handbook 1.3.5.9, F test for equal variances (JAHANMI2 batches, summary statistics). */
export const NIST_F_TEST = {
  source: 'NIST/SEMATECH e-Handbook of Statistical Methods 1.3.5.9, F test for equality of two variances (JAHANMI2 batches), as printed',
  n1: 240,
  sd1: 65.54909,
  n2: 240,
  sd2: 61.85425,
  printed: { F: '1.123037', p: '0.3704' },
} as const;

/** NIST/SEMATECH e-Handbook 1.3.5.3, AUTO83B (US vs Japanese cars), printed summary statistics; Welch as printed by Boost.Math. */
export const NIST_WELCH = {
  source:
    'NIST/SEMATECH e-Handbook of Statistical Methods 1.3.5.3, AUTO83B printed summary statistics; Welch test as printed in the Boost.Math documentation',
  us: { n: 249, mean: 20.14458, sd: 6.4147 },
  japan: { n: 79, mean: 30.48101, sd: 6.10771 },
  printed: { df: '136.87', t: '-12.946' },
} as const;

/** Two one-sided tests on the NCSS crop-yield example, as written into the TOSTER R package tests (recomputed with scipy). */
export const NCSS_TOST = {
  source:
    'NCSS documentation, two-sample t-test for equivalence (crop yields), as encoded in the TOSTER R package tests; margin ±110, values recomputed with scipy',
  a: [452, 874, 554, 447, 356, 754, 558, 574, 664, 682, 547, 435, 245],
  b: [546, 547, 774, 465, 459, 665, 467, 365, 589, 534, 456, 651, 654, 665, 546, 537],
  margin: 110,
  cases: [
    {
      key: 'pooled-0.025',
      pooled: true,
      alpha: 0.025,
      se: '51.1142846076215',
      df: '27',
      pLower: '0.0282130405559906',
      pUpper: '0.0143586790022756',
    },
    {
      key: 'welch-0.05',
      pooled: false,
      alpha: 0.05,
      se: '53.6185468846343',
      df: '19.1690023742824',
      pLower: '0.0362792166969927',
      pUpper: '0.0200160150974038',
    },
  ],
} as const;
