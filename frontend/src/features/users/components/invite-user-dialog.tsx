import { Button, CloseButton, Dialog, Portal } from '@chakra-ui/react';
import { useState } from 'react';
import { Form } from '@/components/form/form';
import { FormField } from '@/components/form/form-field';
import { toaster } from '@/components/ui/toaster';
import { inviteUserSchema, useInviteUser, type InviteUserValues } from '../api/invite-user';
import { RoleCheckboxes } from './role-checkboxes';

const initialValues: InviteUserValues = { email: '', name: '', roles: [] };

export function InviteUserDialog() {
  const [open, setOpen] = useState(false);
  const inviteUser = useInviteUser();

  return (
    <Dialog.Root open={open} onOpenChange={(event) => setOpen(event.open)} size="md">
      <Dialog.Trigger asChild>
        <Button>Invite a user</Button>
      </Dialog.Trigger>
      <Portal>
        <Dialog.Backdrop />
        <Dialog.Positioner>
          <Dialog.Content>
            <Dialog.Header>
              <Dialog.Title>Invite a user</Dialog.Title>
            </Dialog.Header>
            <Dialog.Body pb="6">
              <Dialog.Description mb="5" color="fg.muted">
                Meritline e-mails a link to set up the account. The link works once.
              </Dialog.Description>
              <Form
                initialValues={initialValues}
                validationSchema={inviteUserSchema}
                onSubmit={async (values) => {
                  const user = await inviteUser.mutateAsync(values);
                  setOpen(false);
                  toaster.create({ type: 'success', title: 'Invitation sent', description: `${user.name} (${user.email})` });
                }}
                submitLabel="Send invitation"
                secondaryAction={
                  <Dialog.ActionTrigger asChild>
                    <Button variant="outline">Cancel</Button>
                  </Dialog.ActionTrigger>
                }
              >
                <FormField name="email" label="E-mail" type="email" autoComplete="off" required />
                <FormField name="name" label="Full name" autoComplete="off" required />
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
