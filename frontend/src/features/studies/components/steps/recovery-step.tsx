import { formatPercent } from '@meritline/shared';
import { Stack, Text } from '@chakra-ui/react';
import type { DataStepProps } from './calibration-step';
import { useRowExclusion } from './exclusion';
import { FigureLine, LivePanel } from './live-panel';
import { SheetEditor } from './sheet-editor';
import { DataStepLayout, StepSection } from './step-layout';

export function RecoveryStep({ controller, live, units }: DataStepProps) {
  const exclusion = useRowExclusion(controller, 'recovery');
  const r = live.result?.recovery;
  return (
    <DataStepLayout>
      <StepSection
        title="Recovery"
        intro="One row per spiked sample: the amount added, the amount found and, for a sample that already contained the analyte, the native amount. Group spikes by level (low, mid, high) to see recovery per level."
      >
        <SheetEditor
          controller={controller}
          section="recovery"
          sectionName="recovery spikes"
          units={units}
          rowActions={exclusion.rowActions}
        />
      </StepSection>
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
    </DataStepLayout>
  );
}
