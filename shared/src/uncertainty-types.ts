export type ToleranceDistribution = 'rectangular' | 'triangular';
export type MassUnit = 'µg' | 'mg' | 'g';

export interface PreparationStock {
  mass: number;
  /** Standard uncertainty of the weighing, in the mass unit. */
  uMass: number;
  massUnit: MassUnit;
  /** mL */
  volume: number;
  /** Half-width of the flask tolerance, mL. */
  volumeTolerance: number;
  volumeDistribution: ToleranceDistribution;
  /** Standard deviation of filling, mL. */
  volumeRepeatability?: number;
  /** ± temperature range, °C. */
  temperatureRange?: number;
  /** Volume expansion coefficient per °C; default 2.1e-4 (water). */
  expansionCoefficient?: number;
}

export interface PreparationStep {
  aliquot: number;
  aliquotTolerance: number;
  aliquotDistribution: ToleranceDistribution;
  volume: number;
  volumeTolerance: number;
  volumeDistribution: ToleranceDistribution;
}

export interface PreparationInput {
  /** uPurity is a standard uncertainty (mass fraction). */
  source: { purity: number; uPurity: number };
  stock: PreparationStock;
  steps?: PreparationStep[];
}

export interface BudgetEntry {
  quantity: 'purity' | 'mass' | 'volume' | 'volumeCalibration' | 'volumeRepeatability' | 'volumeTemperature';
  label: string;
  value: number;
  u: number;
  relativeU: number;
  /** |∂c/∂x|·u(x), in the concentration unit. */
  contribution: number;
}

export interface PreparationResult {
  stock: { concentration: number; u: number; relativeU: number; unit: string; budget: BudgetEntry[] };
  steps: { concentration: number; u: number; relativeU: number }[];
}

export interface BiasEstimate {
  /** Bias values (absolute or %, consistently with uReference). */
  biases: number[];
  /** Standard uncertainty of the reference value(s). */
  uReference: number;
}

export interface TopDownLevel {
  level: string;
  concentration: number;
  /** Within-laboratory reproducibility SD (intermediate precision), absolute. */
  sRw: number;
  /** Bias values at this level in %, e.g. recovery − 100. */
  biasPct: number[];
  /** Relative standard uncertainty of the reference or spike value, %. */
  uReferencePct: number;
}

export interface TopDownOptions {
  coverageFactor?: number;
  /** At and above this concentration U is stated relative, below it absolute. */
  relativeAbove?: number;
}

export interface TopDownLevelResult {
  level: string;
  concentration: number;
  uRw: number;
  uRwPct: number;
  rmsBiasPct: number;
  uBias: number;
  uBiasPct: number;
  uc: number;
  ucPct: number;
  U: number;
  UPct: number;
  expressedAs: 'absolute' | 'relative';
}

export interface UncertaintyResult {
  coverageFactor: number;
  relativeAbove: number | null;
  byLevel: TopDownLevelResult[];
  /** Largest absolute U among the levels stated absolute; null when none. */
  absolute: { U: number; uc: number; below: number | null } | null;
  /** Largest relative U (%) among the levels stated relative; null when none. */
  relative: { UPct: number; ucPct: number; from: number | null } | null;
}

export interface ReferenceMaterialInput {
  certified: number;
  /** Standard uncertainty of the certified value (U/k from the certificate). */
  uCertified: number;
  results: number[];
}

export interface TruenessResult {
  n: number;
  mean: number;
  sd: number;
  certified: number;
  uCertified: number;
  difference: number;
  differencePct: number;
  uDifference: number;
  UDifference: number;
  significant: boolean;
  conclusion: string;
}

export interface AccuracyItem {
  level: string;
  series: string;
  nominal: number;
  found: number;
}

export interface AccuracyProfileOptions {
  /** β of the β-expectation tolerance interval; default 0.8. */
  beta?: number;
  /** Acceptance limits ±λ in %; default 10. */
  lambda?: number;
}

export interface AccuracyProfileLevel {
  level: string;
  nominal: number;
  series: number;
  replicates: number;
  n: number;
  mean: number;
  bias: number;
  biasPct: number;
  recoveryPct: number;
  sr: number;
  sBetween: number;
  sI: number;
  rsdRPct: number;
  rsdIPct: number;
  R: number;
  B: number;
  nu: number;
  k: number;
  lower: number;
  upper: number;
  lowerPct: number;
  upperPct: number;
  within: boolean;
}

export interface AccuracyProfileResult {
  beta: number;
  lambda: number;
  levels: AccuracyProfileLevel[];
  /** Lower limit of quantitation (linear interpolation between levels); null when no level is within. */
  validFrom: number | null;
  validTo: number | null;
}

export interface UncertaintyStudyOptions {
  coverageFactor?: number;
  relativeAbove?: number;
  /** Relative standard uncertainty (%) of the nominal or spiked values, for u(bias); default 0. */
  uReferencePct?: number;
}
