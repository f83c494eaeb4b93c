import { Button, HStack, Spinner, Text } from '@chakra-ui/react';
import type { SaveState } from '../../hooks/use-study-draft';

const time = new Intl.DateTimeFormat(undefined, { hour: '2-digit', minute: '2-digit' });

/** Where the draft stands: saved (when), saving, waiting, or why it is not saved. */
export function SaveStatus({ state, editable, onRetry }: { state: SaveState; editable: boolean; onRetry: () => void }) {
  if (!editable) {
    return (
      <Text fontSize="sm" color="fg.muted" data-testid="save-status">
        Read only
      </Text>
    );
  }
  switch (state.kind) {
    case 'saved':
      return (
        <Text fontSize="sm" color="fg.muted" data-testid="save-status" aria-live="polite">
          {state.at ? `Saved ${time.format(state.at)}` : 'All changes saved'}
        </Text>
      );
    case 'pending':
      return (
        <Text fontSize="sm" color="fg.muted" data-testid="save-status" aria-live="polite">
          Unsaved changes…
        </Text>
      );
    case 'saving':
      return (
        <HStack gap="2" data-testid="save-status" aria-live="polite">
          <Spinner size="xs" />
          <Text fontSize="sm">Saving…</Text>
        </HStack>
      );
    case 'needs-reason':
      return (
        <Text fontSize="sm" color="fg.warning" fontWeight="600" data-testid="save-status">
          Not saved: give the reason for the change
        </Text>
      );
    case 'incomplete':
      return (
        <Text fontSize="sm" color="fg.warning" fontWeight="600" data-testid="save-status">
          Not saved: complete the accuracy design
        </Text>
      );
    case 'conflict':
      return (
        <Text fontSize="sm" color="fg.error" fontWeight="600" data-testid="save-status">
          Not saved: someone else saved first
        </Text>
      );
    case 'error':
      return (
        <HStack gap="2" data-testid="save-status">
          <Text fontSize="sm" color="fg.error" fontWeight="600">
            Not saved
          </Text>
          <Button size="xs" variant="outline" onClick={onRetry}>
            Try again
          </Button>
        </HStack>
      );
  }
}
