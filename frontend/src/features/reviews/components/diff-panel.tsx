import { Badge, Box, Heading, Stack, Table, Text } from '@chakra-ui/react';
import { formatDateTime, formatNumber, STUDY_META_WORDS, STUDY_SECTION_WORDS, type StudyInput } from '@meritline/shared';
import type { StudyDiff } from '../api/review-types';

const FIELD_NAMES: Record<string, string> = {
  x: 'Concentration',
  y: 'Response',
  excluded: 'Excluded',
  model: 'Calibration model',
  weighting: 'Weighting',
  confidence: 'Confidence level',
  alpha: 'False-positive rate (α)',
  units: 'Units',
  massFraction: 'Mass fraction',
};

function show(value: unknown): string {
  if (value === null || value === undefined) return '—';
  if (typeof value === 'object') {
    const reason = (value as { reason?: unknown }).reason;
    if (typeof reason === 'string') return `yes: ${reason}`;
    return Object.entries(value as Record<string, unknown>)
      .map(([key, v]) => `${FIELD_NAMES[key] ?? key} ${show(v)}`)
      .join(', ');
  }
  return String(value);
}

/** A row by position, with the standard's concentration where that tells the reader which one it is. */
function rowLabeller(data: StudyInput, unit: string | undefined) {
  return (section: string, key: string) => {
    if (!key.startsWith('#')) return key;
    const standard = section === 'standards' ? data.standards?.[Number(key.slice(1)) - 1] : undefined;
    return standard ? `Row ${key.slice(1)} (${formatNumber(standard.x, 4)}${unit ? ` ${unit}` : ''})` : `Row ${key.slice(1)}`;
  };
}

/** What the author changed between the last two submissions. */
export function DiffPanel({ diff, data, unit }: { diff: StudyDiff | null; data: StudyInput; unit?: string }) {
  const rowLabel = rowLabeller(data, unit);
  if (!diff) return <Text color="fg.muted">This study has been submitted once; there is nothing to compare yet.</Text>;
  const rows = [
    ...(diff.meta ?? []).map((m) => ({
      where: 'Record',
      what: STUDY_META_WORDS[m.field] ?? m.field,
      kind: 'changed',
      from: show(m.from),
      to: show(m.to),
    })),
    ...diff.settings.map((s) => ({
      where: 'Settings',
      what: FIELD_NAMES[s.field] ?? s.field,
      kind: 'changed',
      from: show(s.from),
      to: show(s.to),
    })),
    ...diff.sections.flatMap((section) => {
      const where = STUDY_SECTION_WORDS[section.section] ?? section.section;
      return [
        ...section.changed.map((c) => ({
          where,
          what: `${rowLabel(section.section, c.key)}: ${FIELD_NAMES[c.field] ?? c.field}`,
          kind: 'changed',
          from: show(c.from),
          to: show(c.to),
        })),
        ...section.added.map((a) => ({ where, what: rowLabel(section.section, a.key), kind: 'added', from: '—', to: show(a.row) })),
        ...section.removed.map((r) => ({ where, what: rowLabel(section.section, r.key), kind: 'removed', from: show(r.row), to: '—' })),
      ];
    }),
  ];
  return (
    <Stack gap="4">
      <Heading as="h3" size="md">
        Changes between the submissions of {formatDateTime(diff.from.signedAt)} and {formatDateTime(diff.to.signedAt)}
      </Heading>
      {rows.length === 0 ? (
        <Text color="fg.muted">The study was resubmitted unchanged.</Text>
      ) : (
        <Box borderWidth="1px" borderRadius="l3" overflow="hidden">
          <Table.ScrollArea position="relative">
            <Table.Root size="sm" aria-label="Changes between submissions">
              <Table.Header>
                <Table.Row bg="bg.subtle">
                  <Table.ColumnHeader>Section</Table.ColumnHeader>
                  <Table.ColumnHeader>What</Table.ColumnHeader>
                  <Table.ColumnHeader>Change</Table.ColumnHeader>
                  <Table.ColumnHeader>Before</Table.ColumnHeader>
                  <Table.ColumnHeader>After</Table.ColumnHeader>
                </Table.Row>
              </Table.Header>
              <Table.Body>
                {rows.map((row, index) => (
                  <Table.Row key={index}>
                    <Table.Cell>{row.where}</Table.Cell>
                    <Table.Cell>{row.what}</Table.Cell>
                    <Table.Cell>
                      <Badge colorPalette={row.kind === 'added' ? 'green' : row.kind === 'removed' ? 'red' : 'orange'}>{row.kind}</Badge>
                    </Table.Cell>
                    <Table.Cell fontFamily="mono" color="fg.muted" whiteSpace="pre-wrap" minW="12rem">
                      {row.from}
                    </Table.Cell>
                    <Table.Cell fontFamily="mono" whiteSpace="pre-wrap" minW="12rem">
                      {row.to}
                    </Table.Cell>
                  </Table.Row>
                ))}
              </Table.Body>
            </Table.Root>
          </Table.ScrollArea>
        </Box>
      )}
    </Stack>
  );
}
