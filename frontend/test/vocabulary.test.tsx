import { screen } from '@testing-library/react';
import { STUDY_STATUS_LABELS } from '@meritline/shared';
import { STATUS_LABELS } from '@/features/reviews/api/review-types';
import { StudyStatusBadge } from '@/features/studies/components/study-status-badge';
import { renderWithProviders } from './render';

describe('one word for each study status', () => {
  it('uses the same words on the badge, in the review screens and in the report', async () => {
    renderWithProviders(<StudyStatusBadge status="submitted" />);
    expect(await screen.findByText('Awaiting review')).toBeInTheDocument();
    expect(screen.queryByText('Submitted for review')).not.toBeInTheDocument();
    expect(STATUS_LABELS).toEqual(STUDY_STATUS_LABELS);
  });
});
