import { Box, Progress } from '@chakra-ui/react';
import { Navigate, Outlet, useLocation, useNavigation } from 'react-router';
import { PageSpinner } from '@/components/page-spinner';
import { QueryError } from '@/components/query-error';
import { useSession } from '@/lib/auth';
import { paths } from '@/lib/config/paths';
import { sessionEndedByUser } from '@/lib/signed-in';
import { AppShell } from './app-shell';

/** Layout of every signed-in page: sends signed-out visitors to sign-in and brings them back afterwards. */
export default function ProtectedLayout() {
  const session = useSession();
  const location = useLocation();
  const navigation = useNavigation();

  if (!session.signedIn) {
    const redirectTo = sessionEndedByUser() ? undefined : location.pathname + location.search;
    return <Navigate to={paths.signIn.getHref(redirectTo)} replace />;
  }
  if (session.isLoading) return <PageSpinner label="Loading your account" />;
  if (!session.user) {
    return (
      <Box p="8" maxW="2xl" mx="auto">
        <QueryError
          error={session.error ?? new Error('No user')}
          title="Your account could not be loaded"
          onRetry={() => window.location.reload()}
        />
      </Box>
    );
  }

  return (
    <AppShell user={session.user} onSignOut={session.signOut}>
      {navigation.state === 'loading' && (
        <Progress.Root size="xs" value={null} position="fixed" top="0" insetX="0" zIndex="toast" aria-label="Opening the page">
          <Progress.Track bg="transparent">
            <Progress.Range bg="accent.solid" />
          </Progress.Track>
        </Progress.Root>
      )}
      <Outlet />
    </AppShell>
  );
}
