import { Alert, Box, DataList, Heading, List, Stack, Text } from '@chakra-ui/react';
import type { ReactNode } from 'react';
import { formatR2, RUN_CAUTION, type RunStatus, formatNumber, type RunData, type RunResult } from '@meritline/shared';
import { ChecksTable } from './checks-table';
import { ControlsTables } from './controls-table';
import { OnePointBiasTable } from './one-point-bias';
import { ResultsTable } from './results-table';
import { RunPlot } from './run-plot';

/** The basis of the results' uncertainty in words, once per distinct basis. */
function uncertaintyBases(result: RunResult): string[] {
  return [...new Set(result.unknowns.flatMap((u) => (u.uncertainty ? [u.uncertainty.basis] : [])))];
}

function equation(result: RunResult): string {
  const c = result.calibration;
  if (!c) return '—';
  const sign = (v: number) => (v < 0 ? '−' : '+');
  const parts =
    c.intercept === 0
      ? [`y = ${formatNumber(c.slope, 5)}·x`]
      : [`y = ${formatNumber(c.intercept, 4)}`, `${sign(c.slope)} ${formatNumber(Math.abs(c.slope), 5)}·x`];
  if (c.curvature !== null) parts.push(`${sign(c.curvature)} ${formatNumber(Math.abs(c.curvature), 4)}·x²`);
  return parts.join(' ');
}

function Section({ title, children }: { title: string; children: ReactNode }) {
  return (
    <Stack as="section" gap="3">
      <Heading as="h2" size="md">
        {title}
      </Heading>
      {children}
    </Stack>
  );
}

export interface RunResultViewProps {
  status: RunStatus;
  result: RunResult;
  rejectionReasons: string[];
  data: RunData;
  units: { x: string; y: string };
  /** An unsaved preview says so in its status. */
  preview?: boolean;
}

/** Everything a run shows: acceptance, the calibration with samples projected, reported results, the one-point bias and the check standards. */
export function RunResultView({ status, result, rejectionReasons, data, units, preview = false }: RunResultViewProps) {
  const { validation, acceptance } = result;
  const range = validation.validatedRange;
  const calibration = result.calibration;
  const saved = preview ? 'would be' : 'is';
  return (
    <Stack gap="8">
      {status === 'accepted' ? (
        <Alert.Root status="success" variant="surface">
          <Alert.Indicator />
          <Alert.Content>
            <Alert.Title>The run {saved} accepted</Alert.Title>
            <Alert.Description>
              Every check standard recovered within {acceptance.low} to {acceptance.high} % of its nominal concentration
              {result.blanks?.length || result.qcSamples?.length ? '; every method blank and QC sample met its limit.' : '.'}
            </Alert.Description>
          </Alert.Content>
        </Alert.Root>
      ) : (
        <Alert.Root status="error" variant="surface">
          <Alert.Indicator />
          <Alert.Content>
            <Alert.Title>The run {saved} rejected: its results are not reportable</Alert.Title>
            <Alert.Description>
              <List.Root ps="4">
                {rejectionReasons.map((reason) => (
                  <List.Item key={reason}>{reason}</List.Item>
                ))}
              </List.Root>
            </Alert.Description>
          </Alert.Content>
        </Alert.Root>
      )}

      <Section title="Calibration">
        <DataList.Root orientation="horizontal" size="sm">
          <DataList.Item>
            <DataList.ItemLabel>Equation</DataList.ItemLabel>
            <DataList.ItemValue>
              {equation(result)} ({units.y} against {units.x})
            </DataList.ItemValue>
          </DataList.Item>
          {calibration?.r2 !== null && calibration?.r2 !== undefined && (
            <DataList.Item>
              <DataList.ItemLabel>R² and residual SD</DataList.ItemLabel>
              <DataList.ItemValue>
                {formatR2(calibration.r2)}; {formatNumber(calibration.sYX, 3)} {units.y}
              </DataList.ItemValue>
            </DataList.Item>
          )}
          <DataList.Item>
            <DataList.ItemLabel>From the validation</DataList.ItemLabel>
            <DataList.ItemValue>
              LOD {formatNumber(validation.lod, 3)} {units.x}, LOQ {formatNumber(validation.loq, 3)} {units.x}
              {range ? `, validated range ${formatNumber(range.low, 4)} to ${formatNumber(range.high, 4)} ${units.x}` : ''} (
              {validation.studyTitle})
            </DataList.ItemValue>
          </DataList.Item>
        </DataList.Root>
        <Box borderWidth="1px" borderColor="border" borderRadius="l3" bg="bg.panel" p="3">
          <RunPlot data={data} result={result} units={units} />
        </Box>
      </Section>

      <Section title="Samples">
        <ResultsTable unknowns={result.unknowns} xUnit={units.x} yUnit={units.y} confidence={result.confidence} />
        <Text fontSize="sm" color="fg.muted">
          Concentrations include the dilution factor. Limits and the validated range apply to the measured solution, before dilution.
          {calibration?.sYX === null ? ' One- and two-point calibrations have no residual spread, so their results carry no interval.' : ''}
        </Text>
        {uncertaintyBases(result).map((basis) => (
          <Text key={basis} fontSize="sm" data-testid="uncertainty-basis">
            {basis}
          </Text>
        ))}
      </Section>

      {result.onePointBias && (
        <Section title="What the one-point line costs">
          <OnePointBiasTable bias={result.onePointBias} unit={units.x} />
        </Section>
      )}

      <Section title="Check standards">
        <ChecksTable checks={result.checks} xUnit={units.x} yUnit={units.y} />
      </Section>

      {(result.blanks?.length ?? 0) + (result.qcSamples?.length ?? 0) > 0 && (
        <Section title="Method blanks and QC samples">
          <ControlsTables blanks={result.blanks ?? []} qcSamples={result.qcSamples ?? []} window={result.qcWindow} xUnit={units.x} />
        </Section>
      )}

      <Text fontSize="sm" color="fg.muted">
        {RUN_CAUTION}
      </Text>
    </Stack>
  );
}
