import { Button, CloseButton, Dialog, HStack, Portal, Text } from '@chakra-ui/react';
import type { UserDto } from '@meritline/shared';
import { useState } from 'react';
import { Form } from '@/components/form/form';
import { FormField } from '@/components/form/form-field';
import { toaster } from '@/components/ui/toaster';
import { useSession } from '@/lib/auth';
import { editUserSchema, useUpdateUser, type EditUserValues } from '../api/update-user';
import { RoleCheckboxes } from './role-checkboxes';

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
  const [open, setOpen] = useState(false);
  const deactivate = useUpdateUser();

  return (
    <Dialog.Root open={open} onOpenChange={(event) => setOpen(event.open)} role="alertdialog" size="sm">
      <Dialog.Trigger asChild>
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
      </Dialog.Trigger>
      <Portal>
        <Dialog.Backdrop />
        <Dialog.Positioner>
          <Dialog.Content>
            <Dialog.Header>
              <Dialog.Title>Deactivate {user.name}?</Dialog.Title>
            </Dialog.Header>
            <Dialog.Body>
              <Text>
                {user.name} can no longer sign in. Their studies, reviews and signatures stay in the record. You can reactivate the account
                later.
              </Text>
            </Dialog.Body>
            <Dialog.Footer>
              <Dialog.ActionTrigger asChild>
                <Button variant="outline">Cancel</Button>
              </Dialog.ActionTrigger>
              <Button
                colorPalette="red"
                loading={deactivate.isPending}
                onClick={() =>
                  deactivate.mutate(
                    { id: user.id, changes: { active: false } },
                    {
                      onSuccess: (updated) => {
                        setOpen(false);
                        announce(updated);
                      },
                    },
                  )
                }
              >
                Deactivate
              </Button>
            </Dialog.Footer>
          </Dialog.Content>
        </Dialog.Positioner>
      </Portal>
    </Dialog.Root>
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
