import { Box, Button, Heading, Stack, Text } from '@chakra-ui/react';
import type { Role } from '@meritline/shared';
import { Link } from 'react-router';
import { paths } from '@/lib/config/paths';
import { formatRoles } from '@/lib/format';

export interface NotAllowedProps {
  requiredRoles: readonly Role[];
  userRoles: readonly Role[];
}

export function NotAllowed({ requiredRoles, userRoles }: NotAllowedProps) {
  return (
    <Box minH="50vh" display="grid" placeItems="center">
      <Stack gap="4" maxW="lg" textAlign="center" align="center">
        <Text textStyle="sectionLabel" color="accent.fg">
          Not allowed
        </Text>
        <Heading as="h1" size="xl">
          This page is for the role {formatRoles(requiredRoles).replace(/, ([^,]*)$/, ' or $1')}
        </Heading>
        <Text color="fg.muted">
          Your account holds the role{userRoles.length === 1 ? '' : 's'} {formatRoles(userRoles) || 'none'}. If your work needs this page,
          ask an administrator to add the role to your account.
        </Text>
        <Button asChild variant="outline">
          <Link to={paths.home.getHref()}>Go to the overview</Link>
        </Button>
      </Stack>
    </Box>
  );
}
