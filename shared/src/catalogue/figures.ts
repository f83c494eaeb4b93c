import type { CriterionOp, Units } from '../study.js';

/** What a figure is measured in: a percentage, the concentration unit (x), the response unit (y), or a pure number. */
export type FigureUnitKind = 'percent' | 'x' | 'y' | 'none';

export interface FigureEntry {
  /** The path into the study result that criteria name. */
  key: string;
  label: string;
  unit: FigureUnitKind;
  /** The part of the results the figure belongs to, for grouping in pickers. */
  section: string;
}

const CALIBRATION = 'Calibration';
const DETECTION = 'Detection and quantitation limits';
const RECOVERY = 'Recovery';
const PRECISION = 'Precision';
const RANGE = 'Working range (judged at every level)';
const ACCURACY_PROFILE = 'Accuracy profile';
const TRUENESS = 'Trueness against a reference material';
const UNCERTAINTY = 'Measurement uncertainty';

/** Every figure a criterion can name, with the words people read. */
export const FIGURES: readonly FigureEntry[] = [
  { key: 'calibration.slope', label: 'Slope', unit: 'none', section: CALIBRATION },
  { key: 'calibration.intercept', label: 'Intercept', unit: 'y', section: CALIBRATION },
  { key: 'calibration.r', label: 'Correlation coefficient r', unit: 'none', section: CALIBRATION },
  { key: 'calibration.r2', label: 'Coefficient of determination R²', unit: 'none', section: CALIBRATION },
  { key: 'calibration.adjR2', label: 'Adjusted R²', unit: 'none', section: CALIBRATION },
  { key: 'calibration.sYX', label: 'Residual standard deviation s(y/x)', unit: 'y', section: CALIBRATION },
  { key: 'calibration.n', label: 'Standards used', unit: 'none', section: CALIBRATION },
  { key: 'lackOfFit.p', label: 'Lack-of-fit test, p-value', unit: 'none', section: CALIBRATION },
  { key: 'lackOfFit.F', label: 'Lack-of-fit test, F', unit: 'none', section: CALIBRATION },
  { key: 'mandel.p', label: 'Mandel test, p-value', unit: 'none', section: CALIBRATION },
  { key: 'mandel.F', label: 'Mandel test, F', unit: 'none', section: CALIBRATION },
  { key: 'interceptTest.p', label: 'Intercept test, p-value', unit: 'none', section: CALIBRATION },
  { key: 'interceptTest.interceptPctOfTopResponse', label: 'Intercept as % of the top response', unit: 'percent', section: CALIBRATION },
  { key: 'homoscedasticity.p', label: 'Variance check, p-value', unit: 'none', section: CALIBRATION },
  { key: 'homoscedasticity.F', label: 'Variance check, F', unit: 'none', section: CALIBRATION },
  { key: 'detection.sdResidual.lod', label: 'LOD from the residual SD', unit: 'x', section: DETECTION },
  { key: 'detection.sdResidual.loq', label: 'LOQ from the residual SD', unit: 'x', section: DETECTION },
  { key: 'detection.sdIntercept.lod', label: 'LOD from the SD of the intercept', unit: 'x', section: DETECTION },
  { key: 'detection.sdIntercept.loq', label: 'LOQ from the SD of the intercept', unit: 'x', section: DETECTION },
  { key: 'detection.blankSd.lod', label: 'LOD from the blank SD', unit: 'x', section: DETECTION },
  { key: 'detection.blankSd.loq', label: 'LOQ from the blank SD', unit: 'x', section: DETECTION },
  { key: 'detection.iso11843.criticalX', label: 'Critical value of the net concentration (ISO 11843-2)', unit: 'x', section: DETECTION },
  { key: 'detection.iso11843.detectableX', label: 'Minimum detectable value (ISO 11843-2)', unit: 'x', section: DETECTION },
  { key: 'detection.hubauxVos.criticalX', label: 'Decision limit (Hubaux–Vos)', unit: 'x', section: DETECTION },
  { key: 'detection.hubauxVos.detectableX', label: 'Detection limit (Hubaux–Vos)', unit: 'x', section: DETECTION },
  { key: 'detection.epaMdl.mdl', label: 'Method detection limit (40 CFR 136)', unit: 'x', section: DETECTION },
  { key: 'recovery.overall.meanPct', label: 'Mean recovery, all levels', unit: 'percent', section: RECOVERY },
  { key: 'recovery.overall.rsdPct', label: 'Recovery RSD, all levels', unit: 'percent', section: RECOVERY },
  { key: 'precision.rsdR', label: 'Repeatability RSD', unit: 'percent', section: PRECISION },
  { key: 'precision.rsdI', label: 'Intermediate precision RSD', unit: 'percent', section: PRECISION },
  { key: 'precision.sR', label: 'Repeatability standard deviation', unit: 'x', section: PRECISION },
  { key: 'precision.sI', label: 'Intermediate precision standard deviation', unit: 'x', section: PRECISION },
  { key: 'precision.horwitz.horRat', label: 'HorRat', unit: 'none', section: PRECISION },
  { key: 'precision.horwitz.horRatRepeatability', label: 'HorRat (repeatability)', unit: 'none', section: PRECISION },
  { key: 'range.rePct', label: 'Back-calculated deviation at every level', unit: 'percent', section: RANGE },
  { key: 'range.rsdPct', label: 'RSD at every level', unit: 'percent', section: RANGE },
  { key: 'range.recoveryPct', label: 'Mean recovery at every level', unit: 'percent', section: RANGE },
  { key: 'accuracyProfile.validFrom', label: 'Lower limit of quantitation (accuracy profile)', unit: 'x', section: ACCURACY_PROFILE },
  { key: 'accuracyProfile.validTo', label: 'Upper limit of quantitation (accuracy profile)', unit: 'x', section: ACCURACY_PROFILE },
  {
    key: 'accuracyProfile.beta',
    label: 'β, expected proportion of results inside the tolerance limits',
    unit: 'none',
    section: ACCURACY_PROFILE,
  },
  { key: 'accuracyProfile.lambda', label: 'Acceptance limits ±λ', unit: 'percent', section: ACCURACY_PROFILE },
  { key: 'trueness.mean', label: 'Mean found on the reference material', unit: 'x', section: TRUENESS },
  { key: 'trueness.certified', label: 'Certified value', unit: 'x', section: TRUENESS },
  { key: 'trueness.difference', label: 'Difference from the certified value', unit: 'x', section: TRUENESS },
  { key: 'trueness.differencePct', label: 'Difference from the certified value, relative', unit: 'percent', section: TRUENESS },
  { key: 'trueness.uDifference', label: 'Standard uncertainty of the difference', unit: 'x', section: TRUENESS },
  { key: 'trueness.UDifference', label: 'Expanded uncertainty of the difference (k = 2)', unit: 'x', section: TRUENESS },
  { key: 'uncertainty.coverageFactor', label: 'Coverage factor k', unit: 'none', section: UNCERTAINTY },
  { key: 'uncertainty.relative.UPct', label: 'Expanded uncertainty U, relative (largest level)', unit: 'percent', section: UNCERTAINTY },
  {
    key: 'uncertainty.relative.ucPct',
    label: 'Combined standard uncertainty uc, relative (largest level)',
    unit: 'percent',
    section: UNCERTAINTY,
  },
  { key: 'uncertainty.absolute.U', label: 'Expanded uncertainty U, absolute (largest level)', unit: 'x', section: UNCERTAINTY },
  { key: 'uncertainty.absolute.uc', label: 'Combined standard uncertainty uc, absolute (largest level)', unit: 'x', section: UNCERTAINTY },
];

