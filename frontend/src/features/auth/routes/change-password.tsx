import { Box } from '@chakra-ui/react';
import { Form } from '@/components/form/form';
import { FormField } from '@/components/form/form-field';
import { PageHeader } from '@/components/page-header';
import { toaster } from '@/components/ui/toaster';
import { markSignedOut } from '@/lib/signed-in';
import { PASSWORD_MIN_LENGTH } from '../api/password-rules';
import { changePasswordSchema, useChangePassword, type ChangePasswordValues } from '../api/change-password';

const initialValues: ChangePasswordValues = { currentPassword: '', newPassword: '', confirmPassword: '' };

export default function ChangePasswordPage() {
  const changePassword = useChangePassword();

  return (
    <>
      <PageHeader
        section="Your account"
        title="Change password"
        description="After the change every session of your account ends, this one included: sign in again with the new password."
      />
      <Box maxW="md" bg="bg.panel" borderWidth="1px" borderColor="border" borderRadius="l3" p={{ base: '5', md: '8' }}>
        <Form
          initialValues={initialValues}
          validationSchema={changePasswordSchema}
          onSubmit={async (values) => {
            await changePassword.mutateAsync(values);
            toaster.create({ type: 'success', title: 'Password changed', description: 'Sign in again with the new password.' });
            markSignedOut({ byUser: true });
          }}
          submitLabel="Change password"
          resetOnSuccess
        >
          <FormField name="currentPassword" label="Current password" type="password" autoComplete="current-password" required />
          <FormField
            name="newPassword"
            label="New password"
            type="password"
            autoComplete="new-password"
            helperText={`At least ${PASSWORD_MIN_LENGTH} characters.`}
            required
          />
          <FormField name="confirmPassword" label="Repeat the new password" type="password" autoComplete="new-password" required />
        </Form>
      </Box>
    </>
  );
}
