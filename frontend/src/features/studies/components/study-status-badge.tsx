import { Badge } from '@chakra-ui/react';
import { STUDY_STATUS_LABELS, type StudyStatus } from '@meritline/shared';

export const STUDY_STATUS_WORDS: Record<StudyStatus, { label: string; palette: string; variant: 'subtle' | 'solid' | 'outline' }> = {
  draft: { label: STUDY_STATUS_LABELS.draft, palette: 'gray', variant: 'outline' },
  submitted: { label: STUDY_STATUS_LABELS.submitted, palette: 'accent', variant: 'subtle' },
  returned: { label: STUDY_STATUS_LABELS.returned, palette: 'red', variant: 'subtle' },
  approved: { label: STUDY_STATUS_LABELS.approved, palette: 'brand', variant: 'solid' },
};

export function StudyStatusBadge({ status }: { status: StudyStatus }) {
  const words = STUDY_STATUS_WORDS[status] ?? { label: status, palette: 'gray', variant: 'outline' };
  return (
    <Badge colorPalette={words.palette} variant={words.variant} data-status={status}>
      {words.label}
    </Badge>
  );
}
