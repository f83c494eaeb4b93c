import { Link, Stack, Text } from '@chakra-ui/react';
import type { ReactNode } from 'react';
import { Link as RouterLink } from 'react-router';

export interface NameCellProps {
  name: ReactNode;
  /** The record's own page: the name links there. */
  href?: string;
  detail: ReactNode;
  minW?: string;
}

/** The first cell of a register row: the record's name in bold, what it is or comes from beneath it. */
export function NameCell({ name, href, detail, minW = '14rem' }: NameCellProps) {
  return (
    <Stack gap="0" whiteSpace="normal" minW={minW}>
      {href ? (
        <Link asChild fontWeight="600" color="brand.fg">
          <RouterLink to={href}>{name}</RouterLink>
        </Link>
      ) : typeof name === 'string' ? (
        <Text fontWeight="600">{name}</Text>
      ) : (
        name
      )}
      <Text fontSize="sm" color="fg.muted">
        {detail}
      </Text>
    </Stack>
  );
}
