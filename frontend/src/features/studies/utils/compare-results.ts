import { figureValue, type EvaluationResult } from '@meritline/shared';

/** Figures whose agreement shows that the browser and the server computed the same study. */
const KEY_FIGURES: { figure: string; name: string }[] = [
  { figure: 'calibration.slope', name: 'slope' },
  { figure: 'calibration.intercept', name: 'intercept' },
  { figure: 'calibration.r2', name: 'R²' },
  { figure: 'calibration.sYX', name: 's(y/x)' },
  { figure: 'detection.sdResidual.lod', name: 'LOD' },
  { figure: 'recovery.overall.meanPct', name: 'mean recovery' },
  { figure: 'precision.rsdR', name: 'repeatability RSD' },
  { figure: 'precision.rsdI', name: 'intermediate precision RSD' },
  { figure: 'accuracyProfile.validFrom', name: 'lower limit of quantitation' },
  { figure: 'accuracyProfile.validTo', name: 'upper limit of quantitation' },
  { figure: 'uncertainty.relative.UPct', name: 'expanded uncertainty' },
  { figure: 'trueness.difference', name: 'difference from the certified value' },
];

const close = (a: number | null, b: number | null) =>
  a === null || b === null ? a === b : Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b));

/** Names of the key figures and verdicts on which two results differ; empty when they agree. */
export function resultDifferences(browser: EvaluationResult | null, server: EvaluationResult | null): string[] {
  if (!browser || !server) return browser === server ? [] : ['the whole result'];
  const differences = KEY_FIGURES.filter(({ figure }) => !close(figureValue(browser, figure), figureValue(server, figure))).map(
    ({ name }) => name,
  );
  const verdicts =
    browser.verdict.criteria.length === server.verdict.criteria.length &&
    browser.verdict.criteria.every((c, i) => c.pass === server.verdict.criteria[i].pass);
  if (!verdicts || browser.verdict.pass !== server.verdict.pass) differences.push('verdict');
  return differences;
}
