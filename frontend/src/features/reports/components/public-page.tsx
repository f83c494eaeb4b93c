import { Box, Button, Container, HStack, Text } from '@chakra-ui/react';
import { useEffect, type ReactNode } from 'react';
import { Link } from 'react-router';
import { ColorModeButton } from '@/components/ui/color-mode';
import { paths } from '@/lib/config/paths';
import { useSessionToken } from '@/lib/session-token';

/** A page anyone may open without an account, e.g. from the address printed in a report. */
export function PublicPage({ title, children }: { title: string; children: ReactNode }) {
  const signedIn = useSessionToken() !== null;
  useEffect(() => {
    document.title = `${title} · Meritline`;
  }, [title]);

  return (
    <Box minH="100dvh" bg="bg.canvas">
      <Box as="header" bg="bg.rail" color="fg.rail">
        <Container maxW="4xl" py="3">
          <HStack justify="space-between">
            <HStack gap="3">
              <svg viewBox="0 0 32 32" width="28" height="28" aria-hidden="true">
                <rect width="32" height="32" rx="7" fill="rgba(255,255,255,0.1)" />
                <path
                  d="M7 23V9l9 9 9-9v14"
                  fill="none"
                  stroke="var(--chakra-colors-amber-400)"
                  strokeWidth="3"
                  strokeLinecap="round"
                  strokeLinejoin="round"
                />
              </svg>
              <Text fontWeight="700" fontSize="lg" letterSpacing="-0.01em">
                Meritline
              </Text>
            </HStack>
            <HStack gap="2">
              <Button asChild size="sm" variant="outline" color="fg.rail" borderColor="whiteAlpha.400" _hover={{ bg: 'whiteAlpha.200' }}>
                <Link to={signedIn ? paths.home.getHref() : paths.signIn.getHref()}>{signedIn ? 'Back to Meritline' : 'Sign in'}</Link>
              </Button>
              <ColorModeButton color="fg.rail" />
            </HStack>
          </HStack>
        </Container>
      </Box>
      <Container as="main" maxW="4xl" py={{ base: '8', md: '12' }}>
        {children}
      </Container>
    </Box>
  );
}
