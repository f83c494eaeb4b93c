import { Button } from '@chakra-ui/react';
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

type ExcludableSection = 'standards' | 'blanks' | 'recovery' | 'precision';

interface ExclusionWords {
  /** What a row is: "standard", "spiked sample", "result". */
  noun: string;
  describe: (row: GridRow) => string;
  consequence: string;
}

const WORDS: Record<ExcludableSection, ExclusionWords> = {
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
};

/** Excluding a standard takes a written reason and can be undone: the point stays in the data and leaves every computation. */
export const useStandardExclusion = (controller: StudyDraftController) => useRowExclusion(controller, 'standards');

/**
 * Excluding a row (a standard, a method blank, a spiked sample, a precision result) takes a written reason and can be
 * undone: the row stays in the data, marked, and leaves every computation.
 */
export function useRowExclusion(controller: StudyDraftController, section: ExcludableSection) {
  const words = WORDS[section];
  const describe = words.describe;
  const [target, setTarget] = useState<GridRow | null>(null);
  const rows = controller.draft.data.sheets[section];

  const setExcluded = (rowId: string, excluded: { reason: string } | undefined) =>
    setSheet(
      controller,
      section,
      rows.map((row) => {
        if (row.id !== rowId) return row;
        const { excluded: _previous, ...rest } = row;
        return excluded ? { ...rest, excluded } : rest;
      }),
    );

  const toggle = (rowId: string) => {
    const row = rows.find((r) => r.id === rowId);
    if (!row || !controller.editable) return;
    if (row.excluded) {
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

  const rowActions = (row: GridRow) => (
    <Button
      size="xs"
      variant="ghost"
      onClick={() => toggle(row.id)}
      disabled={!controller.editable}
      title={`${row.excluded ? 'Include again' : 'Exclude'} the ${words.noun} ${describe(row)}`}
    >
      {row.excluded ? 'Include again' : 'Exclude…'}
    </Button>
  );

  return { toggle, dialog, rowActions };
}
