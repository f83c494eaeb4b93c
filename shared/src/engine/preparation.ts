import { StudyValidationError, type StudyFieldError } from '../errors.js';
import type { BudgetEntry, PreparationInput, PreparationResult, ToleranceDistribution } from '../uncertainty-types.js';

const WATER_EXPANSION = 2.1e-4;

/** Half-width a → standard uncertainty: rectangular a/√3, triangular a/√6 (GUM 4.3.7, 4.3.9; Eurachem/CITAC QUAM). */
export function toleranceToStandard(halfWidth: number, distribution: ToleranceDistribution): number {
  return halfWidth / Math.sqrt(distribution === 'triangular' ? 6 : 3);
}

function quadrature(...values: number[]): number {
  return Math.sqrt(values.reduce((s, v) => s + v * v, 0));
}

/** Field errors of a preparation input (empty when it can be computed). */
export function preparationErrors(input: PreparationInput): StudyFieldError[] {
  const errors: StudyFieldError[] = [];
  const num = (v: unknown, field: string, rule: 'positive' | 'nonNegative'): void => {
    if (typeof v !== 'number' || !Number.isFinite(v))
      errors.push({ field, code: v === undefined ? 'required' : 'not_number', message: `${field} must be a number` });
    else if (rule === 'positive' && v <= 0) errors.push({ field, code: 'not_positive', message: `${field} must be greater than zero` });
    else if (rule === 'nonNegative' && v < 0) errors.push({ field, code: 'negative', message: `${field} must not be negative` });
  };
  const dist = (v: unknown, field: string): void => {
    if (v !== 'rectangular' && v !== 'triangular')
      errors.push({ field, code: 'invalid_value', message: `${field} must be one of rectangular, triangular` });
  };
  const { source, stock, steps } = input ?? ({} as PreparationInput);
  if (!source || typeof source !== 'object') errors.push({ field: 'source', code: 'required', message: 'source must be an object' });
  else {
    if (typeof source.purity !== 'number' || !(source.purity > 0 && source.purity <= 1)) {
      errors.push({ field: 'source.purity', code: 'out_of_range', message: 'source.purity is a mass fraction: above 0 and at most 1' });
    }
    num(source.uPurity, 'source.uPurity', 'nonNegative');
  }
  if (!stock || typeof stock !== 'object') errors.push({ field: 'stock', code: 'required', message: 'stock must be an object' });
  else {
    num(stock.mass, 'stock.mass', 'positive');
    num(stock.uMass, 'stock.uMass', 'nonNegative');
    if (!['µg', 'mg', 'g'].includes(stock.massUnit))
      errors.push({ field: 'stock.massUnit', code: 'invalid_value', message: 'stock.massUnit must be one of µg, mg, g' });
    num(stock.volume, 'stock.volume', 'positive');
    num(stock.volumeTolerance, 'stock.volumeTolerance', 'nonNegative');
    dist(stock.volumeDistribution, 'stock.volumeDistribution');
    if (stock.volumeRepeatability !== undefined) num(stock.volumeRepeatability, 'stock.volumeRepeatability', 'nonNegative');
    if (stock.temperatureRange !== undefined) num(stock.temperatureRange, 'stock.temperatureRange', 'nonNegative');
    if (stock.expansionCoefficient !== undefined) num(stock.expansionCoefficient, 'stock.expansionCoefficient', 'nonNegative');
  }
  if (steps !== undefined) {
    if (!Array.isArray(steps)) errors.push({ field: 'steps', code: 'not_array', message: 'steps must be an array' });
    else
      steps.forEach((s, i) => {
        const f = `steps[${i}]`;
        num(s?.aliquot, `${f}.aliquot`, 'positive');
        num(s?.aliquotTolerance, `${f}.aliquotTolerance`, 'nonNegative');
        dist(s?.aliquotDistribution, `${f}.aliquotDistribution`);
        num(s?.volume, `${f}.volume`, 'positive');
        num(s?.volumeTolerance, `${f}.volumeTolerance`, 'nonNegative');
        dist(s?.volumeDistribution, `${f}.volumeDistribution`);
        if (typeof s?.aliquot === 'number' && typeof s?.volume === 'number' && s.aliquot > s.volume) {
          errors.push({ field: `${f}.aliquot`, code: 'out_of_range', message: `${f}.aliquot cannot exceed the final volume` });
        }
      });
  }
  return errors;
}

/**
 * Stock c = m·P/V (mass unit per litre, V in mL) and serial dilutions c_i = c_{i−1}·a_i/V_i, with
 * relative standard uncertainties combined in quadrature (GUM 5.1.6 for products and quotients).
 */
export function preparationUncertainty(input: PreparationInput): PreparationResult {
  const errors = preparationErrors(input);
  if (errors.length > 0) throw new StudyValidationError(errors);
  const { source, stock } = input;
  const concentration = (1000 * stock.mass * source.purity) / stock.volume;
  const uCal = toleranceToStandard(stock.volumeTolerance, stock.volumeDistribution);
  const uRep = stock.volumeRepeatability ?? 0;
  const uTemp = ((stock.temperatureRange ?? 0) * (stock.expansionCoefficient ?? WATER_EXPANSION) * stock.volume) / Math.sqrt(3);
  const uVolume = quadrature(uCal, uRep, uTemp);
  const entry = (quantity: BudgetEntry['quantity'], label: string, value: number, u: number): BudgetEntry => ({
    quantity,
    label,
    value,
    u,
    relativeU: u / value,
    contribution: (concentration * u) / value,
  });
  const budget: BudgetEntry[] = [
    entry('purity', 'Purity', source.purity, source.uPurity),
    entry('mass', 'Mass weighed', stock.mass, stock.uMass),
    entry('volume', 'Volume of the flask', stock.volume, uVolume),
    entry('volumeCalibration', 'Volume: flask tolerance', stock.volume, uCal),
  ];
  if (stock.volumeRepeatability !== undefined)
    budget.push(entry('volumeRepeatability', 'Volume: filling repeatability', stock.volume, uRep));
  if (stock.temperatureRange !== undefined) budget.push(entry('volumeTemperature', 'Volume: temperature', stock.volume, uTemp));
  const relativeU = quadrature(budget[0].relativeU, budget[1].relativeU, budget[2].relativeU);
  let c = concentration;
  let rel = relativeU;
  const steps = (input.steps ?? []).map((s) => {
    c = (c * s.aliquot) / s.volume;
    rel = quadrature(
      rel,
      toleranceToStandard(s.aliquotTolerance, s.aliquotDistribution) / s.aliquot,
      toleranceToStandard(s.volumeTolerance, s.volumeDistribution) / s.volume,
    );
    return { concentration: c, u: c * rel, relativeU: rel };
  });
  return {
    stock: { concentration, u: concentration * relativeU, relativeU, unit: `${stock.massUnit}/L`, budget },
    steps,
  };
}