/** Per-level figures: the key's last part → its words and unit. */
const UNCERTAINTY_LEVEL_FIGURES: Record<string, [string, FigureUnitKind]> = {
  uRw: ['Within-laboratory reproducibility u(Rw)', 'x'],
  uRwPct: ['Within-laboratory reproducibility u(Rw), relative', 'percent'],
  uBias: ['Uncertainty of the bias u(bias)', 'x'],
  uBiasPct: ['Uncertainty of the bias u(bias), relative', 'percent'],
  uc: ['Combined standard uncertainty uc', 'x'],
  ucPct: ['Combined standard uncertainty uc, relative', 'percent'],
  U: ['Expanded uncertainty U', 'x'],
  UPct: ['Expanded uncertainty U, relative', 'percent'],
};
const PROFILE_LEVEL_FIGURES: Record<string, [string, FigureUnitKind]> = {
  biasPct: ['Relative bias', 'percent'],
  recoveryPct: ['Mean recovery', 'percent'],
  lowerPct: ['Lower β-expectation tolerance limit', 'percent'],
  upperPct: ['Upper β-expectation tolerance limit', 'percent'],
  rsdRPct: ['Repeatability RSD', 'percent'],
  rsdIPct: ['Intermediate precision RSD', 'percent'],
};

const BY_KEY = new Map(FIGURES.map((figure) => [figure.key, figure]));

