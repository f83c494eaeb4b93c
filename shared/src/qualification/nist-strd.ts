/**
 * Certified values of the NIST/ITL Statistical Reference Datasets (StRD), stated here as NIST publishes them
 * (15 significant digits, as strings so no digit is lost), with the input data of each set. Taken from the
 * project's reference files in reference-checks/data, which name the stored copies they were read from.
 *
 * Linear least squares: https://www.itl.nist.gov/div898/strd/lls/lls.shtml (Norris, Pontius, NoInt1, NoInt2).
 * Analysis of variance: https://www.itl.nist.gov/div898/strd/anova/anova.html (SiRstv, AtmWtAg).
 */

export interface RegressionReference {
  name: string;
  source: string;
  model: 'linear' | 'quadratic' | 'linear-through-origin';
  x: readonly number[];
  y: readonly number[];
  certified: {
    parameters: Record<string, { estimate: string; sd: string }>;
    residualSd: string;
    rSquared: string;
    anova: { regression: { df: number; ss: string; ms: string; F: string }; residual: { df: number; ss: string; ms: string } };
  };
}

export interface AnovaReference {
  name: string;
  source: string;
  group: readonly number[];
  value: readonly number[];
  certified: {
    between: { df: number; ss: string; ms: string; F: string };
    within: { df: number; ss: string; ms: string };
    rSquared: string;
    residualSd: string;
  };
}

export const NORRIS: RegressionReference = {
  name: 'Norris',
  source: 'NIST StRD linear regression \u201cNorris\u201d (certified values; Norris, J., NIST, Calibration of Ozone Monitors)',
  model: 'linear',
  x: [
    0.2, 337.4, 118.2, 884.6, 10.1, 226.5, 666.3, 996.3, 448.6, 777.0, 558.2, 0.4, 0.6, 775.5, 666.9, 338.0, 447.5, 11.6, 556.0, 228.1,
    995.8, 887.6, 120.2, 0.3, 0.3, 556.8, 339.1, 887.2, 999.0, 779.0, 11.1, 118.3, 229.2, 669.1, 448.9, 0.5,
  ],
  y: [
    0.1, 338.8, 118.1, 888.0, 9.2, 228.1, 668.5, 998.5, 449.1, 778.9, 559.2, 0.3, 0.1, 778.1, 668.8, 339.3, 448.9, 10.8, 557.7, 228.3,
    998.0, 888.8, 119.6, 0.3, 0.6, 557.6, 339.3, 888.0, 998.5, 778.9, 10.2, 117.6, 228.9, 668.4, 449.2, 0.2,
  ],
  certified: {
    parameters: {
      B0: { estimate: '-0.262323073774029', sd: '0.232818234301152' },
      B1: { estimate: '1.00211681802045', sd: '0.429796848199937E-03' },
    },
    residualSd: '0.884796396144373',
    rSquared: '0.999993745883712',
    anova: {
      regression: { df: 1, ss: '4255954.13232369', ms: '4255954.13232369', F: '5436385.54079785' },
      residual: { df: 34, ss: '26.6173985294224', ms: '0.782864662630069' },
    },
  },
};

export const PONTIUS: RegressionReference = {
  name: 'Pontius',
  source: 'NIST StRD linear regression \u201cPontius\u201d (certified values; Pontius, P., NIST, load cell calibration)',
  model: 'quadratic',
  x: [
    150000.0, 300000.0, 450000.0, 600000.0, 750000.0, 900000.0, 1050000.0, 1200000.0, 1350000.0, 1500000.0, 1650000.0, 1800000.0, 1950000.0,
    2100000.0, 2250000.0, 2400000.0, 2550000.0, 2700000.0, 2850000.0, 3000000.0, 150000.0, 300000.0, 450000.0, 600000.0, 750000.0, 900000.0,
    1050000.0, 1200000.0, 1350000.0, 1500000.0, 1650000.0, 1800000.0, 1950000.0, 2100000.0, 2250000.0, 2400000.0, 2550000.0, 2700000.0,
    2850000.0, 3000000.0,
  ],
  y: [
    0.11019, 0.21956, 0.32949, 0.43899, 0.54803, 0.65694, 0.76562, 0.87487, 0.98292, 1.09146, 1.20001, 1.30822, 1.41599, 1.52399, 1.63194,
    1.73947, 1.84646, 1.95392, 2.06128, 2.16844, 0.11052, 0.22018, 0.32939, 0.43886, 0.54798, 0.65739, 0.76596, 0.87474, 0.983, 1.0915,
    1.20004, 1.30818, 1.41613, 1.52408, 1.63159, 1.73965, 1.84696, 1.95445, 2.06177, 2.16829,
  ],
  certified: {
    parameters: {
      B0: { estimate: '0.673565789473684E-03', sd: '0.107938612033077E-03' },
      B1: { estimate: '0.732059160401003E-06', sd: '0.157817399981659E-09' },
      B2: { estimate: '-0.316081871345029E-14', sd: '0.486652849992036E-16' },
    },
    residualSd: '0.205177424076185E-03',
    rSquared: '0.999999900178537',
    anova: {
      regression: { df: 2, ss: '15.6040343244198', ms: '7.80201716220991', F: '185330865.995752' },
      residual: { df: 37, ss: '0.155761768796992E-05', ms: '0.420977753505385E-07' },
    },
  },
};

