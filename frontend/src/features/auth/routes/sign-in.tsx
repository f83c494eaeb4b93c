import { Navigate, useNavigate, useSearchParams } from 'react-router';
import { Form } from '@/components/form/form';
import { FormField } from '@/components/form/form-field';
import { paths, safeRedirectTarget } from '@/lib/config/paths';
import { signInSchema, useSignIn, type SignInValues } from '../api/sign-in';
import { AuthLayout } from '../components/auth-layout';
import { useSession } from '@/lib/auth';

const initialValues: SignInValues = { email: '', password: '' };

export default function SignInPage() {
  const [searchParams] = useSearchParams();
  const navigate = useNavigate();
  const { signedIn } = useSession();
  const signIn = useSignIn();
  const redirectTo = safeRedirectTarget(searchParams.get('redirectTo'));

  if (signedIn && signIn.isIdle) return <Navigate to={paths.home.getHref()} replace />;

  return (
    <AuthLayout title="Sign in" intro="Use the e-mail address your laboratory registered for you.">
      <Form
        initialValues={initialValues}
        validationSchema={signInSchema}
        onSubmit={async (values) => {
          await signIn.mutateAsync(values);
          void navigate(redirectTo, { replace: true });
        }}
        submitLabel="Sign in"
        submitFullWidth
      >
        <FormField name="email" label="E-mail" type="email" autoComplete="username" />
        <FormField name="password" label="Password" type="password" autoComplete="current-password" />
      </Form>
    </AuthLayout>
  );
}
