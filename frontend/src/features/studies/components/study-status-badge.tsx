import { Badge } from '@chakra-ui/react';
import type { StudyStatus } from '@meritline/shared';

export const STUDY_STATUS_WORDS: Record<StudyStatus, { label: string; palette: string; variant: 'subtle' | 'solid' | 'outline' }> = {
  draft: { label: 'Draft', palette: 'gray', variant: 'outline' },
  submitted: { label: 'Submitted for review', palette: 'accent', variant: 'subtle' },
  returned: { label: 'Returned for changes', palette: 'red', variant: 'subtle' },
  approved: { label: 'Approved', palette: 'brand', variant: 'solid' },
};

export function StudyStatusBadge({ status }: { status: StudyStatus }) {
  const words = STUDY_STATUS_WORDS[status] ?? { label: status, palette: 'gray', variant: 'outline' };
  return (
    <Badge colorPalette={words.palette} variant={words.variant} data-status={status}>
      {words.label}
    </Badge>
  );
}
