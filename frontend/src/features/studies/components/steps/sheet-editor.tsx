import type { ImportSection } from '@meritline/shared';
import type { StudyDraftController } from '../../hooks/use-study-draft';
import type { GridRow } from '../../utils/grid-sections';
import { SectionEditor, type SectionEditorProps } from '../grid/section-editor';
import { setSheet } from './exclusion';

export interface SheetEditorProps extends Pick<SectionEditorProps, 'sectionName' | 'units' | 'rowActions'> {
  controller: StudyDraftController;
  section: ImportSection;
  /** What the draft keeps of the rows as typed; all of them when left out. */
  keep?: (rows: GridRow[]) => GridRow[];
}

/** One section of the draft in its grid: editable while the study is, a file import adopted into the draft. */
export function SheetEditor({ controller, section, keep = (rows) => rows, ...props }: SheetEditorProps) {
  const { draft, server, editable, prepareImport, adopt } = controller;
  return (
    <SectionEditor
      {...props}
      studyId={server.id}
      section={section}
      rows={draft.data.sheets[section]}
      onRowsChange={(rows) => setSheet(controller, section, keep(rows))}
      readOnly={!editable}
      prepareImport={prepareImport}
      onImported={adopt}
    />
  );
}
