import { Box, Flex, Heading, Stack, Text } from '@chakra-ui/react';
import type { ReactNode } from 'react';
import { BrandMark, usePageTitle } from '@/components/brand-mark';
import { ColorModeButton } from '@/components/ui/color-mode';

export interface AuthLayoutProps {
  title: string;
  intro?: ReactNode;
  children: ReactNode;
}

/** The frame of the pages a visitor sees before signing in. */
export function AuthLayout({ title, intro, children }: AuthLayoutProps) {
  usePageTitle(title);

  return (
    <Flex minH="100dvh" direction={{ base: 'column', lg: 'row' }} bg="bg.canvas">
      <Stack
        flex={{ lg: '0 0 42%' }}
        bg="bg.rail"
        color="fg.rail"
        px={{ base: '6', md: '12' }}
        py={{ base: '8', lg: '16' }}
        justify="space-between"
        gap="10"
      >
        <BrandMark size={34} fontSize="2xl" gap="3" />
        <Stack gap="4" maxW="md" display={{ base: 'none', lg: 'flex' }}>
          <Text textStyle="sectionLabel" color="amber.300">
            Calibration and method validation
          </Text>
          <Text fontSize="2xl" fontWeight="500" lineHeight="1.35">
            From the first standard to the signed report: every response, curve and decision in one reviewed record.
          </Text>
        </Stack>
        <Text fontSize="xs" color="fg.railMuted" display={{ base: 'none', lg: 'block' }}>
          Results support, and do not replace, your laboratory&apos;s procedures and qualified review.
        </Text>
      </Stack>
      <Flex flex="1" align="center" justify="center" px={{ base: '5', md: '10' }} py={{ base: '10', md: '16' }} position="relative">
        <Box position="absolute" top="4" right="4">
          <ColorModeButton />
        </Box>
        <Stack gap="8" width="full" maxW="md">
          <Stack gap="2">
            <Heading as="h1" size="2xl" fontWeight="600">
              {title}
            </Heading>
            {intro && <Text color="fg.muted">{intro}</Text>}
          </Stack>
          {children}
        </Stack>
      </Flex>
    </Flex>
  );
}
