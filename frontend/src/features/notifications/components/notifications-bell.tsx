import { formatDateTime, type NotificationDto } from '@meritline/shared';
import { Box, Button, Float, HStack, IconButton, Popover, Portal, Stack, Text } from '@chakra-ui/react';
import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { useNavigate } from 'react-router';
import { LineIcon } from '@/components/line-icon';
import { useMarkAllRead, useMarkRead } from '../api/mark-read';
import { notificationsQueries } from '../api/notifications-queries';

/** The bell in the header: unread count, the latest notices, each opening what it is about. */
export function NotificationsBell() {
  const [open, setOpen] = useState(false);
  const navigate = useNavigate();
  const list = useQuery(notificationsQueries.list());
  const markRead = useMarkRead();
  const markAllRead = useMarkAllRead();
  const unread = list.data?.unread ?? 0;

  const openNotice = (notice: NotificationDto) => {
    if (!notice.readAt) markRead.mutate(notice.id);
    setOpen(false);
    if (notice.link) void navigate(notice.link);
  };

  return (
    <Popover.Root
      open={open}
      onOpenChange={(event) => setOpen(event.open)}
      positioning={{ placement: 'bottom-end' }}
      lazyMount
      unmountOnExit
    >
      <Popover.Trigger asChild>
        <IconButton
          variant="ghost"
          size="sm"
          aria-label={unread ? `Notifications: ${unread} unread` : 'Notifications'}
          position="relative"
          data-testid="notifications-bell"
        >
          <BellIcon />
          {unread > 0 && (
            <Float placement="top-end" offset="1.5">
              <Box
                as="span"
                display="inline-flex"
                alignItems="center"
                justifyContent="center"
                minW="18px"
                h="18px"
                px="1"
                borderRadius="full"
                bg="red.solid"
                color="white"
                fontSize="11px"
                fontWeight="700"
                lineHeight="1"
                data-testid="notifications-unread"
              >
                {unread > 99 ? '99+' : unread}
              </Box>
            </Float>
          )}
        </IconButton>
      </Popover.Trigger>
      <Portal>
        <Popover.Positioner>
          <Popover.Content width="sm" maxH="28rem" overflowY="auto">
            <Popover.Body p="0">
              <HStack justify="space-between" px="4" py="3" borderBottomWidth="1px" borderColor="border">
                <Text fontWeight="600">Notifications</Text>
                <Button size="xs" variant="ghost" disabled={!unread} loading={markAllRead.isPending} onClick={() => markAllRead.mutate()}>
                  Mark all as read
                </Button>
              </HStack>
              {!list.data?.items.length ? (
                <Text px="4" py="6" color="fg.muted" fontSize="sm">
                  {list.isError ? 'The notifications could not be loaded.' : 'Nothing new.'}
                </Text>
              ) : (
                <Stack as="ul" listStyleType="none" gap="0">
                  {list.data.items.map((notice) => (
                    <Box as="li" key={notice.id} borderBottomWidth="1px" borderColor="border">
                      <Box
                        as="button"
                        width="full"
                        textAlign="start"
                        px="4"
                        py="3"
                        bg={notice.readAt ? undefined : 'brand.subtle'}
                        _hover={{ bg: 'bg.muted' }}
                        onClick={() => openNotice(notice)}
                      >
                        <Text fontSize="sm" fontWeight={notice.readAt ? '400' : '600'}>
                          {notice.message}
                        </Text>
                        <Text fontSize="xs" color="fg.muted">
                          {formatDateTime(notice.createdAt)}
                        </Text>
                      </Box>
                    </Box>
                  ))}
                </Stack>
              )}
            </Popover.Body>
          </Popover.Content>
        </Popover.Positioner>
      </Portal>
    </Popover.Root>
  );
}

function BellIcon() {
  return (
    <LineIcon size="1.2em">
      <path d="M6 8a6 6 0 1 1 12 0c0 7 3 9 3 9H3s3-2 3-9" />
      <path d="M10.3 21a1.94 1.94 0 0 0 3.4 0" />
    </LineIcon>
  );
}
