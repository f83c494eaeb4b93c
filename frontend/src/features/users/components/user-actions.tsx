import { Button, CloseButton, Dialog, HStack, Portal } from '@chakra-ui/react';
import type { UserDto } from '@meritline/shared';
import { useState } from 'react';
import { Form } from '@/components/form/form';
import { FormField } from '@/components/form/form-field';
import { toaster } from '@/components/ui/toaster';
import { useSession } from '@/features/auth/use-session';
import { editUserSchema, useUpdateUser, type EditUserValues } from '../api/update-user';
import { RoleCheckboxes } from './role-checkboxes';

export function UserActions({ user }: { user: UserDto }) {
  const { user: me } = useSession();
  const setActive = useUpdateUser();
  const isMe = me?.id === user.id;

  const toggleActive = () =>
    setActive.mutate(
      { id: user.id, changes: { active: !user.active } },
      {
        onSuccess: (updated) =>
          toaster.create({
            type: 'success',
            title: updated.active ? `${updated.name} can sign in again` : `${updated.name} can no longer sign in`,
          }),
      },
    );

  return (
    <HStack gap="2" justify="flex-end">
      <EditUserDialog user={user} />
      <Button
        size="xs"
        variant="ghost"
        colorPalette={user.active ? 'red' : 'brand'}
        onClick={toggleActive}
        loading={setActive.isPending}
        disabled={isMe}
        title={isMe ? 'You cannot deactivate your own account' : undefined}
        aria-label={`${user.active ? 'Deactivate' : 'Reactivate'} ${user.name}`}
      >
        {user.active ? 'Deactivate' : 'Reactivate'}
      </Button>
    </HStack>
  );
}

function EditUserDialog({ user }: { user: UserDto }) {
  const [open, setOpen] = useState(false);
  const updateUser = useUpdateUser({ inlineErrors: true });
  const initialValues: EditUserValues = { name: user.name, roles: user.roles };

  return (
    <Dialog.Root open={open} onOpenChange={(event) => setOpen(event.open)} size="md">
      <Dialog.Trigger asChild>
        <Button size="xs" variant="outline" aria-label={`Edit ${user.name}`}>
          Edit
        </Button>
      </Dialog.Trigger>
      <Portal>
        <Dialog.Backdrop />
        <Dialog.Positioner>
          <Dialog.Content>
            <Dialog.Header>
              <Dialog.Title>Edit {user.name}</Dialog.Title>
            </Dialog.Header>
            <Dialog.Body pb="6">
              <Dialog.Description mb="5" color="fg.muted">
                {user.email}. A change of roles applies from the next page the person opens.
              </Dialog.Description>
              <Form
                initialValues={initialValues}
                validationSchema={editUserSchema}
                onSubmit={async (values) => {
                  await updateUser.mutateAsync({ id: user.id, changes: values });
                  setOpen(false);
                  toaster.create({ type: 'success', title: `${values.name} saved` });
                }}
                submitLabel="Save"
                secondaryAction={
                  <Dialog.ActionTrigger asChild>
                    <Button variant="outline">Cancel</Button>
                  </Dialog.ActionTrigger>
                }
              >
                <FormField name="name" label="Full name" required />
                <FormField name="roles" label="Roles" required>
                  {(field, helpers) => (
                    <RoleCheckboxes
                      value={field.value as string[]}
                      onChange={(roles) => void helpers.setValue(roles)}
                      onBlur={() => void helpers.setTouched(true)}
                    />
                  )}
                </FormField>
              </Form>
            </Dialog.Body>
            <Dialog.CloseTrigger asChild>
              <CloseButton size="sm" />
            </Dialog.CloseTrigger>
          </Dialog.Content>
        </Dialog.Positioner>
      </Portal>
    </Dialog.Root>
  );
}
