import { formatNumber } from '@meritline/shared';
import { Grid, Heading, Stack, Text } from '@chakra-ui/react';
import { SectionEditor } from '../grid/section-editor';
import type { DataStepProps } from './calibration-step';
import { setSheet, useLowSpikeExclusion, useRowExclusion } from './exclusion';
import { FigureLine, LivePanel } from './live-panel';

const excludedNote = (rows: readonly unknown[] | undefined) => (rows?.length ? ` (${rows.length} excluded)` : '');

export function BlanksStep({ controller, live, units }: DataStepProps) {
  const { draft, server, editable, prepareImport, adopt } = controller;
  const exclusion = useRowExclusion(controller, 'blanks');
  const lowSpikeExclusion = useLowSpikeExclusion(controller);
  const d = live.result?.detection;
  const x = (v: number | null | undefined) => `${formatNumber(v, 4)} ${units.x}`;
  return (
    <Grid templateColumns={{ base: 'minmax(0, 1fr)', xl: 'minmax(0, 3fr) minmax(20rem, 2fr)' }} gap="8" alignItems="start">
      <Stack gap="10">
        <Stack gap="3">
          <Heading as="h2" size="lg">
            Blanks
          </Heading>
          <Text color="fg.muted">Responses of method blanks, in the response unit. Two or more give the blank standard deviation.</Text>
          <SectionEditor
            studyId={server.id}
            section="blanks"
            sectionName="blanks"
            units={units}
            rows={draft.data.sheets.blanks}
            onRowsChange={(rows) => setSheet(controller, 'blanks', rows)}
            readOnly={!editable}
            prepareImport={prepareImport}
            onImported={adopt}
            rowActions={exclusion.rowActions}
          />
        </Stack>
        <Stack gap="3">
          <Heading as="h2" size="md">
            Low-level spikes and method blanks for the MDL (optional)
          </Heading>
          <Text color="fg.muted">
            Results in concentration units, as for 40 CFR 136 App. B: at least seven spiked samples near the expected limit, and method
            blank results. Write ND for a blank without a numerical result. A spike or blank lost to an assignable cause can be excluded
            with a reason; the seven-sample minimum counts the results used.
          </Text>
          <SectionEditor
            studyId={server.id}
            section="lowSpikes"
            sectionName="low-level spikes"
            units={units}
            rows={draft.data.sheets.lowSpikes}
            onRowsChange={(rows) => setSheet(controller, 'lowSpikes', rows)}
            readOnly={!editable}
            prepareImport={prepareImport}
            onImported={adopt}
            rowActions={lowSpikeExclusion.rowActions}
          />
        </Stack>
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
    </Grid>
  );
}
