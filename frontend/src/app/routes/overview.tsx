import { Alert, Box, Card, Heading, LinkBox, LinkOverlay, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import { Role, ROLE_LABELS } from '@meritline/shared';
import { Link } from 'react-router';
import { PageHeader } from '@/components/page-header';
import { WaitingWork } from '@/features/overview/components/waiting-work';
import { useSession } from '@/lib/auth';
import { paths } from '@/lib/config/paths';
import { ExpiringMaterialsNotice } from '@/features/standards/components/expiring-materials-notice';
import { navigationFor } from '../layout/navigation';

const ROLE_WORK: Record<Role, string> = {
  [Role.Analyst]:
    'You run validation studies (calibration with standards, linearity, LOD/LOQ, recovery, precision) and quantify routine batches with released methods.',
  [Role.Reviewer]: 'You check the work of analysts as the second person and sign it or send it back with your remarks.',
  [Role.QualityManager]: 'You define methods and their acceptance criteria, release method versions and follow what changed between them.',
  [Role.Admin]: 'You invite people, decide which roles they hold and deactivate accounts that are no longer needed.',
};

function greeting(hour: number) {
  if (hour < 12) return 'Good morning';
  if (hour < 18) return 'Good afternoon';
  return 'Good evening';
}

export default function OverviewPage() {
  const { user } = useSession();
  if (!user) return null;

  const firstName = user.name.split(/\s+/)[0] ?? user.name;
  const shortcuts = navigationFor(user.roles)
    .flatMap((section) => section.items)
    .filter((item) => item.href !== paths.home.getHref());

  return (
    <>
      <PageHeader section="Overview" title={`${greeting(new Date().getHours())}, ${firstName}`} />

      <Stack gap="10">
        <WaitingWork roles={user.roles} />
        <ExpiringMaterialsNotice />
        <Stack gap="4" as="section" aria-labelledby="roles-heading">
          <Heading id="roles-heading" as="h2" size="md">
            Your roles
          </Heading>
          <SimpleGrid columns={{ base: 1, md: 2 }} gap="4">
            {user.roles.map((role) => (
              <Box key={role} borderLeftWidth="3px" borderColor="brand.solid" bg="bg.panel" px="5" py="4" borderRadius="l2">
                <Text fontWeight="600">{ROLE_LABELS[role]}</Text>
                <Text color="fg.muted" fontSize="sm" mt="1">
                  {ROLE_WORK[role]}
                </Text>
              </Box>
            ))}
          </SimpleGrid>
        </Stack>

        <Stack gap="4" as="section" aria-labelledby="shortcuts-heading">
          <Heading id="shortcuts-heading" as="h2" size="md">
            Shortcuts
          </Heading>
          <SimpleGrid columns={{ base: 1, md: 2, xl: 3 }} gap="4">
            {shortcuts.map((item) => (
              <LinkBox key={item.href} asChild>
                <Card.Root
                  variant="outline"
                  bg="bg.panel"
                  transition="border-color 0.15s"
                  _hover={{ borderColor: 'brand.solid' }}
                  _focusWithin={{ borderColor: 'brand.solid' }}
                >
                  <Card.Body gap="1.5">
                    <LinkOverlay asChild fontWeight="600" color="brand.fg">
                      <Link to={item.href}>{item.label}</Link>
                    </LinkOverlay>
                    <Text color="fg.muted" fontSize="sm">
                      {item.summary}
                    </Text>
                  </Card.Body>
                </Card.Root>
              </LinkBox>
            ))}
          </SimpleGrid>
        </Stack>

        <Alert.Root status="info" colorPalette="accent" variant="surface" maxW="4xl">
          <Alert.Indicator />
          <Alert.Content>
            <Alert.Title>Before results leave the laboratory</Alert.Title>
            <Alert.Description>
              Meritline calculates and records; it does not release products or declare water fit to drink. Decisions follow your
              laboratory&apos;s procedures, a qualified second review and the regulations that apply to your samples.
            </Alert.Description>
          </Alert.Content>
        </Alert.Root>
      </Stack>
    </>
  );
}
