import { Badge, HStack, Stack, Text } from '@chakra-ui/react';
import { ROLE_LABELS, type UserDto, formatDateTime } from '@meritline/shared';
import { dataTableColumns, HiddenHeader } from '@/components/data-table';
import { UserActions } from './user-actions';

function UserStatus({ user }: { user: UserDto }) {
  if (!user.active)
    return (
      <Badge colorPalette="gray" variant="subtle">
        Deactivated
      </Badge>
    );
  if (user.invitationPending)
    return (
      <Badge colorPalette="accent" variant="subtle">
        Invitation sent
      </Badge>
    );
  return (
    <Badge colorPalette="brand" variant="subtle">
      Active
    </Badge>
  );
}

const column = dataTableColumns<UserDto>();

export const usersColumns = column.columns([
  column.accessor('name', {
    header: 'Name',
    sortFn: 'text',
    cell: (info) => (
      <Stack gap="0">
        <Text fontWeight="500">{info.getValue()}</Text>
        <Text fontSize="sm" color="fg.muted">
          {info.row.original.email}
        </Text>
      </Stack>
    ),
  }),
  column.accessor('roles', {
    header: 'Roles',
    enableSorting: false,
    cell: (info) => (
      <HStack gap="1.5" wrap="wrap">
        {info.getValue().map((role) => (
          <Badge key={role} variant="outline" colorPalette="gray">
            {ROLE_LABELS[role]}
          </Badge>
        ))}
      </HStack>
    ),
  }),
  column.accessor((user) => (!user.active ? 2 : user.invitationPending ? 1 : 0), {
    id: 'status',
    header: 'Status',
    sortFn: 'basic',
    cell: (info) => <UserStatus user={info.row.original} />,
  }),
  column.accessor('lastSignInAt', {
    header: 'Last sign-in',
    sortFn: 'datetime',
    sortUndefined: 'last',
    meta: { align: 'end' },
    cell: (info) => (info.getValue() ? formatDateTime(info.getValue()) : 'Never'),
  }),
  column.display({
    id: 'actions',
    header: () => <HiddenHeader>Actions</HiddenHeader>,
    meta: { align: 'end' },
    cell: (info) => <UserActions user={info.row.original} />,
  }),
]);
