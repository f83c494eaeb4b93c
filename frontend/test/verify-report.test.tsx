import { screen } from '@testing-library/react';
import { routes } from '@/app/router';
import { renderRoutes, stubApi } from './render';

const pdf = (name = 'meritline-nitrate-v2-3f2a9c1e.pdf') => new File(['%PDF-1.7 invented content'], name, { type: 'application/pdf' });

describe('verify a report page', () => {
  it('opens without signing in and says which report a valid copy is', async () => {
    const calls = stubApi({
      'POST /api/reports/verify': {
        body: {
          valid: true,
          kind: 'validation-report',
          studyId: '9b0c6d52-1e7f-4a3b-8c2d-5f6e7a8b9c01',
          studyTitle: 'Validation after the column change',
          reportId: '3f2a9c1e-7b44-4d0e-9a51-6c2d8e0f4b17',
          methodName: 'Nitrate in drinking water by ion chromatography',
          methodVersion: 2,
          signedAt: '2026-11-20T09:15:00.000Z',
          sha256: 'ab'.repeat(32),
        },
      },
    });
    const { user } = renderRoutes(routes, '/verify');

    await user.upload(await screen.findByLabelText('Report to verify (PDF)'), pdf());

    expect(await screen.findByText(/Valid: “meritline-nitrate-v2-3f2a9c1e.pdf” is an authentic report/)).toBeInTheDocument();
    expect(screen.getByText('Nitrate in drinking water by ion chromatography')).toBeInTheDocument();
    expect(screen.getByText('Version 2')).toBeInTheDocument();
    expect(screen.getByText('Validation after the column change')).toBeInTheDocument();
    expect(screen.getByText('ab'.repeat(32))).toBeInTheDocument();
    expect(calls).toHaveLength(1);
    expect(calls[0].headers).not.toHaveProperty('Authorization');
    expect(screen.getByRole('link', { name: 'Sign in' })).toBeInTheDocument();
  });

  it('explains an invalid copy and what it means', async () => {
    stubApi({
      'POST /api/reports/verify': {
        body: { valid: false, reason: 'This file names report 3f2a9c1e, but its content differs from the report as issued.' },
      },
    });
    const { user } = renderRoutes(routes, '/verify');

    await user.upload(await screen.findByLabelText('Report to verify (PDF)'), pdf('edited.pdf'));

    expect(await screen.findByText(/Not valid: “edited.pdf” is not an unchanged Meritline report/)).toBeInTheDocument();
    expect(screen.getByText(/its content differs from the report as issued/)).toBeInTheDocument();
    expect(screen.getByText(/do not rely on the figures in this file/)).toBeInTheDocument();
  });

  it('shows the server message when the check itself fails', async () => {
    stubApi({ 'POST /api/reports/verify': { status: 413, body: { statusCode: 413, message: 'File too large' } } });
    const { user } = renderRoutes(routes, '/verify');

    await user.upload(await screen.findByLabelText('Report to verify (PDF)'), pdf());

    expect(await screen.findByText('File too large')).toBeInTheDocument();
  });
});
