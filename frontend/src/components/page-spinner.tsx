import { Box, Spinner, Text, VStack } from '@chakra-ui/react';

export function PageSpinner({ label = 'Loading' }: { label?: string }) {
  return (
    <Box minH="50vh" display="grid" placeItems="center" role="status" aria-live="polite">
      <VStack gap="3">
        <Spinner size="lg" color="brand.solid" borderWidth="3px" />
        <Text color="fg.muted" fontSize="sm">
          {label}…
        </Text>
      </VStack>
    </Box>
  );
}