export const NOINT1: RegressionReference = {
  name: 'NoInt1',
  source: 'NIST StRD linear regression \u201cNoInt1\u201d (certified values; Eberhardt, K., NIST)',
  model: 'linear-through-origin',
  x: [60.0, 61.0, 62.0, 63.0, 64.0, 65.0, 66.0, 67.0, 68.0, 69.0, 70.0],
  y: [130.0, 131.0, 132.0, 133.0, 134.0, 135.0, 136.0, 137.0, 138.0, 139.0, 140.0],
  certified: {
    parameters: { B1: { estimate: '2.07438016528926', sd: '0.165289256198347E-01' } },
    residualSd: '3.56753034006338',
    rSquared: '0.999365492298663',
    anova: {
      regression: { df: 1, ss: '200457.727272727', ms: '200457.727272727', F: '15750.2500000000' },
      residual: { df: 10, ss: '127.272727272727', ms: '12.7272727272727' },
    },
  },
};

export const NOINT2: RegressionReference = {
  name: 'NoInt2',
  source: 'NIST StRD linear regression \u201cNoInt2\u201d (certified values; Eberhardt, K., NIST)',
  model: 'linear-through-origin',
  x: [4.0, 5.0, 6.0],
  y: [3.0, 4.0, 4.0],
  certified: {
    parameters: { B1: { estimate: '0.727272727272727', sd: '0.420827318078432E-01' } },
    residualSd: '0.369274472937998',
    rSquared: '0.993348115299335',
    anova: {
      regression: { df: 1, ss: '40.7272727272727', ms: '40.7272727272727', F: '298.666666666667' },
      residual: { df: 2, ss: '0.272727272727273', ms: '0.136363636363636' },
    },
  },
};

export const SIRSTV: AnovaReference = {
  name: 'SiRstv',
  source:
    'NIST StRD analysis of variance \u201cSiRstv\u201d (certified values; Ehrstein, J. and Croarkin, M. C., NIST, silicon resistivity)',
  group: [1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 3, 3, 3, 3, 3, 4, 4, 4, 4, 4, 5, 5, 5, 5, 5],
  value: [
    196.3052, 196.124, 196.189, 196.2569, 196.3403, 196.3042, 196.3825, 196.1669, 196.3257, 196.0422, 196.1303, 196.2005, 196.2889,
    196.0343, 196.1811, 196.2795, 196.1748, 196.1494, 196.1485, 195.9885, 196.2119, 196.1051, 196.185, 196.0052, 196.209,
  ],
  certified: {
    between: { df: 4, ss: '5.11462616000000E-02', ms: '1.27865654000000E-02', F: '1.18046237440255E+00' },
    within: { df: 20, ss: '2.16636560000000E-01', ms: '1.08318280000000E-02' },
    rSquared: '1.90999039051129E-01',
    residualSd: '1.04076068334656E-01',
  },
};

export const ATMWTAG: AnovaReference = {
  name: 'AtmWtAg',
  source: 'NIST StRD analysis of variance \u201cAtmWtAg\u201d (certified values; Powell, L. J. et al., NIST, atomic weight of silver)',
  group: [
    1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2,
    2, 2, 2,
  ],
  value: [
    107.8681568, 107.8681465, 107.8681572, 107.8681785, 107.8681446, 107.8681903, 107.8681526, 107.8681494, 107.8681616, 107.8681587,
    107.8681519, 107.8681486, 107.8681419, 107.8681569, 107.8681508, 107.8681672, 107.8681385, 107.8681518, 107.8681662, 107.8681424,
    107.868136, 107.8681333, 107.868161, 107.8681477, 107.8681079, 107.8681344, 107.8681513, 107.8681197, 107.8681604, 107.8681385,
    107.8681642, 107.8681365, 107.8681151, 107.8681082, 107.8681517, 107.8681448, 107.8681198, 107.8681482, 107.8681334, 107.8681609,
    107.8681101, 107.8681512, 107.8681469, 107.868136, 107.8681254, 107.8681261, 107.868145, 107.8681368,
  ],
  certified: {
    between: { df: 1, ss: '3.63834187500000E-09', ms: '3.63834187500000E-09', F: '1.59467335677930E+01' },
    within: { df: 46, ss: '1.04951729166667E-08', ms: '2.28155932971014E-10' },
    rSquared: '2.57426544538321E-01',
    residualSd: '1.51048314446410E-05',
  },
};
