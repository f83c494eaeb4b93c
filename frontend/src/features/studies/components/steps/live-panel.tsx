import { Alert, Box, Heading, HStack, Spinner, Stack, Text } from '@chakra-ui/react';
import type { ReactNode } from 'react';
import type { LiveEvaluation } from '../../hooks/use-live-evaluation';

const sentence = (text: string) => text.charAt(0).toUpperCase() + text.slice(1).replace(/([^.])$/, '$1.');

/** A side panel whose figures follow the grid as it is typed, computed in the browser. */
export function LivePanel({ title, live, children }: { title: string; live: LiveEvaluation; children: ReactNode }) {
  return (
    <Box
      as="aside"
      aria-label={title}
      borderWidth="1px"
      borderColor="border"
      borderRadius="l3"
      bg="bg.panel"
      p="4"
      position={{ xl: 'sticky' }}
      top={{ xl: '24' }}
    >
      <Stack gap="3">
        <HStack justify="space-between">
          <Heading as="h2" size="sm">
            {title}
          </Heading>
          {live.isUpdating ? (
            <HStack gap="1.5" color="fg.muted" fontSize="xs" role="status">
              <Spinner size="xs" />
              <Text>Updating…</Text>
            </HStack>
          ) : (
            <Text fontSize="xs" color="fg.muted">
              Live, computed in your browser
            </Text>
          )}
        </HStack>
        {live.errors.length > 0 && (
          <Alert.Root status="info" variant="subtle" size="sm">
            <Alert.Indicator />
            <Alert.Content>
              <Alert.Title>Not computed yet</Alert.Title>
              {live.errors.slice(0, 4).map((e, i) => (
                <Alert.Description key={i}>{sentence(e.message)}</Alert.Description>
              ))}
            </Alert.Content>
          </Alert.Root>
        )}
        {children}
      </Stack>
    </Box>
  );
}

export function FigureLine({ label, value }: { label: string; value: string }) {
  return (
    <HStack justify="space-between" gap="4" fontSize="sm" borderBottomWidth="1px" borderColor="border.muted" py="1">
      <Text color="fg.muted">{label}</Text>
      <Text fontWeight="500" textAlign="end">
        {value}
      </Text>
    </HStack>
  );
}
