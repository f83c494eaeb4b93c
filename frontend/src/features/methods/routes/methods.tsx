import { Stack } from '@chakra-ui/react';
import { useQuery } from '@tanstack/react-query';
import { DataTable } from '@/components/data-table';
import { PageHeader } from '@/components/page-header';
import { methodsQueries } from '../api/methods-queries';
import { useMethodPermissions } from '../hooks/use-method-permissions';
import { CreateMethodDialog } from '../components/create-method-dialog';
import { methodsColumns } from '../components/methods-columns';

export default function MethodsPage() {
  const methods = useQuery(methodsQueries.list());
  const { canManage, canPropose } = useMethodPermissions();

  return (
    <>
      <PageHeader
        section="Quality"
        title="Methods"
        description="The analytical methods of the laboratory, their acceptance criteria and which version is released for routine use."
        actions={canPropose && <CreateMethodDialog proposal={!canManage} />}
      />
      <Stack gap="4">
        <DataTable
          label="Methods"
          columns={methodsColumns}
          query={methods}
          getRowId={(method) => method.id}
          sortable
          initialSorting={[{ id: 'name', desc: false }]}
          pageSize={25}
          emptyTitle="No methods yet"
          emptyDescription={canPropose ? 'Create the first method with the button above.' : undefined}
        />
      </Stack>
    </>
  );
}
