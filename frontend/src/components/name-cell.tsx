import { Stack, Text } from '@chakra-ui/react';
import type { ReactNode } from 'react';

/** The first cell of a register row: the record's name in bold, what it is or comes from beneath it. */
export function NameCell({ name, detail, minW = '14rem' }: { name: ReactNode; detail: ReactNode; minW?: string }) {
  return (
    <Stack gap="0" whiteSpace="normal" minW={minW}>
      {typeof name === 'string' ? <Text fontWeight="600">{name}</Text> : name}
      <Text fontSize="sm" color="fg.muted">
        {detail}
      </Text>
    </Stack>
  );
}