/** Criteria name figures as `a.b[2]` or `a.b.2`; both mean the same place. */
export const normaliseFigure = (figure: string) => figure.replace(/\[(\w+)\]/g, '.$1');

export function findFigure(figure: string): FigureEntry | undefined {
  const path = normaliseFigure(figure);
  const known = BY_KEY.get(path);
  if (known) return known;
  const byLevel = /^recovery\.byLevel\.([^.]+)\.(meanPct|rsdPct|sdPct)$/.exec(path);
  if (byLevel) {
    const what = byLevel[2] === 'meanPct' ? 'Mean recovery' : byLevel[2] === 'rsdPct' ? 'Recovery RSD' : 'Recovery SD';
    return { key: path, label: `${what} at level ${byLevel[1]}`, unit: 'percent', section: RECOVERY };
  }
  const uncertaintyLevel = /^uncertainty\.byLevel\.([^.]+)\.(\w+)$/.exec(path);
  const uWords = uncertaintyLevel && UNCERTAINTY_LEVEL_FIGURES[uncertaintyLevel[2]];
  if (uncertaintyLevel && uWords)
    return { key: path, label: `${uWords[0]} at level ${uncertaintyLevel[1]}`, unit: uWords[1], section: UNCERTAINTY };
  const profileLevel = /^accuracyProfile\.levels\.([^.]+)\.(\w+)$/.exec(path);
  const pWords = profileLevel && PROFILE_LEVEL_FIGURES[profileLevel[2]];
  if (profileLevel && pWords)
    return { key: path, label: `${pWords[0]} at level ${profileLevel[1]} (accuracy profile)`, unit: pWords[1], section: ACCURACY_PROFILE };
  return undefined;
}

/** The figure in words; a path we have no words for is split into them rather than shown as code. */
export function figureLabel(figure: string): string {
  const known = findFigure(figure);
  if (known) return known.label;
  const words = normaliseFigure(figure)
    .split('.')
    .map((part) => part.replace(/([a-z])([A-Z])/g, '$1 $2').toLowerCase())
    .join(', ');
  return words.charAt(0).toUpperCase() + words.slice(1);
}

export function figureUnit(figure: string, units: Units = {}): string | undefined {
  const kind = findFigure(figure)?.unit;
  if (kind === 'percent') return '%';
  if (kind === 'x') return units.x;
  if (kind === 'y') return units.y;
  return undefined;
}

export const CRITERION_OP_WORDS: Record<CriterionOp, string> = {
  '>=': 'at least',
  '<=': 'at most',
  '>': 'above',
  '<': 'below',
  between: 'from … to',
  'abs<=': 'within ±',
};

/** A limit as typed: no float noise ("0.1 + 0.2"), no exponent for lab-sized numbers. */
function limitText(value: number): string {
  const rounded = Number(value.toPrecision(10));
  return Math.abs(rounded) >= 1e-4 || rounded === 0 ? String(rounded) : rounded.toExponential().replace('e', ' × 10^');
}

const withUnit = (text: string, unit?: string) => (!unit ? text : unit === '%' ? `${text} %` : `${text} ${unit}`);

/** "at least 0.995", "from 98 to 102 %", "within ±2 %". */
export function describeRequirement(op: CriterionOp, threshold: number | readonly [number, number], unit?: string): string {
  if (op === 'between') {
    const [low, high] = threshold as readonly [number, number];
    return `from ${limitText(low)} to ${withUnit(limitText(high), unit)}`;
  }
  const limit = withUnit(limitText(threshold as number), unit);
  return op === 'abs<=' ? `within ±${limit}` : `${CRITERION_OP_WORDS[op]} ${limit}`;
}

/** The criterion in words, written from its figure, comparison and limit: "Repeatability RSD at most 2 %". */
export function describeCriterion(
  criterion: { figure: string; op: CriterionOp; value: number | readonly [number, number] },
  units: Units = {},
): string {
  return `${figureLabel(criterion.figure)} ${describeRequirement(criterion.op, criterion.value, figureUnit(criterion.figure, units))}`;
}

/** Figures by section, in catalogue order, for a picker. */
export function figuresBySection(): { section: string; figures: FigureEntry[] }[] {
  const sections: { section: string; figures: FigureEntry[] }[] = [];
  for (const figure of FIGURES) {
    const group = sections.find((s) => s.section === figure.section);
    if (group) group.figures.push(figure);
    else sections.push({ section: figure.section, figures: [figure] });
  }
  return sections;
}
