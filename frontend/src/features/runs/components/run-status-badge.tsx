import { Badge } from '@chakra-ui/react';
import type { RunStatus } from '@meritline/shared';

export function RunStatusBadge({ status, short = false }: { status: RunStatus; short?: boolean }) {
  return status === 'accepted' ? (
    <Badge colorPalette="brand" variant="solid" title="Every check standard recovered within the acceptance window.">
      Accepted
    </Badge>
  ) : (
    <Badge colorPalette="red" variant="solid" title="A check standard failed: the results of this run are not reportable.">
      {short ? 'Rejected' : 'Rejected: not reportable'}
    </Badge>
  );
}
