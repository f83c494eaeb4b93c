import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { studyReviewQueries } from '@/features/reviews/api/review-queries';
import { markSignedIn } from '@/lib/signed-in';
import { renderWithProviders, stubApi } from './render';
import { ApproveDialog } from './fixtures';

const STUDY = '7a4c2f8e-9d1b-4e5a-8c3f-2b6d9e0a1c47';
const JUSTIFICATION = 'Recovery at the lowest level is outside the range, but routine samples lie well above it.';

function renderApproval(pass: boolean) {
  markSignedIn();
  const calls = stubApi({
    [`POST /api/studies/${STUDY}/approve`]: {
      status: 200,
      body: { id: STUDY, status: 'approved', stage: null, lockVersion: 5, signature: null },
    },
  });
  const view = renderWithProviders(<ApproveDialog studyId={STUDY} lockVersion={4} />);
  view.queryClient.setQueryData(studyReviewQueries.detail(STUDY).queryKey, {
    id: STUDY,
    result: { verdict: { pass, criteria: [] } },
  } as never);
  return { ...view, calls };
}

describe('approving a study that fails its criteria', () => {
  it('asks for a written justification with a caution, refuses a short one and sends it with the signature', async () => {
    const { user, calls } = renderApproval(false);
    await user.click(screen.getByRole('button', { name: 'Approve' }));
    const dialog = await screen.findByRole('dialog');
    expect(within(dialog).getByText('This study does not meet all its acceptance criteria')).toBeInTheDocument();
    const justification = within(dialog).getByLabelText(/Justification for approving although criteria are not met/);
    await user.type(within(dialog).getByLabelText(/Your password/), 'meritline-demo');
    await user.type(justification, 'Looks fine.');
    await user.click(within(dialog).getByRole('button', { name: 'Sign and approve' }));
    expect(await within(dialog).findByText('Write at least 20 characters.')).toBeInTheDocument();
    const approvals = () => calls.filter((call) => call.key.startsWith('POST '));
    expect(approvals()).toHaveLength(0);

    await user.clear(justification);
    await user.type(justification, JUSTIFICATION);
    await user.click(within(dialog).getByRole('button', { name: 'Sign and approve' }));
    await waitFor(() => expect(approvals()[0]?.body).toEqual({ password: 'meritline-demo', justification: JUSTIFICATION, lockVersion: 4 }));
  });

  it('shows no justification field when the study meets its criteria', async () => {
    const { user } = renderApproval(true);
    await user.click(screen.getByRole('button', { name: 'Approve' }));
    const dialog = await screen.findByRole('dialog');
    expect(within(dialog).queryByLabelText(/Justification/)).not.toBeInTheDocument();
  });
});
