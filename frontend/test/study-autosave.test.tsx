import { screen, waitFor } from '@testing-library/react';
import { routes } from '@/app/router';
import { markSignedIn } from '@/lib/signed-in';
import { renderRoutes, stubApi } from './render';
import { activeVersion, nitrateMethod } from './fixtures';

// Plotly does not run in jsdom; the steps used here draw nothing anyway.
vi.mock('@/components/study-results/plotly-chart', () => ({ default: () => null }));

const analyst = { id: 'u-1', email: 'mira.okafor@lab.example', name: 'Mira Okafor', roles: ['analyst'] };

// An invented draft of the demo laboratory.
const study = {
  id: 'st-1',
  title: 'Nitrate by IC: repeatability check',
  status: 'draft',
  methodVersionId: 'mv-2',
  method: nitrateMethod,
  methodVersion: activeVersion,
  data: {
    units: { x: 'mg/L', y: 'µS·min' },
    criteria: [],
    model: 'linear',
    weighting: 'none',
    standards: [],
    precision: [
      { group: 'day 1', value: 5.02 },
      { group: 'day 1', value: 4.97 },
    ],
  },
  result: null,
  resultErrors: [{ field: 'standards', code: 'too_few', message: 'regression statistics need at least 3 standards (0 given)' }],
  engineVersion: '1.0.0',
  dataHash: 'x',
  meta: {},
  author: { id: 'u-1', name: 'Mira Okafor' },
  editorIds: ['u-1'],
  copiedFromId: null,
  lockVersion: 3,
  createdAt: '2026-11-30T09:00:00.000Z',
  updatedAt: '2026-11-30T09:00:00.000Z',
  submittedAt: null,
  approvedAt: null,
};

function openPrecisionStep(patch: (body: unknown) => { status?: number; body?: unknown }) {
  markSignedIn();
  const calls = stubApi({
    'GET /api/auth/me': { body: analyst },
    'GET /api/studies/st-1': { body: study },
    'PATCH /api/studies/st-1': patch,
  });
  const view = renderRoutes(routes, '/studies/st-1/edit?step=5');
  return { ...view, calls };
}

describe('autosave of a study draft', () => {
  it('saves a change with the lock version it read and says when', async () => {
    const { user, calls } = openPrecisionStep((body) => ({ body: { ...study, ...(body as object), lockVersion: 4 } }));
    const grid = await screen.findByRole('table', { name: 'Precision results' });
    await user.type(screen.getByRole('textbox', { name: 'Series (day, analyst, instrument), row 3' }), 'day 2');
    await user.type(screen.getByRole('textbox', { name: 'Result, row 3' }), '5,08');

    await waitFor(() => expect(screen.getByTestId('save-status')).toHaveTextContent(/^Saved/), { timeout: 5000 });
    const patches = calls.filter((c) => c.key === 'PATCH /api/studies/st-1');
    expect(patches).toHaveLength(1);
    expect(patches[0].body).toMatchObject({
      lockVersion: 3,
      data: {
        precision: [
          { group: 'day 1', value: 5.02 },
          { group: 'day 1', value: 4.97 },
          { group: 'day 2', value: 5.08 },
        ],
      },
    });
    expect(grid).toBeInTheDocument();
  });

  it('stops and offers a reload when someone else saved first', async () => {
    const { user } = openPrecisionStep(() => ({
      status: 409,
      body: { statusCode: 409, message: 'Someone else changed this study; reload it and try again.' },
    }));
    await user.type(await screen.findByRole('textbox', { name: 'Result, row 1' }), '1');

    expect(await screen.findByText('Someone else saved this study while you were editing', {}, { timeout: 5000 })).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Reload the study' })).toBeInTheDocument();
    expect(screen.getByTestId('save-status')).toHaveTextContent('Not saved: someone else saved first');
  });
});
