import { type EvaluationResult, formatNumber, pText, type UnknownFlag, withUnit } from '@meritline/shared';
import { Alert, Stack } from '@chakra-ui/react';
import { WEIGHTING_LABELS } from './format';
import { OUTLIER_TESTS } from './outliers-table';
import type { StudyResultsProps } from './types';

export interface StudyFlag {
  id: string;
  kind: 'warning' | 'info';
  title: string;
  text: string;
}

const UNKNOWN_FLAG_WORDS: Record<UnknownFlag, string> = {
  belowRange: 'lies below the lowest standard, so its result is extrapolated',
  aboveRange: 'lies above the highest standard, so its result is extrapolated; dilute and measure again',
  belowLod: 'is below the detection limit',
  belowLoq: 'is below the quantitation limit',
};

/** What a reviewer would point at, in plain words; computed from the result alone. */
export function studyFlags(result: EvaluationResult, units: StudyResultsProps['units']): StudyFlag[] {
  const flags: StudyFlag[] = [];
  const { mandel, lackOfFit, homoscedasticity, interceptTest } = result;
  if (mandel?.significant) {
    flags.push({
      id: 'curvature',
      kind: 'warning',
      title: 'Curvature',
      text: `A quadratic curve fits the standards significantly better than a straight line (Mandel test, F = ${formatNumber(mandel.F, 3)}, ${pText(mandel.p)}). Consider the quadratic model or a narrower working range.`,
    });
  }
  if (lackOfFit?.significant) {
    flags.push({
      id: 'lack-of-fit',
      kind: 'warning',
      title: 'Lack of fit',
      text: `The level means lie further from the line than the replicates scatter (F = ${formatNumber(lackOfFit.F, 3)}, ${pText(lackOfFit.p)}). The chosen model does not describe the response well over this range.`,
    });
  }
  if (homoscedasticity?.significant) {
    const recommended = homoscedasticity.recommendedWeighting;
    const inUse = result.weighting === recommended;
    flags.push({
      id: 'unequal-variances',
      kind: 'warning',
      title: 'Unequal variances',
      text: `The responses scatter more at ${formatNumber(homoscedasticity.xHigh)} than at ${formatNumber(homoscedasticity.xLow)} (F = ${formatNumber(
        homoscedasticity.F,
        3,
      )}, ${pText(homoscedasticity.p)}). Weighting ${WEIGHTING_LABELS[recommended] ?? recommended} gives the smallest back-calculated deviations${
        inUse ? ' and is the weighting in use.' : `; the study uses ${WEIGHTING_LABELS[result.weighting] ?? result.weighting}.`
      }`,
    });
  }
  if (interceptTest?.significant && result.model !== 'linear' && result.model !== 'quadratic') {
    flags.push({
      id: 'intercept',
      kind: 'warning',
      title: 'Intercept not zero',
      text: `The intercept differs from zero (${pText(interceptTest.p)}, ${formatNumber(interceptTest.interceptPctOfTopResponse, 3)} % of the top response). A calibration without an intercept biases results, most at the low end.`,
    });
  }
  const suspects = new Map<string, { set: string; value: number; tests: string[] }>();
  for (const flag of result.outliers ?? []) {
    if (!flag.outlier) continue;
    const key = `${flag.set}#${flag.index}`;
    const entry = suspects.get(key) ?? { set: flag.set, value: flag.value, tests: [] };
    entry.tests.push(OUTLIER_TESTS[flag.test] ?? flag.test);
    suspects.set(key, entry);
  }
  for (const [key, suspect] of suspects) {
    flags.push({
      id: `outlier-${key}`,
      kind: 'warning',
      title: 'Possible outlier',
      text: `${formatNumber(suspect.value, 5)} in ${suspect.set}, flagged by ${suspect.tests.join(' and by ')}. Nothing has been removed: check the record and exclude the value, with its reason, only for an assignable cause.`,
    });
  }
  const overall = result.recovery?.overall;
  if (overall?.significant) {
    flags.push({
      id: 'recovery-bias',
      kind: 'info',
      title: 'Recovery differs from 100 %',
      text: `The mean recovery of ${formatNumber(overall.meanPct, 4)} % differs significantly from 100 % (${pText(overall.p)}): the method has a bias.`,
    });
  }
  for (const unknown of result.unknowns ?? []) {
    for (const f of unknown.flags) {
      flags.push({
        id: `unknown-${unknown.id}-${f}`,
        kind: f === 'aboveRange' || f === 'belowRange' ? 'warning' : 'info',
        title: `Sample ${unknown.id}`,
        text: `${withUnit(formatNumber(unknown.x0, 4), units.x)}: the sample ${UNKNOWN_FLAG_WORDS[f]}.`,
      });
    }
  }
  return flags;
}

export function StudyFlags({ result, units }: Pick<StudyResultsProps, 'result' | 'units'>) {
  const flags = studyFlags(result, units);
  if (flags.length === 0) {
    return (
      <Alert.Root status="success" variant="subtle">
        <Alert.Indicator />
        <Alert.Title>
          Nothing to point out: the tests that the data allow found no curvature, lack of fit, unequal variances or outliers.
        </Alert.Title>
      </Alert.Root>
    );
  }
  return (
    <Stack gap="2" as="ul" listStyleType="none" aria-label="Points to check">
      {flags.map((flag) => (
        <li key={flag.id}>
          <Alert.Root status={flag.kind} variant="subtle">
            <Alert.Indicator />
            <Alert.Content>
              <Alert.Title>{flag.title}</Alert.Title>
              <Alert.Description>{flag.text}</Alert.Description>
            </Alert.Content>
          </Alert.Root>
        </li>
      ))}
    </Stack>
  );
}
