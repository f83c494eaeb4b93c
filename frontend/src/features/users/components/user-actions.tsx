import { Button, HStack, Text } from '@chakra-ui/react';
import type { UserDto } from '@meritline/shared';
import { ConfirmDialog } from '@/components/confirm-dialog';
import { FormDialog } from '@/components/form-dialog';
import { FormField } from '@/components/form/form-field';
import { toaster } from '@/components/ui/toaster';
import { useSession } from '@/lib/auth';
import { editUserSchema, useUpdateUser, type EditUserValues } from '../api/update-user';
import { RolesField } from './role-checkboxes';

export function UserActions({ user }: { user: UserDto }) {
  const { user: me } = useSession();
  const isMe = me?.id === user.id;

  return (
    <HStack gap="2" justify="flex-end">
      <EditUserDialog user={user} />
      {user.active ? <DeactivateDialog user={user} disabled={isMe} /> : <ReactivateButton user={user} />}
    </HStack>
  );
}

const announce = (user: UserDto) =>
  toaster.create({
    type: 'success',
    title: user.active ? `${user.name} can sign in again` : `${user.name} can no longer sign in`,
  });

function ReactivateButton({ user }: { user: UserDto }) {
  const reactivate = useUpdateUser();
  return (
    <Button
      size="xs"
      variant="ghost"
      loading={reactivate.isPending}
      aria-label={`Reactivate ${user.name}`}
      onClick={() => reactivate.mutate({ id: user.id, changes: { active: true } }, { onSuccess: announce })}
    >
      Reactivate
    </Button>
  );
}

/** Deactivation locks a colleague out at once, so it asks first. */
function DeactivateDialog({ user, disabled }: { user: UserDto; disabled: boolean }) {
  const deactivate = useUpdateUser({ inlineErrors: true });

  return (
    <ConfirmDialog
      trigger={
        <Button
          size="xs"
          variant="ghost"
          colorPalette="red"
          disabled={disabled}
          title={disabled ? 'You cannot deactivate your own account' : undefined}
          aria-label={`Deactivate ${user.name}`}
        >
          Deactivate
        </Button>
      }
      title={`Deactivate ${user.name}?`}
      confirmLabel="Deactivate"
      destructive
      onConfirm={async () => announce(await deactivate.mutateAsync({ id: user.id, changes: { active: false } }))}
    >
      <Text>
        {user.name} can no longer sign in. Their studies, reviews and signatures stay in the record. You can reactivate the account later.
      </Text>
    </ConfirmDialog>
  );
}

function EditUserDialog({ user }: { user: UserDto }) {
  const updateUser = useUpdateUser({ inlineErrors: true });
  const initialValues: EditUserValues = { name: user.name, roles: user.roles };

  return (
    <FormDialog
      trigger={
        <Button size="xs" variant="outline" aria-label={`Edit ${user.name}`}>
          Edit
        </Button>
      }
      title={`Edit ${user.name}`}
      description={`${user.email}. A change of roles applies from the next page the person opens.`}
      initialValues={initialValues}
      validationSchema={editUserSchema}
      onSubmit={async (values) => {
        await updateUser.mutateAsync({ id: user.id, changes: values });
        toaster.create({ type: 'success', title: `${values.name} saved` });
      }}
      submitLabel="Save"
    >
      <FormField name="name" label="Full name" required />
      <RolesField />
    </FormDialog>
  );
}
