import { Button, Menu, Portal } from '@chakra-ui/react';
import { useState } from 'react';
import * as yup from 'yup';
import { FormDialog } from '@/components/form-dialog';
import { TextareaField } from '@/components/form/textarea-field';
import { toaster } from '@/components/ui/toaster';
import type { StudyDraftController } from '../../hooks/use-study-draft';
import type { GridRow } from '../../utils/grid-sections';

export const setSheet = (
  controller: StudyDraftController,
  section: keyof StudyDraftController['draft']['data']['sheets'],
  rows: GridRow[],
) => controller.change((d) => ({ ...d, data: { ...d.data, sheets: { ...d.data.sheets, [section]: rows } } }));

type ExcludableSection = 'standards' | 'blanks' | 'recovery' | 'precision' | 'lowSpikes';
/** What is excluded: a whole row, or one result of a low-level spike row (its spike or its method blank). */
type ExclusionTarget = Exclude<ExcludableSection, 'lowSpikes'> | 'lowSpikes.spiked' | 'lowSpikes.blank';

interface ExclusionWords {
  /** What a row is: "standard", "spiked sample", "result". */
  noun: string;
  /** The menu's word for one of the two results of a row ("spike", "blank"); none for a whole row. */
  short?: string;
  describe: (row: GridRow) => string;
  consequence: string;
}

const WORDS: Record<ExclusionTarget, ExclusionWords> = {
  standards: {
    noun: 'standard',
    describe: (row) => `x = ${row.cells.x ?? '?'}, y = ${row.cells.y ?? '?'}`,
    consequence: 'The point stays in the study, shown hollow, and is left out of every figure.',
  },
  blanks: {
    noun: 'blank',
    describe: (row) => `response ${row.cells.value ?? '?'}`,
    consequence:
      'The blank stays in the study, marked excluded, and is left out of the blank SD, the limits from it and the outlier tests.',
  },
  recovery: {
    noun: 'spiked sample',
    describe: (row) => `${row.cells.id || 'without a name'}, found ${row.cells.found ?? '?'}`,
    consequence: 'The row stays in the study, marked excluded, and is left out of every recovery figure.',
  },
  precision: {
    noun: 'result',
    describe: (row) => `${row.cells.value ?? '?'} (series ${row.cells.group || '?'})`,
    consequence: 'The result stays in the study, marked excluded, and is left out of the repeatability and intermediate precision.',
  },
  'lowSpikes.spiked': {
    noun: 'low-level spike result',
    short: 'spike',
    describe: (row) => `${row.cells.spiked ?? '?'}`,
    consequence: 'The result stays in the study, marked excluded, and is left out of the method detection limit.',
  },
  'lowSpikes.blank': {
    noun: 'method blank result',
    short: 'blank',
    describe: (row) => `${row.cells.blank ?? '?'}`,
    consequence: 'The blank stays in the study, marked excluded, and is left out of the method detection limit.',
  },
};

/** Excluding a standard takes a written reason and can be undone: the point stays in the data and leaves every computation. */
export const useStandardExclusion = (controller: StudyDraftController) => useRowExclusion(controller, 'standards');

/** A row's exclusion for the target: the row's own, or that of its cell (`column`). */
const exclusionIn = (row: GridRow, column: string | undefined) => (column ? row.excludedCells?.[column] : row.excluded);

function withExclusion(row: GridRow, column: string | undefined, excluded: { reason: string } | undefined): GridRow {
  if (!column) {
    const { excluded: _previous, ...rest } = row;
    return excluded ? { ...rest, excluded } : rest;
  }
  const { [column]: _previous, ...others } = row.excludedCells ?? {};
  const cells = excluded ? { ...others, [column]: excluded } : others;
  const { excludedCells: _cells, ...rest } = row;
  return Object.keys(cells).length > 0 ? { ...rest, excludedCells: cells } : rest;
}

/**
 * Excluding a row (a standard, a method blank, a spiked sample, a precision result), or one result of a low-level
 * spike row (`column`: its spike or its method blank), takes a written reason and can be undone: the value stays
 * in the data, marked, and leaves every computation.
 */
