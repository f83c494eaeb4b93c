import type { ImportSection, StudyDto } from '@meritline/shared';
import { Button, HStack, Stack, Text } from '@chakra-ui/react';
import type { ReactNode } from 'react';
import { toaster } from '@/components/ui/toaster';
import { isApiError } from '@/lib/api-client';
import { downloadImportTemplate } from '../../api/import-study-file';
import { excludedCount, isBlankRow, rowProblems, sectionColumns, type GridRow, type SectionUnits } from '../../utils/grid-sections';
import { DataGrid } from './data-grid';
import { ImportDialog } from './import-dialog';
import { PasteDialog } from './paste-dialog';

export interface SectionEditorProps {
  studyId: string;
  section: ImportSection;
  /** In words, lower case: "calibration standards". */
  sectionName: string;
  units: SectionUnits;
  rows: readonly GridRow[];
  onRowsChange: (rows: GridRow[]) => void;
  readOnly: boolean;
  prepareImport: () => Promise<{ lockVersion: number; reason?: string } | null>;
  onImported: (study: StudyDto) => void;
  rowActions?: (row: GridRow, index: number) => ReactNode;
}

/** One section of the study as a grid, with paste, file upload and a template to start from. */
export function SectionEditor({
  studyId,
  section,
  sectionName,
  units,
  rows,
  onRowsChange,
  readOnly,
  prepareImport,
  onImported,
  rowActions,
}: SectionEditorProps) {
  const columns = sectionColumns(section, units);
  const filled = rows.filter((row) => !isBlankRow(row, columns));
  const withProblems = filled.filter((row) => Object.keys(rowProblems(row, columns)).length > 0).length;
  const excluded = filled.reduce((sum, row) => sum + excludedCount(row), 0);

  const downloadTemplate = () =>
    downloadImportTemplate(section).catch((error: unknown) =>
      toaster.create({
        type: 'error',
        title: 'The template could not be downloaded',
        description: isApiError(error) ? error.body.message : undefined,
      }),
    );

  return (
    <Stack gap="3">
      <HStack gap="2" wrap="wrap">
        <PasteDialog
          sectionName={sectionName}
          columns={columns}
          hasRows={filled.length > 0}
          disabled={readOnly}
          onPaste={(pasted, mode) => onRowsChange(mode === 'append' ? [...filled, ...pasted] : pasted)}
        />
        <ImportDialog
          studyId={studyId}
          section={section}
          sectionName={sectionName}
          prepare={prepareImport}
          onImported={onImported}
          disabled={readOnly}
        />
        <Button size="sm" variant="ghost" onClick={() => void downloadTemplate()}>
          Download a CSV template
        </Button>
      </HStack>
      <DataGrid
        label={sectionName.charAt(0).toUpperCase() + sectionName.slice(1)}
        columns={columns}
        rows={rows}
        onRowsChange={onRowsChange}
        readOnly={readOnly}
        rowActions={rowActions}
      />
      <Text fontSize="sm" color={withProblems > 0 ? 'fg.error' : 'fg.muted'} aria-live="polite">
        {filled.length} row{filled.length === 1 ? '' : 's'}
        {excluded > 0 && `, ${excluded} excluded`}
        {withProblems > 0 &&
          ` · ${withProblems} row${withProblems === 1 ? ' has a cell' : 's have cells'} that ${withProblems === 1 ? 'is' : 'are'} not a number or missing: marked above, not used or saved until corrected`}
      </Text>
    </Stack>
  );
}
