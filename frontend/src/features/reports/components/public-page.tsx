import { Box, Button, Container, HStack } from '@chakra-ui/react';
import type { ReactNode } from 'react';
import { Link } from 'react-router';
import { BrandMark, usePageTitle } from '@/components/brand-mark';
import { ColorModeButton } from '@/components/ui/color-mode';
import { paths } from '@/lib/config/paths';
import { useSignedIn } from '@/lib/signed-in';

/** A page anyone may open without an account, e.g. from the address printed in a report. */
export function PublicPage({ title, children }: { title: string; children: ReactNode }) {
  const signedIn = useSignedIn();
  usePageTitle(title);

  return (
    <Box minH="100dvh" bg="bg.canvas">
      <Box as="header" bg="bg.rail" color="fg.rail">
        <Container maxW="4xl" py="3">
          <HStack justify="space-between">
            <BrandMark size={28} fontSize="lg" gap="3" />
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
