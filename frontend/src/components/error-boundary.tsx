import { Box, Button, Code, Heading, Stack, Text } from '@chakra-ui/react';
import { isRouteErrorResponse, useRouteError } from 'react-router';
import { NotFound } from './not-found';

/** Shown by the router when a page throws while loading or rendering. */
export function RouteErrorBoundary() {
  const error = useRouteError();
  if (isRouteErrorResponse(error) && error.status === 404) return <NotFound />;

  const detail = error instanceof Error ? error.message : isRouteErrorResponse(error) ? error.statusText : undefined;
  // A new deployment replaces the lazily loaded page files; a reload fetches the current ones.
  const staleBundle = detail?.includes('dynamically imported module') ?? false;

  return (
    <Box minH="60vh" display="grid" placeItems="center" p="8">
      <Stack gap="4" maxW="lg" textAlign="center" align="center">
        <Text textStyle="sectionLabel" color="accent.fg">
          Unexpected error
        </Text>
        <Heading as="h1" size="xl">
          {staleBundle ? 'Meritline has been updated' : 'This page could not be shown'}
        </Heading>
        <Text color="fg.muted">
          {staleBundle
            ? 'Reload the page to use the new version.'
            : 'Reload the page. If it happens again, tell your administrator what you were doing when it appeared.'}
        </Text>
        {detail && !staleBundle && (
          <Code size="sm" variant="surface" whiteSpace="pre-wrap">
            {detail}
          </Code>
        )}
        <Button onClick={() => window.location.reload()}>Reload the page</Button>
      </Stack>
    </Box>
  );
}
