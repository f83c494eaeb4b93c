import { formatDate, formatDateTime, type StudySort, type StudySummaryDto } from '@meritline/shared';
import { Button, HStack, Stack, Text } from '@chakra-ui/react';
import { Link as RouterLink } from 'react-router';
import { dataTableColumns, HiddenHeader, SortArrow, SortButton } from '@/components/data-table';
import { NameCell } from '@/components/name-cell';
import { CriterionMark } from '@/components/study-results';
import { paths } from '@/lib/config/paths';
import { StudyStatusBadge } from '../study-status-badge';

export interface ServerSort {
  sort: StudySort;
  order: 'asc' | 'desc';
  onSort: (sort: StudySort) => void;
}

function SortHeader({ label, by, sort }: { label: string; by: StudySort; sort: ServerSort }) {
  const active = sort.sort === by;
  const direction = active ? (sort.order === 'asc' ? 'ascending' : 'descending') : 'not sorted';
  return (
    <SortButton type="button" onClick={() => sort.onSort(by)} aria-label={`${label}, ${direction}; sort by ${label.toLowerCase()}`}>
      {label}
      <SortArrow direction={active ? sort.order : undefined} />
    </SortButton>
  );
}

const column = dataTableColumns<StudySummaryDto>();

const isEditable = (study: StudySummaryDto) => study.status === 'draft' || study.status === 'returned';

/** Who looks at the list: an analyst opens drafts in the wizard (their own to change), anyone else the read-only review page. */
export interface ListViewer {
  id: string | undefined;
  analyst: boolean;
}

/** Columns of the studies list; the sortable headers ask the server to sort. */
export function studiesColumns(sort: ServerSort, viewer: ListViewer) {
  const studyHref = (study: StudySummaryDto) =>
    isEditable(study) && viewer.analyst ? paths.studyEdit.getHref(study.id, 2) : paths.studyView.getHref(study.id);
  const mine = (study: StudySummaryDto) => isEditable(study) && study.author.id === viewer.id;
  return column.columns([
    column.accessor('title', {
      header: () => <SortHeader label="Title" by="title" sort={sort} />,
      cell: (info) => (
        <NameCell
          name={info.getValue()}
          href={studyHref(info.row.original)}
          detail={`${info.row.original.method.name}, version ${info.row.original.methodVersion.number} · ${info.row.original.author.name}`}
          minW="16rem"
        />
      ),
    }),
    column.accessor('status', {
      header: () => <SortHeader label="Status" by="status" sort={sort} />,
      cell: (info) => <StudyStatusBadge status={info.getValue()} />,
    }),
    column.accessor('verdictPass', {
      header: 'Verdict',
      cell: (info) => <CriterionMark pass={info.getValue()} />,
    }),
    column.accessor('updatedAt', {
      header: () => (
        <HStack gap="3" justify="flex-end">
          <SortHeader label="Last change" by="updatedAt" sort={sort} />
          <SortHeader label="Created" by="createdAt" sort={sort} />
        </HStack>
      ),
      meta: { align: 'end' },
      cell: (info) => (
        <Stack gap="0" align="flex-end">
          <Text whiteSpace="nowrap">{formatDateTime(info.getValue())}</Text>
          <Text fontSize="xs" color="fg.muted" whiteSpace="nowrap">
            created {formatDate(info.row.original.createdAt)}
          </Text>
        </Stack>
      ),
    }),
    column.display({
      id: 'open',
      header: () => <HiddenHeader>Open</HiddenHeader>,
      meta: { align: 'end' },
      cell: (info) => {
        const study = info.row.original;
        const editable = mine(study);
        return (
          <Button asChild size="xs" variant={editable ? 'solid' : 'outline'}>
            <RouterLink to={studyHref(study)} aria-label={`${editable ? 'Resume' : 'Open'} ${study.title}`}>
              {editable ? 'Resume' : 'Open'}
            </RouterLink>
          </Button>
        );
      },
    }),
  ]);
}
