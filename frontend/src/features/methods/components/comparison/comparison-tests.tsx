import { Box, Heading, HStack, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import {
  COMPARISON_TEST_LABELS,
  type EquivalenceTest,
  type LineParameterComparison,
  type MeanComparison,
  type Unavailable,
  type VarianceComparison,
  type VersionComparisonResponse,
  formatInterval,
  formatNumber,
  pText,
} from '@meritline/shared';
import type { ReactNode } from 'react';
import { sentence } from './sentence';
import { VerdictBadge } from './verdict-badge';

type Test = LineParameterComparison | VarianceComparison | MeanComparison | EquivalenceTest | Unavailable;

const confidence = (alpha: number) => `${formatNumber(100 * (1 - alpha), 3)} %`;
const signed = (value: number, digits = 4) => `${value > 0 ? '+' : ''}${formatNumber(value, digits)}`;
/** Degrees of freedom: whole numbers as they are, Satterthwaite's to one decimal. */
const dfText = (df: number) => (Number.isInteger(df) ? String(df) : df.toFixed(1));

function TestCard({ title, test, children }: { title: string; test: Test; children?: ReactNode }) {
  return (
    <Box borderWidth="1px" borderColor="border" borderRadius="l3" bg="bg.panel" p="5" data-testid="comparison-test" aria-label={title}>
      <Stack gap="3">
        <HStack justify="space-between" align="flex-start" gap="3" wrap="wrap">
          <Heading as="h3" size="md">
            {title}
          </Heading>
          {test.available ? <VerdictBadge verdict={test.verdict} /> : <Text color="fg.muted">Not tested</Text>}
        </HStack>
        {test.available ? children : <Text color="fg.muted">{sentence(test.reason)}</Text>}
      </Stack>
    </Box>
  );
}

function Line({ label, children }: { label: string; children: ReactNode }) {
  return (
    <Text>
      <Text as="span" color="fg.muted">
        {label}:{' '}
      </Text>
      {children}
    </Text>
  );
}

/** The figure in the earlier and the later version, its unit after the later. */
function EarlierLater({ from, to, unit, children }: { from: number; to: number; unit?: string; children?: ReactNode }) {
  return (
    <Line label="Earlier → later">
      {formatNumber(from)} → {formatNumber(to)}
      {unit ? ` ${unit}` : ''}
      {children}
    </Line>
  );
}

function LineTest({ title, test, unit }: { title: string; test: LineParameterComparison | Unavailable; unit?: string }) {
  return (
    <TestCard title={title} test={test}>
      {test.available && (
        <>
          <EarlierLater from={test.from} to={test.to} unit={unit}>
            {test.changePct !== null && ` (${signed(test.changePct, 3)} % sensitivity)`}
          </EarlierLater>
          <Line label={`Difference, ${confidence(test.alpha)} interval`}>
            {signed(test.difference)} ({formatInterval(test.ci)})
          </Line>
          <Line label="Test">
            t = {formatNumber(test.t, 3)}, {test.df} degrees of freedom (pooled residual variance), {pText(test.p)}
          </Line>
        </>
      )}
    </TestCard>
  );
}

function VarianceTest({ title, test, unit }: { title: string; test: VarianceComparison | Unavailable; unit?: string }) {
  return (
    <TestCard title={title} test={test}>
      {test.available && (
        <>
          <EarlierLater from={test.from} to={test.to} unit={unit} />
          <Line label="Test">
            F = {formatNumber(test.F, 3)} ({dfText(test.df[0])} and {dfText(test.df[1])} degrees of freedom), two-sided {pText(test.p)}
          </Line>
          <Line label={`Ratio of variances, ${confidence(test.alpha)} interval`}>{formatInterval(test.ratioCi, 3)}</Line>
          {test.dfNote && <Text color="fg.muted">{sentence(test.dfNote)}</Text>}
        </>
      )}
    </TestCard>
  );
}

function RecoveryTests({ recovery, marginPct }: { recovery: VersionComparisonResponse['tests']['recovery']; marginPct: number }) {
  const { welch, tost } = recovery;
  return (
    <Box borderWidth="1px" borderColor="border" borderRadius="l3" bg="bg.panel" p="5" gridColumn={{ md: 'span 2' }}>
      <Stack gap="4">
        <HStack justify="space-between" wrap="wrap">
          <Heading as="h3" size="md">
            {COMPARISON_TEST_LABELS.recovery}
          </Heading>
          <VerdictBadge verdict={recovery.verdict} />
        </HStack>
        <SimpleGrid columns={{ base: 1, md: 2 }} gap="4">
          <TestCard title={COMPARISON_TEST_LABELS.recoveryWelch} test={welch}>
            {welch.available && (
              <>
                <Line label="Earlier → later">
                  {formatNumber(welch.from)} % → {formatNumber(welch.to)} %
                </Line>
                <Line label={`Difference, ${confidence(welch.alpha)} interval`}>
                  {signed(welch.difference, 3)} percentage points ({formatInterval(welch.ci, 3)})
                </Line>
                <Line label="Test">
                  t = {formatNumber(welch.t, 3)}, {dfText(welch.df)} degrees of freedom (Welch), {pText(welch.p)}
                </Line>
              </>
            )}
          </TestCard>
          <TestCard title={COMPARISON_TEST_LABELS.recoveryTost} test={tost}>
            {tost.available && (
              <>
                <Line label="Margin">±{formatNumber(marginPct, 3)} percentage points</Line>
                <Line label={`Difference, ${confidence(2 * tost.alpha)} interval`}>
                  {signed(tost.difference, 3)} ({formatInterval(tost.ci, 3)})
                </Line>
                <Line label="Test">
                  larger one-sided {pText(tost.p)}; equivalent when it is below α = {formatNumber(tost.alpha, 3)}, i.e. when the interval
                  lies inside the margin
                </Line>
              </>
            )}
          </TestCard>
        </SimpleGrid>
      </Stack>
    </Box>
  );
}

export function ComparisonTests({ comparison }: { comparison: VersionComparisonResponse }) {
  const { tests, method } = comparison;
  return (
    <SimpleGrid columns={{ base: 1, md: 2 }} gap="4">
      <LineTest title={COMPARISON_TEST_LABELS.slope} test={tests.slope} unit={`${method.yUnit} per ${method.xUnit}`} />
      <LineTest title={COMPARISON_TEST_LABELS.intercept} test={tests.intercept} unit={method.yUnit} />
      <VarianceTest title={COMPARISON_TEST_LABELS.residualSd} test={tests.residualSd} unit={method.yUnit} />
      <VarianceTest title={COMPARISON_TEST_LABELS.repeatability} test={tests.repeatability} unit={method.xUnit} />
      <VarianceTest title={COMPARISON_TEST_LABELS.intermediatePrecision} test={tests.intermediatePrecision} unit={method.xUnit} />
      <RecoveryTests recovery={tests.recovery} marginPct={comparison.recoveryMarginPct} />
    </SimpleGrid>
  );
}
