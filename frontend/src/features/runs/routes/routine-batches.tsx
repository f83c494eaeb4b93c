import { Button, Field, HStack, Stack, Text } from '@chakra-ui/react';
import { RUN_CAUTION, type RunStatus } from '@meritline/shared';
import { useQuery } from '@tanstack/react-query';
import { Link as RouterLink, useSearchParams } from 'react-router';
import { CursorPager } from '@/components/cursor-pager';
import { DataTable } from '@/components/data-table';
import { PageHeader } from '@/components/page-header';
import { SelectControl } from '@/components/select-control';
import { paths } from '@/lib/config/paths';
import { changeSearch } from '@/lib/search-params';
import { runsQueries } from '../api/runs-queries';
import type { RunFilters } from '../api/types';
import { runsColumns } from '../components/runs-columns';
import { versionChoices } from '../utils/version-choices';

const PAGE_SIZE = 20;
const STATUS_CHOICES = [
  { value: 'accepted', label: 'Accepted' },
  { value: 'rejected', label: 'Rejected' },
];

export default function RoutineBatchesPage() {
  const [params, setParams] = useSearchParams();
  const scope = params.get('scope') ?? '';
  const status = (params.get('status') ?? '') as RunStatus | '';
  const pageNumber = Math.max(1, Number(params.get('page')) || 1);
  const cursor = params.get('cursor') || undefined;
  const filters: RunFilters = {
    ...(scope.startsWith('method:') ? { methodId: scope.slice('method:'.length) } : scope ? { methodVersionId: scope } : {}),
    ...(status ? { status } : {}),
    ...(cursor ? { cursor } : {}),
    pageSize: PAGE_SIZE,
  };
  const runs = useQuery(runsQueries.list(filters));
  const methods = useQuery(runsQueries.methodChoices());
  const update = (changes: Record<string, string | undefined>) => setParams((current) => changeSearch(current, changes));
  const versionId = scope && !scope.startsWith('method:') ? scope : undefined;

  return (
    <>
      <PageHeader
        section="Bench work"
        title="Routine batches"
        description="Each run calibrates a validated method version with the day's standards, reads the samples off it and lets the check standards decide whether the results may be reported."
        actions={
          <HStack gap="3">
            <Button variant="outline" asChild>
              <RouterLink to={paths.runControlChart.getHref(versionId)}>Control charts</RouterLink>
            </Button>
            <Button asChild>
              <RouterLink to={paths.runNew.getHref({ versionId })}>New run</RouterLink>
            </Button>
          </HStack>
        }
      />
      <Stack gap="4">
        <HStack gap="4" align="flex-end" wrap="wrap">
          <Field.Root maxW="md">
            <Field.Label>Method and version</Field.Label>
            <SelectControl
              value={scope}
              onChange={(value) => update({ scope: value, page: '', cursor: '' })}
              placeholder="All methods"
              options={versionChoices(methods.data ?? [], { allowMethods: true })}
            />
          </Field.Root>
          <Field.Root maxW="2xs">
            <Field.Label>Status</Field.Label>
            <SelectControl
              value={status}
              onChange={(value) => update({ status: value, page: '', cursor: '' })}
              placeholder="Accepted and rejected"
              options={STATUS_CHOICES}
            />
          </Field.Root>
        </HStack>
        <DataTable
          label="Routine runs"
          columns={runsColumns}
          query={runs}
          data={runs.data?.items}
          getRowId={(run) => run.id}
          emptyTitle="No runs yet"
          emptyDescription="Start one with “New run”: it needs an active method version with an approved validation study."
        />
        <CursorPager
          noun="Runs"
          query={runs}
          pageNumber={pageNumber}
          onMove={(next, page) => update({ cursor: next, page: page > 1 ? String(page) : undefined })}
        />
        <Text fontSize="sm" color="fg.muted">
          {RUN_CAUTION}
        </Text>
      </Stack>
    </>
  );
}
