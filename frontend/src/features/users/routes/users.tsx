import { Stack } from '@chakra-ui/react';
import { useQuery } from '@tanstack/react-query';
import { DataTable } from '@/components/data-table';
import { PageHeader } from '@/components/page-header';
import { usersQueries } from '../api/users-queries';
import { InviteUserDialog } from '../components/invite-user-dialog';
import { usersColumns } from '../components/users-columns';

export default function UsersPage() {
  const users = useQuery(usersQueries.list());

  return (
    <>
      <PageHeader
        section="Administration"
        title="Users"
        description="Everyone who can sign in to Meritline, with the roles that decide what they may do."
        actions={<InviteUserDialog />}
      />
      <Stack gap="4">
        <DataTable
          label="Users"
          columns={usersColumns}
          query={users}
          getRowId={(user) => user.id}
          sortable
          initialSorting={[{ id: 'name', desc: false }]}
          pageSize={25}
          emptyTitle="No users yet"
          emptyDescription="Invite the first colleague with the button above."
        />
      </Stack>
    </>
  );
}
