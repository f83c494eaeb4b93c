import { Box, Heading, Link, Skeleton, Stack, Text } from '@chakra-ui/react';
import type { ReactNode } from 'react';
import { Link as RouterLink } from 'react-router';

export interface WorkItem {
  key: string;
  href: string;
  label: string;
  detail?: ReactNode;
}

/** One kind of waiting work: a heading, a count and each item as a link. */
export function WorkList({
  title,
  items,
  empty,
  loading = false,
  counted = true,
}: {
  title: string;
  items: WorkItem[] | undefined;
  empty: string;
  loading?: boolean;
  /** Show how many items wait; off for a single fact such as the latest review. */
  counted?: boolean;
}) {
  const count = items?.length ?? 0;
  return (
    <Box
      as="section"
      aria-label={title}
      borderWidth="1px"
      borderColor="border"
      borderLeftWidth="3px"
      borderLeftColor={count ? 'accent.solid' : 'border'}
      borderRadius="l2"
      bg="bg.panel"
      px="5"
      py="4"
    >
      <Heading as="h3" size="sm" mb="2">
        {title}
        {counted && count > 0 && (
          <Text as="span" color="fg.muted" fontWeight="normal">
            {' '}
            ({count})
          </Text>
        )}
      </Heading>
      {loading ? (
        <Skeleton height="5" />
      ) : count === 0 ? (
        <Text fontSize="sm" color="fg.muted">
          {empty}
        </Text>
      ) : (
        <Stack gap="2" as="ul" listStyleType="none">
          {items?.map((item) => (
            <Box as="li" key={item.key}>
              <Link asChild fontWeight="600" color="brand.fg">
                <RouterLink to={item.href}>{item.label}</RouterLink>
              </Link>
              {item.detail && (
                <Text fontSize="sm" color="fg.muted" lineClamp={2}>
                  {item.detail}
                </Text>
              )}
            </Box>
          ))}
        </Stack>
      )}
    </Box>
  );
}
