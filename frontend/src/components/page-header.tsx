import { Box, Heading, HStack, Stack, Text } from '@chakra-ui/react';
import type { ReactNode } from 'react';
import { usePageTitle } from './brand-mark';

export interface PageHeaderProps {
  title: string;
  /** A short label above the title naming the area, e.g. "Administration". */
  section?: string;
  description?: ReactNode;
  /** Buttons on the right, e.g. "Invite a user". */
  actions?: ReactNode;
}

export function PageHeader({ title, section, description, actions }: PageHeaderProps) {
  usePageTitle(title);

  return (
    <HStack as="header" justify="space-between" align="flex-end" gap="6" wrap="wrap" mb="8">
      <Stack gap="2" maxW="3xl">
        {section && (
          <Text textStyle="sectionLabel" color="accent.fg">
            {section}
          </Text>
        )}
        <Heading as="h1" size="2xl" fontWeight="600" letterSpacing="-0.01em">
          {title}
        </Heading>
        {description && (
          <Text color="fg.muted" fontSize="md">
            {description}
          </Text>
        )}
      </Stack>
      {/* At most the page's width, so that a row of buttons wraps on a phone instead of widening the page. */}
      {actions && (
        <Box flexShrink={0} maxW="full">
          {actions}
        </Box>
      )}
    </HStack>
  );
}
