import { Box, Button, Heading, Stack, Text } from '@chakra-ui/react';
import { Link } from 'react-router';
import { paths } from '@/lib/config/paths';

export function NotFound() {
  return (
    <Box minH="60vh" display="grid" placeItems="center" p="8">
      <Stack gap="4" maxW="lg" textAlign="center" align="center">
        <Text textStyle="sectionLabel" color="accent.fg">
          Page not found
        </Text>
        <Heading as="h1" size="xl">
          There is no page at this address
        </Heading>
        <Text color="fg.muted">The link may be mistyped, or the page may have moved.</Text>
        <Button asChild>
          <Link to={paths.home.getHref()}>Go to the overview</Link>
        </Button>
      </Stack>
    </Box>
  );
}
