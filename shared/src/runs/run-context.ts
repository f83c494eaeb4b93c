import type { ModelChoice, RunOptionsDto, RunQcWindow, RunSettings, ValidationBasis } from '../api/runs.js';
import type { Units } from '../study.js';
import { modelChoices, qcWindow } from './calibration-choices.js';

/** What a run's calculation takes from its method version and the version's approved validation study. */
export interface RunContext {
  basis: ValidationBasis;
  choices: ModelChoice[];
  settings: RunSettings;
  units: Units;
  /** The recovery window of QC samples of known value. */
  qcWindow: RunQcWindow;
}

interface VersionRules {
  settings: RunSettings;
  criteria: { figure: string; op: string; value: number | [number, number] }[];
}

/** The context of a run on a version whose validation gives `basis`. */
export function runContextFor(basis: ValidationBasis, version: VersionRules, units: { x: string; y: string }): RunContext {
  return {
    basis,
    choices: modelChoices(basis, version.settings, units.y),
    settings: version.settings,
    units,
    qcWindow: qcWindow(version.criteria, version.settings),
  };
}

/** The same context read back from a version's run options; null when the version has no validation to run against. */
export function runContextOf(options: RunOptionsDto): RunContext | null {
  if (!options.validation) return null;
  const { checkTolerancePct, onePointMaxInterceptPct, method } = options;
  return {
    basis: options.validation,
    choices: options.models,
    settings: { checkTolerancePct, onePointMaxInterceptPct },
    units: { x: method.xUnit, y: method.yUnit },
    qcWindow: options.qcWindow,
  };
}
