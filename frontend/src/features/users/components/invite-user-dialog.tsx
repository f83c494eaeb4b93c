import { Button } from '@chakra-ui/react';
import { FormDialog } from '@/components/form-dialog';
import { FormField } from '@/components/form/form-field';
import { toaster } from '@/components/ui/toaster';
import { inviteUserSchema, useInviteUser, type InviteUserValues } from '../api/invite-user';
import { RolesField } from './role-checkboxes';

const initialValues: InviteUserValues = { email: '', name: '', roles: [] };

export function InviteUserDialog() {
  const inviteUser = useInviteUser();

  return (
    <FormDialog
      trigger={<Button>Invite a user</Button>}
      title="Invite a user"
      description="Meritline e-mails a link to set up the account. The link works once."
      initialValues={initialValues}
      validationSchema={inviteUserSchema}
      onSubmit={async (values) => {
        const user = await inviteUser.mutateAsync(values);
        toaster.create({ type: 'success', title: 'Invitation sent', description: `${user.name} (${user.email})` });
      }}
      submitLabel="Send invitation"
    >
      <FormField name="email" label="E-mail" type="email" autoComplete="off" required />
      <FormField name="name" label="Full name" autoComplete="off" required />
      <RolesField />
    </FormDialog>
  );
}
