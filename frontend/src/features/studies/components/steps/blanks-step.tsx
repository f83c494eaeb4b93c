import { formatNumber } from '@meritline/shared';
import { Stack, Text } from '@chakra-ui/react';
import type { DataStepProps } from './calibration-step';
import { useLowSpikeExclusion, useRowExclusion } from './exclusion';
import { FigureLine, LivePanel } from './live-panel';
import { SheetEditor } from './sheet-editor';
import { DataStepLayout, StepSection } from './step-layout';

const excludedNote = (rows: readonly unknown[] | undefined) => (rows?.length ? ` (${rows.length} excluded)` : '');

export function BlanksStep({ controller, live, units }: DataStepProps) {
  const exclusion = useRowExclusion(controller, 'blanks');
  const lowSpikeExclusion = useLowSpikeExclusion(controller);
  const d = live.result?.detection;
  const x = (v: number | null | undefined) => `${formatNumber(v, 4)} ${units.x}`;
  return (
    <DataStepLayout>
      <Stack gap="10">
        <StepSection
          title="Blanks"
          intro="Responses of method blanks, in the response unit. Two or more give the blank standard deviation."
        >
          <SheetEditor controller={controller} section="blanks" sectionName="blanks" units={units} rowActions={exclusion.rowActions} />
        </StepSection>
        <StepSection
          title="Low-level spikes and method blanks for the MDL (optional)"
          size="md"
          intro="Results in concentration units, as for 40 CFR 136 App. B: at least seven spiked samples near the expected limit, and method blank results. Write ND for a blank without a numerical result. A spike or blank lost to an assignable cause can be excluded with a reason; the seven-sample minimum counts the results used."
        >
          <SheetEditor
            controller={controller}
            section="lowSpikes"
            sectionName="low-level spikes"
            units={units}
            rowActions={lowSpikeExclusion.rowActions}
          />
        </StepSection>
      </Stack>
      <LivePanel title="Detection limits as you type" live={live}>
        {d ? (
          <Stack gap="0">
            {d.sdResidual && (
              <FigureLine label="LOD / LOQ from the residual SD" value={`${x(d.sdResidual.lod)} / ${x(d.sdResidual.loq)}`} />
            )}
            {d.blankSd && <FigureLine label="LOD / LOQ from the blank SD" value={`${x(d.blankSd.lod)} / ${x(d.blankSd.loq)}`} />}
            {d.blankSd && (
              <FigureLine
                label="Blanks used"
                value={`${d.blankSd.n}${d.excludedBlanks?.length ? ` (${d.excludedBlanks.length} excluded)` : ''}`}
              />
            )}
            {d.iso11843 && (
              <FigureLine label="ISO 11843-2 critical / detectable" value={`${x(d.iso11843.criticalX)} / ${x(d.iso11843.detectableX)}`} />
            )}
            {d.epaMdl && <FigureLine label="Method detection limit" value={x(d.epaMdl.mdl)} />}
            {d.epaMdl && (
              <FigureLine
                label="Spikes / blanks used for the MDL"
                value={`${d.epaMdl.nSpiked}${excludedNote(d.excludedSpikes)} / ${d.epaMdl.nBlanks}${excludedNote(d.excludedMdlBlanks)}`}
              />
            )}
          </Stack>
        ) : (
          <Text fontSize="sm" color="fg.muted">
            Detection limits need the calibration standards of step 2.
          </Text>
        )}
      </LivePanel>
      {exclusion.dialog}
      {lowSpikeExclusion.dialog}
    </DataStepLayout>
  );
}
