import {
  blankValue,
  formatLevel,
  formatNumber,
  lowSpikeExclusion,
  mdlBlankValue,
  NOT_DETECTED_WORDS,
  spikeValue,
  type StudyInput,
} from '@meritline/shared';
import { Heading, Stack, Text } from '@chakra-ui/react';
import { useMemo } from 'react';
import { DataTable, dataTableColumns } from '@/components/data-table';
import { MODEL_LABELS, WEIGHTING_LABELS } from '@/components/study-results';

interface Row {
  id: string;
  cells: (string | number | null | undefined)[];
}

function section(title: string, headers: string[], rows: Row[], alignEnd: boolean[]) {
  const column = dataTableColumns<Row>();
  const columns = column.columns(
    headers.map((header, index) =>
      column.display({
        id: `c${index}`,
        header,
        meta: { align: alignEnd[index] ? 'end' : 'start' },
        cell: (info) => {
          const value = info.row.original.cells[index];
          return typeof value === 'number' ? formatNumber(value, 6) : (value ?? '—');
        },
      }),
    ),
  );
  return { title, columns, rows };
}

const withUnit = (name: string, unit: string | undefined) => (unit ? `${name} (${unit})` : name);

/** The data as entered, section by section, read-only. */
export function StudyDataSections({ data, units }: { data: StudyInput; units: { x?: string; y?: string } }) {
  const sections = useMemo(
    () =>
      [
        data.standards?.length &&
          section(
            'Calibration standards',
            ['#', withUnit('Concentration', units.x), withUnit('Response', units.y), 'Excluded because'],
            data.standards.map((s, i) => ({ id: `s${i}`, cells: [i + 1, s.x, s.y, s.excluded?.reason ?? ''] })),
            [true, true, true, false],
          ),
        data.blanks?.length &&
          section(
            'Blanks',
            ['#', withUnit('Response', units.y), 'Excluded because'],
            data.blanks.map((b, i) => ({
              id: `b${i}`,
              cells: [i + 1, blankValue(b), typeof b === 'number' ? '' : (b.excluded?.reason ?? '')],
            })),
            [true, true, false],
          ),
        data.recovery?.length &&
          section(
            'Recovery',
            ['Sample', 'Level', withUnit('Added', units.x), withUnit('Found', units.x), withUnit('Native', units.x), 'Excluded because'],
            data.recovery.map((r, i) => ({
              id: `r${i}`,
              cells: [r.id, r.level ?? '', r.added, r.found, r.native ?? 0, r.excluded?.reason ?? ''],
            })),
            [false, false, true, true, true, false],
          ),
        data.precision?.length &&
          section(
            'Precision',
            ['Series', withUnit('Result', units.x), 'Excluded because'],
            data.precision.map((p, i) => ({ id: `p${i}`, cells: [p.group, p.value, p.excluded?.reason ?? ''] })),
            [false, true, false],
          ),
        data.accuracy?.length &&
          section(
            'Accuracy design',
            ['Level', 'Series', withUnit('Nominal', units.x), withUnit('Found', units.x)],
            data.accuracy.map((a, i) => ({ id: `a${i}`, cells: [a.level, a.series, a.nominal, a.found] })),
            [false, false, true, true],
          ),
        data.referenceMaterial &&
          section(
            'Reference material',
            [withUnit('Certified value', units.x), withUnit('Standard uncertainty', units.x), withUnit('Results', units.x)],
            [
              {
                id: 'rm',
                cells: [
                  data.referenceMaterial.certified,
                  data.referenceMaterial.uCertified,
                  data.referenceMaterial.results.map((v) => formatNumber(v, 6)).join('; '),
                ],
              },
            ],
            [true, true, true],
          ),
        data.unknowns?.length &&
          section(
            'Samples',
            ['Sample', withUnit('Responses', units.y), 'Dilution'],
            data.unknowns.map((u, i) => ({ id: `u${i}`, cells: [u.id, u.y.map((y) => formatNumber(y, 5)).join(', '), u.dilution ?? 1] })),
            [false, true, true],
          ),
        data.lowSpikes?.spiked.length &&
          section(
            'Low-level spikes (detection limit)',
            ['#', withUnit('Spiked result', units.x), 'Excluded because'],
            data.lowSpikes.spiked.map((v, i) => ({ id: `l${i}`, cells: [i + 1, spikeValue(v), lowSpikeExclusion(v)?.reason ?? ''] })),
            [true, true, false],
          ),
        data.lowSpikes?.blanks?.length &&
          section(
            'Method blanks (detection limit)',
            ['#', withUnit('Blank result', units.x), 'Excluded because'],
            data.lowSpikes.blanks.map((v, i) => ({
              id: `mb${i}`,
              cells: [i + 1, mdlBlankValue(v) ?? NOT_DETECTED_WORDS, lowSpikeExclusion(v)?.reason ?? ''],
            })),
            [true, true, false],
          ),
      ].filter((s): s is ReturnType<typeof section> => Boolean(s)),
    [data, units.x, units.y],
  );

  return (
    <Stack gap="8">
      <Text>
        Model: <strong>{MODEL_LABELS[data.model ?? 'linear'] ?? data.model}</strong> · Weighting:{' '}
        <strong>{WEIGHTING_LABELS[data.weighting ?? 'none'] ?? data.weighting}</strong> · Confidence level:{' '}
        <strong>{Math.round((data.confidence ?? 0.95) * 100)} %</strong>
        {data.accuracyProfile && (
          <>
            {' '}
            · Accuracy profile: β <strong>{formatLevel((data.accuracyProfile.beta ?? 0.8) * 100)} %</strong>, acceptance limits{' '}
            <strong>±{formatLevel(data.accuracyProfile.lambda ?? 10)} %</strong>
          </>
        )}
        {data.uncertainty?.coverageFactor !== undefined && (
          <>
            {' '}
            · Coverage factor <strong>k = {formatLevel(data.uncertainty.coverageFactor)}</strong>
          </>
        )}
      </Text>
      {sections.map((s) => (
        <Stack key={s.title} gap="3">
          <Heading as="h3" size="md">
            {s.title}
          </Heading>
          <DataTable label={s.title} columns={s.columns} data={s.rows} getRowId={(row) => row.id} pageSize={25} />
        </Stack>
      ))}
    </Stack>
  );
}
