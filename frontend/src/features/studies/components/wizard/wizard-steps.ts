export const WIZARD_STEPS = [
  { number: 1, title: 'Setup', summary: 'Method, version, title and dates' },
  { number: 2, title: 'Calibration standards', summary: 'Standards, and samples read off the line' },
  { number: 3, title: 'Blanks and low-level spikes', summary: 'For detection and quantitation limits' },
  { number: 4, title: 'Recovery', summary: 'Spiked samples: added and found' },
  { number: 5, title: 'Precision', summary: 'Repeated results in series' },
  { number: 6, title: 'Accuracy and uncertainty', summary: 'Accuracy profile, reference material, U' },
  { number: 7, title: 'Results', summary: 'Figures of merit, plots and flags' },
  { number: 8, title: 'Conclusion', summary: 'Verdict and your conclusion' },
] as const;

export const LAST_STEP = WIZARD_STEPS.length;

export function clampStep(value: string | null): number {
  const step = Number(value);
  return Number.isInteger(step) && step >= 1 && step <= LAST_STEP ? step : 1;
}
