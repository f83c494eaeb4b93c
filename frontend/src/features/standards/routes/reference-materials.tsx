import { Button, HStack, Stack } from '@chakra-ui/react';
import { hasAnyRole, Role } from '@meritline/shared';
import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router';
import { DataTable } from '@/components/data-table';
import { PageHeader } from '@/components/page-header';
import { useSession } from '@/lib/auth';
import { paths } from '@/lib/config/paths';
import { referenceMaterialsQueries } from '../api/reference-materials-queries';
import { ExpiringMaterialsNotice } from '../components/expiring-materials-notice';
import { useCanKeepRegister } from '../components/material-actions';
import { MaterialFormDialog } from '../components/material-form-dialog';
import { materialsColumns } from '../components/materials-columns';

export default function ReferenceMaterialsPage() {
  const materials = useQuery(referenceMaterialsQueries.list());
  const canKeep = useCanKeepRegister();
  const { user } = useSession();
  const isAnalyst = hasAnyRole(user?.roles ?? [], [Role.Analyst]);

  return (
    <>
      <PageHeader
        section="Traceable standards"
        title="Reference materials"
        description="Certified materials of the laboratory with their certificates, lots and expiry dates. Standards are prepared only from materials in use."
        actions={
          <HStack gap="3">
            {isAnalyst && (
              <Button asChild variant="outline">
                <Link to={paths.preparations.getHref()}>Standard preparations</Link>
              </Button>
            )}
            {canKeep && <MaterialFormDialog />}
          </HStack>
        }
      />
      <Stack gap="5">
        <ExpiringMaterialsNotice />
        <DataTable
          label="Reference materials"
          columns={materialsColumns}
          query={materials}
          getRowId={(m) => m.id}
          sortable
          initialSorting={[{ id: 'name', desc: false }]}
          pageSize={25}
          emptyTitle="No reference materials registered"
          emptyDescription={canKeep ? 'Register the first one with the button above.' : 'Quality managers keep the register.'}
        />
      </Stack>
    </>
  );
}
