export { evaluateRun, uncertaintyBasisText } from './run-calculation.js';
export { runContextFor, runContextOf, type RunContext } from './run-context.js';
export { modelChoices, qcWindow, validationBasis, type ApprovedStudy } from './calibration-choices.js';
export { slopeControlChart, MIN_RUNS_FOR_LIMITS } from './control-chart.js';
export { formatRunSignificant, runDecimalsFor } from './reported-numbers.js';
