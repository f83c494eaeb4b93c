import { Avatar, Box, Button, CloseButton, Drawer, Flex, HStack, IconButton, Link, Menu, Portal, Stack, Text } from '@chakra-ui/react';
import type { Role, CurrentUser } from '@meritline/shared';
import { useState, type ReactNode } from 'react';
import { NavLink, Link as RouterLink } from 'react-router';
import { BrandMark } from '@/components/brand-mark';
import { LineIcon } from '@/components/line-icon';
import { ColorModeButton } from '@/components/ui/color-mode';
import { NotificationsBell } from '@/features/notifications/components/notifications-bell';
import { paths } from '@/lib/config/paths';
import { formatRoles } from '@/lib/format';
import { navigationFor } from './navigation';

export interface AppShellProps {
  user: CurrentUser;
  onSignOut: () => void;
  children: ReactNode;
}

export function AppShell({ user, onSignOut, children }: AppShellProps) {
  const [drawerOpen, setDrawerOpen] = useState(false);

  return (
    <Flex minH="100dvh" bg="bg.canvas">
      <Box
        as="aside"
        display={{ base: 'none', lg: 'flex' }}
        flexDirection="column"
        width="264px"
        flexShrink={0}
        bg="bg.rail"
        color="fg.rail"
        position="sticky"
        top="0"
        height="100dvh"
        overflowY="auto"
      >
        <Sidebar roles={user.roles} />
      </Box>

      <Drawer.Root open={drawerOpen} onOpenChange={(event) => setDrawerOpen(event.open)} placement="start">
        <Portal>
          <Drawer.Backdrop />
          <Drawer.Positioner>
            <Drawer.Content bg="bg.rail" color="fg.rail" maxW="280px">
              <Drawer.CloseTrigger asChild>
                <CloseButton size="sm" color="fg.rail" _hover={{ bg: 'whiteAlpha.200' }} />
              </Drawer.CloseTrigger>
              <Sidebar roles={user.roles} onNavigate={() => setDrawerOpen(false)} />
            </Drawer.Content>
          </Drawer.Positioner>
        </Portal>
      </Drawer.Root>

      <Flex direction="column" flex="1" minW="0">
        <HStack
          as="header"
          justify="space-between"
          gap="4"
          px={{ base: '4', md: '8' }}
          py="3"
          bg="bg.panel"
          borderBottomWidth="1px"
          borderColor="border"
          position="sticky"
          top="0"
          zIndex="sticky"
        >
          <HStack gap="2" display={{ base: 'flex', lg: 'none' }}>
            <IconButton variant="ghost" size="sm" aria-label="Open the navigation" onClick={() => setDrawerOpen(true)}>
              <MenuIcon />
            </IconButton>
            <Wordmark />
          </HStack>
          <Box flex="1" />
          <HStack gap="2">
            <ColorModeButton />
            <NotificationsBell />
            <UserMenu user={user} onSignOut={onSignOut} />
          </HStack>
        </HStack>
        <Box as="main" id="main" flex="1" px={{ base: '4', md: '8', xl: '12' }} py={{ base: '6', md: '10' }} maxW="1400px" width="full">
          {children}
        </Box>
      </Flex>
    </Flex>
  );
}

function Sidebar({ roles, onNavigate }: { roles: readonly Role[]; onNavigate?: () => void }) {
  return (
    <Stack gap="8" px="4" py="6" flex="1">
      <Box px="3">
        <Wordmark onRail />
      </Box>
      <Stack as="nav" aria-label="Main" gap="6">
        {navigationFor(roles).map((section) => (
          <Stack key={section.label} gap="1" role="group" aria-label={section.label}>
            <Text textStyle="sectionLabel" color="fg.railMuted" px="3" pb="1">
              {section.label}
            </Text>
            {section.items.map((item) => (
              <Link
                key={item.href}
                asChild
                px="3"
                py="2"
                borderRadius="l2"
                fontSize="sm"
                fontWeight="500"
                color="fg.rail"
                textDecoration="none"
                borderLeftWidth="3px"
                borderColor="transparent"
                _hover={{ bg: 'whiteAlpha.100', textDecoration: 'none' }}
                _currentPage={{ bg: 'whiteAlpha.200', borderColor: 'amber.400', fontWeight: '600' }}
                _focusVisible={{ outline: '2px solid', outlineColor: 'amber.400', outlineOffset: '1px' }}
              >
                <NavLink to={item.href} end onClick={onNavigate}>
                  {item.label}
                </NavLink>
              </Link>
            ))}
          </Stack>
        ))}
      </Stack>
    </Stack>
  );
}

function Wordmark({ onRail = false }: { onRail?: boolean }) {
  return (
    <Link asChild textDecoration="none" _hover={{ textDecoration: 'none' }} color={onRail ? 'fg.rail' : 'fg'}>
      <RouterLink to={paths.home.getHref()} aria-label="Meritline overview">
        <BrandMark onRail={onRail} />
      </RouterLink>
    </Link>
  );
}

function UserMenu({ user, onSignOut }: { user: CurrentUser; onSignOut: () => void }) {
  return (
    <Menu.Root positioning={{ placement: 'bottom-end' }}>
      <Menu.Trigger asChild>
        <Button variant="ghost" size="md" px="2" gap="3" aria-label={`Account of ${user.name}`} data-testid="user-menu">
          <Avatar.Root size="xs" colorPalette="brand" variant="solid">
            <Avatar.Fallback name={user.name} />
          </Avatar.Root>
          <Stack gap="0" align="flex-start" textAlign="start" display={{ base: 'none', sm: 'flex' }}>
            <Text fontSize="sm" fontWeight="600" lineHeight="1.2">
              {user.name}
            </Text>
            <Text fontSize="xs" color="fg.muted" lineHeight="1.2" data-testid="user-roles">
              {formatRoles(user.roles)}
            </Text>
          </Stack>
        </Button>
      </Menu.Trigger>
      <Portal>
        <Menu.Positioner>
          <Menu.Content minW="56">
            <Box px="2" py="1.5">
              <Text fontSize="sm" fontWeight="600">
                {user.name}
              </Text>
              <Text fontSize="xs" color="fg.muted">
                {user.email}
              </Text>
              <Text fontSize="xs" color="fg.muted">
                {formatRoles(user.roles)}
              </Text>
            </Box>
            <Menu.Separator />
            <Menu.Item value="password" asChild>
              <RouterLink to={paths.changePassword.getHref()}>Change password</RouterLink>
            </Menu.Item>
            <Menu.Item value="sign-out" onSelect={onSignOut}>
              Sign out
            </Menu.Item>
          </Menu.Content>
        </Menu.Positioner>
      </Portal>
    </Menu.Root>
  );
}

function MenuIcon() {
  return (
    <LineIcon size="1.2em">
      <path d="M4 7h16M4 12h16M4 17h16" />
    </LineIcon>
  );
}
