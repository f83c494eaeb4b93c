import { Button, HStack, Stack } from '@chakra-ui/react';
import { Role, STUDY_SORTS, type StudySort, type StudyStatus } from '@meritline/shared';
import { useQuery } from '@tanstack/react-query';
import { useCallback, useMemo } from 'react';
import { Link as RouterLink, useSearchParams } from 'react-router';
import { CursorPager } from '@/components/cursor-pager';
import { DataTable } from '@/components/data-table';
import { PageHeader } from '@/components/page-header';
import { useSession } from '@/lib/auth';
import { paths } from '@/lib/config/paths';
import { changeSearch } from '@/lib/search-params';
import { methodChoicesQueries } from '../api/method-choices-queries';
import { studiesQueries } from '../api/studies-queries';
import { type StudyListParams } from '../api/types';
import { StudiesFilters, type StudyFilters } from '../components/list/studies-filters';
import { studiesColumns } from '../components/list/studies-columns';

const PAGE_SIZE = 20;
const STATUSES: StudyStatus[] = ['draft', 'submitted', 'returned', 'approved'];

function paramsFrom(search: URLSearchParams): StudyListParams {
  const status = search.get('status') as StudyStatus | null;
  const sort = search.get('sort') as StudySort | null;
  return {
    status: status && STATUSES.includes(status) ? status : undefined,
    methodId: search.get('methodId') || undefined,
    mine: search.get('mine') === 'true',
    from: search.get('from') || undefined,
    to: search.get('to') || undefined,
    q: search.get('q') || undefined,
    sort: sort && STUDY_SORTS.includes(sort) ? sort : 'updatedAt',
    order: search.get('order') === 'asc' ? 'asc' : 'desc',
    cursor: search.get('cursor') || undefined,
    pageSize: PAGE_SIZE,
  };
}

export default function ValidationStudiesPage() {
  const [search, setSearch] = useSearchParams();
  const params = paramsFrom(search);
  const studies = useQuery(studiesQueries.list(params));
  const methods = useQuery(methodChoicesQueries.list());

  const update = useCallback(
    (changes: Record<string, string | undefined>) => setSearch((current) => changeSearch(current, changes), { replace: true }),
    [setSearch],
  );

  const onFilters = useCallback(
    (filters: StudyFilters) =>
      update({
        status: filters.status,
        methodId: filters.methodId,
        mine: filters.mine ? 'true' : undefined,
        from: filters.from,
        to: filters.to,
        q: filters.q,
        cursor: undefined,
        page: undefined,
      }),
    [update],
  );

  const { sort, order } = params;
  const onSort = useCallback(
    (by: StudySort) => update({ sort: by, order: sort === by && order === 'desc' ? 'asc' : 'desc', cursor: undefined, page: undefined }),
    [update, sort, order],
  );
  const { user } = useSession();
  const analyst = user?.roles.includes(Role.Analyst) ?? false;
  const columns = useMemo(
    () => studiesColumns({ sort, order, onSort }, { id: user?.id, analyst }),
    [sort, order, onSort, user?.id, analyst],
  );

  const pageNumber = Math.max(1, Number(search.get('page')) || 1);
  const filters: StudyFilters = {
    status: params.status,
    methodId: params.methodId,
    mine: params.mine ?? false,
    from: params.from,
    to: params.to,
    q: params.q,
  };

  return (
    <>
      <PageHeader
        section="Bench work"
        title="Validation studies"
        description="Plan a validation, enter the calibration standards and responses, and see linearity, LOD/LOQ, recovery and precision against the method's acceptance criteria."
        actions={
          <HStack gap="2">
            <Button asChild variant="outline">
              <RouterLink to={paths.methods.getHref()}>Methods</RouterLink>
            </Button>
            {analyst && (
              <Button asChild>
                <RouterLink to={paths.studyNew.getHref()}>New study</RouterLink>
              </Button>
            )}
          </HStack>
        }
      />
      <Stack gap="4">
        <StudiesFilters filters={filters} methods={methods.data ?? []} onChange={onFilters} />
        <DataTable
          label="Validation studies"
          columns={columns}
          query={studies}
          data={studies.data?.items}
          getRowId={(study) => study.id}
          emptyTitle={search.size > 0 ? 'No study matches the filters' : 'No studies yet'}
          emptyDescription={search.size > 0 ? 'Change or clear the filters.' : 'Start one with “New study”.'}
        />
        <CursorPager
          noun="Studies"
          query={studies}
          pageNumber={pageNumber}
          onMove={(cursor, page) => update({ cursor, page: page > 1 ? String(page) : undefined })}
        />
      </Stack>
    </>
  );
}