export function useRowExclusion(controller: StudyDraftController, section: ExcludableSection, column?: 'spiked' | 'blank') {
  const words = WORDS[column ? (`lowSpikes.${column}` as const) : (section as Exclude<ExcludableSection, 'lowSpikes'>)];
  const describe = words.describe;
  const [target, setTarget] = useState<GridRow | null>(null);
  const rows = controller.draft.data.sheets[section];

  const setExcluded = (rowId: string, excluded: { reason: string } | undefined) =>
    setSheet(
      controller,
      section,
      rows.map((row) => (row.id === rowId ? withExclusion(row, column, excluded) : row)),
    );

  const toggle = (rowId: string) => {
    const row = rows.find((r) => r.id === rowId);
    if (!row || !controller.editable) return;
    if (exclusionIn(row, column)) {
      setExcluded(row.id, undefined);
      toaster.create({
        type: 'info',
        title: `${words.noun.charAt(0).toUpperCase()}${words.noun.slice(1)} included again`,
        description: describe(row),
      });
      return;
    }
    setTarget(row);
  };

  const reasonSchema = yup.object({
    reason: yup
      .string()
      .trim()
      .required(`Say why the ${words.noun} is excluded (at least 3 characters).`)
      .min(3, `Say why the ${words.noun} is excluded (at least 3 characters).`),
  });

  const dialog = (
    <FormDialog
      open={target !== null}
      onOpenChange={(open) => !open && setTarget(null)}
      title={`Exclude the ${words.noun} ${target ? describe(target) : ''}?`}
      description={`${words.consequence} Exclude only for an assignable cause, such as a bubble in the cell, a spilt vial or a failed injection; the reason goes on record and can be read by the reviewer.`}
      initialValues={{ reason: '' }}
      validationSchema={reasonSchema}
      onSubmit={({ reason }) => {
        if (target) setExcluded(target.id, { reason });
      }}
      submitLabel={`Exclude the ${words.noun}`}
    >
      <TextareaField name="reason" label="Reason" required rows={2} />
    </FormDialog>
  );

  const rowActions = (row: GridRow) => {
    const excluded = Boolean(exclusionIn(row, column));
    return (
      <Button
        size="xs"
        variant="ghost"
        onClick={() => toggle(row.id)}
        disabled={!controller.editable}
        title={`${excluded ? 'Include again' : 'Exclude'} the ${words.noun} ${describe(row)}`}
      >
        {excluded ? 'Include again' : 'Exclude…'}
      </Button>
    );
  };

  const isExcluded = (row: GridRow) => Boolean(exclusionIn(row, column));
  const itemLabel = (row: GridRow) =>
    `${isExcluded(row) ? 'Include' : 'Exclude'} the ${words.short ?? words.noun} ${describe(row)}${isExcluded(row) ? ' again' : '…'}`;

  return { toggle, dialog, rowActions, isExcluded, itemLabel };
}

/**
 * A low-level spike row holds a spike and a method blank, each excluded on its own: one button when the row holds
 * one of them, a menu of both otherwise, so that the row keeps the width of the other grids' rows.
 */
export function useLowSpikeExclusion(controller: StudyDraftController) {
  const spike = useRowExclusion(controller, 'lowSpikes', 'spiked');
  const blank = useRowExclusion(controller, 'lowSpikes', 'blank');
  const filled = (row: GridRow, key: string) => (row.cells[key] ?? '').trim() !== '';

  const rowActions = (row: GridRow) => {
    const parts = [...(filled(row, 'spiked') ? [spike] : []), ...(filled(row, 'blank') ? [blank] : [])];
    if (parts.length < 2) return parts[0]?.rowActions(row) ?? null;
    return (
      <Menu.Root>
        <Menu.Trigger asChild>
          <Button size="xs" variant="ghost" disabled={!controller.editable}>
            {parts.some((part) => part.isExcluded(row)) ? 'Include again…' : 'Exclude…'}
          </Button>
        </Menu.Trigger>
        <Portal>
          <Menu.Positioner>
            <Menu.Content>
              {parts.map((part) => (
                <Menu.Item key={part.itemLabel(row)} value={part.itemLabel(row)} onSelect={() => part.toggle(row.id)}>
                  {part.itemLabel(row)}
                </Menu.Item>
              ))}
            </Menu.Content>
          </Menu.Positioner>
        </Portal>
      </Menu.Root>
    );
  };

  return {
    rowActions,
    dialog: (
      <>
        {spike.dialog}
        {blank.dialog}
      </>
    ),
  };
}
