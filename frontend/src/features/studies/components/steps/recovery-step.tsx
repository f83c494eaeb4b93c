import { formatPercent } from '@meritline/shared';
import { Grid, Heading, Stack, Text } from '@chakra-ui/react';
import { SectionEditor } from '../grid/section-editor';
import type { DataStepProps } from './calibration-step';
import { setSheet, useRowExclusion } from './exclusion';
import { FigureLine, LivePanel } from './live-panel';

export function RecoveryStep({ controller, live, units }: DataStepProps) {
  const { draft, server, editable, prepareImport, adopt } = controller;
  const exclusion = useRowExclusion(controller, 'recovery');
  const r = live.result?.recovery;
  return (
    <Grid templateColumns={{ base: 'minmax(0, 1fr)', xl: 'minmax(0, 3fr) minmax(20rem, 2fr)' }} gap="8" alignItems="start">
      <Stack gap="3">
        <Heading as="h2" size="lg">
          Recovery
        </Heading>
        <Text color="fg.muted">
          One row per spiked sample: the amount added, the amount found and, for a sample that already contained the analyte, the native
          amount. Group spikes by level (low, mid, high) to see recovery per level.
        </Text>
        <SectionEditor
          studyId={server.id}
          section="recovery"
          sectionName="recovery spikes"
          units={units}
          rows={draft.data.sheets.recovery}
          onRowsChange={(rows) => setSheet(controller, 'recovery', rows)}
          readOnly={!editable}
          prepareImport={prepareImport}
          onImported={adopt}
          rowActions={exclusion.rowActions}
        />
      </Stack>
      <LivePanel title="Recovery as you type" live={live}>
        {r ? (
          <Stack gap="0">
            {r.byLevel.map((g) => (
              <FigureLine
                key={g.level ?? '-'}
                label={`Level ${g.level ?? '(none)'} · ${g.n} spikes`}
                value={`${formatPercent(g.meanPct)} (RSD ${formatPercent(g.rsdPct, 3)})`}
              />
            ))}
            <FigureLine
              label={`All levels · ${r.overall.n} spikes${r.excluded?.length ? ` (${r.excluded.length} excluded)` : ''}`}
              value={`${formatPercent(r.overall.meanPct)} (RSD ${formatPercent(r.overall.rsdPct, 3)})`}
            />
          </Stack>
        ) : (
          <Text fontSize="sm" color="fg.muted">
            No recovery data yet.
          </Text>
        )}
      </LivePanel>
      {exclusion.dialog}
    </Grid>
  );
}
