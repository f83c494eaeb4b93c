import { screen, waitFor, within } from '@testing-library/react';
import { BrokenSignatureWarning, SignaturesPanel } from '@/features/reviews/components/signatures-panel';
import type { Signature } from '@/features/reviews/api/review-types';
import { isSignedIn, markSignedIn } from '@/lib/signed-in';
import { renderWithProviders, stubApi } from './render';
import { ApproveDialog } from './fixtures';

const STUDY = '3f1a2b4c-5d6e-4f70-8a9b-0c1d2e3f4a5b';

const signature = (overrides: Partial<Signature>): Signature => ({
  id: 'sig-1',
  signerId: 'u-1',
  signerName: 'Alma Ruiz',
  signerRole: 'analyst' as Signature['signerRole'],
  meaning: 'authored',
  signedAt: '2026-11-20T08:15:00.000Z',
  contentHash: 'a'.repeat(64),
  comment: null,
  valid: true,
  superseded: false,
  ...overrides,
});

describe('electronic signatures on the review page', () => {
  it('shows each signature with its meaning, signer, role and UTC time, and flags a broken one', () => {
    const signatures = [
      signature({}),
      signature({
        id: 'sig-2',
        signerName: 'Priya Nair',
        signerRole: 'reviewer' as Signature['signerRole'],
        meaning: 'reviewed-and-approved',
        signedAt: '2026-11-21T14:02:00.000Z',
        valid: false,
      }),
    ];
    renderWithProviders(
      <>
        <BrokenSignatureWarning signatures={signatures} />
        <SignaturesPanel signatures={signatures} />
      </>,
    );
    const [authored, approved] = screen.getAllByTestId('signature');
    expect(within(authored).getByText('Author: submitted for review')).toBeInTheDocument();
    expect(within(authored).getByText('2026-11-20 08:15 UTC')).toBeInTheDocument();
    expect(within(authored).getByText('Intact')).toBeInTheDocument();
    expect(within(approved).getByText('Priya Nair · signed as Reviewer')).toBeInTheDocument();
    expect(within(approved).getByText('Broken: content changed')).toBeInTheDocument();
    expect(screen.getByTestId('broken-signature-warning')).toHaveTextContent('no longer match what Priya Nair signed');
  });

  it('shows no warning while every signature is intact', () => {
    renderWithProviders(<BrokenSignatureWarning signatures={[signature({})]} />);
    expect(screen.queryByTestId('broken-signature-warning')).not.toBeInTheDocument();
  });

  it('states what approving means, shows a refused password in the dialog and keeps the user signed in', async () => {
    markSignedIn();
    const calls = stubApi({
      [`POST /api/studies/${STUDY}/approve`]: {
        status: 401,
        body: { statusCode: 401, message: 'Password not correct; nothing was signed.' },
      },
    });
    const { user } = renderWithProviders(<ApproveDialog studyId={STUDY} lockVersion={4} />);
    await user.click(screen.getByRole('button', { name: 'Approve' }));
    const dialog = await screen.findByRole('dialog');
    expect(within(dialog).getByText('By signing you confirm you reviewed this study and approve its results.')).toBeInTheDocument();

    await user.click(within(dialog).getByRole('button', { name: 'Sign and approve' }));
    expect(await within(dialog).findByText('Enter your password to sign.')).toBeInTheDocument();
    expect(calls.filter((c) => c.key.startsWith('POST'))).toHaveLength(0);

    await user.type(within(dialog).getByLabelText(/Your password/), 'wrong-password');
    await user.click(within(dialog).getByRole('button', { name: 'Sign and approve' }));
    expect(await within(dialog).findByText('Password not correct; nothing was signed.')).toBeInTheDocument();
    await waitFor(() => expect(calls.find((c) => c.key.startsWith('POST'))?.body).toEqual({ password: 'wrong-password', lockVersion: 4 }));
    expect(isSignedIn()).toBe(true);
  });
});
