import { screen, waitFor } from '@testing-library/react';
import { vi } from 'vitest';
import { ReportDownloadButton } from '@/components/report-download-button';
import { markSignedIn } from '@/lib/signed-in';
import { renderWithProviders, stubApi } from './render';

const STUDY = '9b0c6d52-1e7f-4a3b-8c2d-5f6e7a8b9c01';

describe('report download button', () => {
  beforeEach(() => {
    markSignedIn();
    vi.stubGlobal('URL', Object.assign(URL, { createObjectURL: vi.fn(() => 'blob:report'), revokeObjectURL: vi.fn() }));
  });

  it('downloads the signed report of an approved study as a call of the web app', async () => {
    const click = vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(() => {});
    const calls = stubApi({ [`GET /api/studies/${STUDY}/report`]: { body: '%PDF' } });
    const { user } = renderWithProviders(<ReportDownloadButton studyId={STUDY} status="approved" />);

    await user.click(screen.getByRole('button', { name: 'Download signed report' }));

    await waitFor(() => expect(click).toHaveBeenCalledTimes(1));
    expect(calls[0].headers['X-Requested-With']).toBe('meritline');
    expect(calls[0].headers).not.toHaveProperty('Authorization');
    expect((click.mock.contexts[0] as HTMLAnchorElement).download).toBe('meritline-study-9b0c6d52.pdf');
  });

  it('offers a draft preview before approval', () => {
    stubApi({});
    renderWithProviders(<ReportDownloadButton studyId={STUDY} status="submitted" />);
    expect(screen.getByRole('button', { name: 'Preview draft report' })).toBeInTheDocument();
  });
});
