import { Alert } from '@chakra-ui/react';
import { useNavigate, useSearchParams } from 'react-router';
import { Form } from '@/components/form/form';
import { FormField } from '@/components/form/form-field';
import { paths } from '@/lib/config/paths';
import { acceptInvitationSchema, PASSWORD_MIN_LENGTH, useAcceptInvitation, type AcceptInvitationValues } from '../api/accept-invitation';
import { AuthLayout } from '../components/auth-layout';

const initialValues: AcceptInvitationValues = { name: '', password: '', confirmPassword: '' };

export default function AcceptInvitationPage() {
  const [searchParams] = useSearchParams();
  const token = searchParams.get('token') ?? '';
  const navigate = useNavigate();
  const acceptInvitation = useAcceptInvitation(token);

  return (
    <AuthLayout
      title="Set up your account"
      intro="You were invited to Meritline. Enter your name as colleagues will see it on reviews and reports, and choose a password."
    >
      {token ? (
        <Form
          initialValues={initialValues}
          validationSchema={acceptInvitationSchema}
          onSubmit={async (values) => {
            await acceptInvitation.mutateAsync(values);
            void navigate(paths.home.getHref(), { replace: true });
          }}
          submitLabel="Create my account"
          submitFullWidth
        >
          <FormField name="name" label="Full name" autoComplete="name" required />
          <FormField
            name="password"
            label="Password"
            type="password"
            autoComplete="new-password"
            helperText={`At least ${PASSWORD_MIN_LENGTH} characters. A short sentence is easier to remember than symbols.`}
            required
          />
          <FormField name="confirmPassword" label="Repeat the password" type="password" autoComplete="new-password" required />
        </Form>
      ) : (
        <Alert.Root status="warning">
          <Alert.Indicator />
          <Alert.Content>
            <Alert.Title>This invitation link is incomplete</Alert.Title>
            <Alert.Description>
              Open the link from the invitation e-mail again, or ask your administrator to send a new invitation.
            </Alert.Description>
          </Alert.Content>
        </Alert.Root>
      )}
    </AuthLayout>
  );
}
