import { Button, Stack } from '@chakra-ui/react';
import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router';
import { DataTable } from '@/components/data-table';
import { PageHeader } from '@/components/page-header';
import { paths } from '@/lib/config/paths';
import { preparationsQueries } from '../api/preparations-queries';
import { preparationsColumns } from '../components/preparations-columns';

export default function PreparationsPage() {
  const preparations = useQuery(preparationsQueries.list());
  return (
    <>
      <PageHeader
        section="Traceable standards"
        title="Standard preparations"
        description="Stock solutions weighed from a registered material and the working standards diluted from them, each with its standard uncertainty. A saved preparation is never changed."
        actions={
          <Button asChild>
            <Link to={paths.preparationNew.getHref()}>Prepare standards</Link>
          </Button>
        }
      />
      <Stack gap="4">
        <DataTable
          label="Standard preparations"
          columns={preparationsColumns}
          query={preparations}
          getRowId={(p) => p.id}
          sortable
          initialSorting={[{ id: 'createdAt', desc: true }]}
          pageSize={25}
          emptyTitle="No preparations saved yet"
        />
      </Stack>
    </>
  );
}
