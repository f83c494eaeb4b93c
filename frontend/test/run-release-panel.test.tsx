import { screen, within } from '@testing-library/react';
import { RunReviewStatus, type RunReviewDto } from '@meritline/shared';
import { RunReleasePanel } from '@/features/runs/components/run-release-panel';
import { renderWithProviders } from './render';

const review = (overrides: Partial<RunReviewDto>): RunReviewDto => ({
  runId: 'run-1',
  reviewStatus: RunReviewStatus.Released,
  lockVersion: 3,
  authorId: 'u-1',
  submittedAt: '2026-11-20T08:15:00.000Z',
  releasedAt: '2026-11-20T09:40:00.000Z',
  returnComment: null,
  supersedesId: null,
  supersededById: null,
  supersedeReason: null,
  signatures: [
    {
      id: 's-1',
      signerId: 'u-1',
      signerName: 'Alma Ruiz',
      signerRole: 'analyst' as never,
      meaning: 'performed',
      signedAt: '2026-11-20T08:15:00.000Z',
      contentHash: 'a'.repeat(64),
      valid: true,
    },
    {
      id: 's-2',
      signerId: 'u-2',
      signerName: 'Priya Nair',
      signerRole: 'reviewer' as never,
      meaning: 'reviewed-and-released',
      signedAt: '2026-11-20T09:40:00.000Z',
      contentHash: 'a'.repeat(64),
      valid: false,
    },
  ],
  ...overrides,
});

describe('run release panel', () => {
  it('shows the status in words and each signature with printed name, meaning and time', () => {
    renderWithProviders(<RunReleasePanel review={review({})} />);
    expect(screen.getByText('Reviewed and released', { selector: 'span' })).toBeInTheDocument();
    const rows = within(screen.getByRole('table', { name: 'Signatures' })).getAllByRole('row');
    expect(rows).toHaveLength(3);
    expect(within(rows[1]).getByText('Alma Ruiz')).toBeInTheDocument();
    expect(within(rows[1]).getByText('Performed')).toBeInTheDocument();
    expect(within(rows[1]).getByText('Unchanged since signing')).toBeInTheDocument();
    expect(within(rows[2]).getByText('Priya Nair')).toBeInTheDocument();
    expect(within(rows[2]).getByText('Changed since signing')).toBeInTheDocument();
    expect(screen.queryByText(/released-/)).not.toBeInTheDocument();
  });

  it('links the correction that replaced a released run, with the reason', () => {
    renderWithProviders(
      <RunReleasePanel
        review={review({ reviewStatus: RunReviewStatus.Superseded, supersededById: 'run-2', supersedeReason: 'Wrong vial read as S-1.' })}
      />,
    );
    expect(screen.getByText('Replaced by a correction')).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'correction run' })).toHaveAttribute('href', '/runs/run-2');
    expect(screen.getByText(/Wrong vial read as S-1\./)).toBeInTheDocument();
  });
});
