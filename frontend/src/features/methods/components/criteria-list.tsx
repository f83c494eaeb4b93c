import { DataTable, dataTableColumns } from '@/components/data-table';
import { CriterionName, criterionName, describeRequirement, figureUnit, type CriterionDefinition } from '@/components/study-results';

const column = dataTableColumns<CriterionDefinition & { id: string; unit?: string }>();
const columns = column.columns([
  column.display({
    id: 'name',
    header: 'Criterion',
    cell: (info) => <CriterionName name={criterionName(info.row.original)} figure={info.row.original.figure} />,
  }),
  column.display({
    id: 'requirement',
    header: 'Required',
    cell: (info) => describeRequirement(info.row.original.op, info.row.original.value, info.row.original.unit),
  }),
]);

export interface CriteriaListProps {
  criteria: readonly CriterionDefinition[];
  label: string;
  /** The method's units, for limits in concentration or response. */
  units?: { x?: string; y?: string };
}

export function CriteriaList({ criteria, label, units = {} }: CriteriaListProps) {
  return (
    <DataTable
      label={label}
      columns={columns}
      data={criteria.map((c, i) => ({ ...c, id: String(i), unit: figureUnit(c.figure, units) }))}
      getRowId={(row) => row.id}
      emptyTitle="No acceptance criteria"
      emptyDescription="Studies on this version get figures but no verdict."
    />
  );
}
