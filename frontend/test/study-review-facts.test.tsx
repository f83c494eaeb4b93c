import { evaluateStudy } from '@meritline/shared';
import { screen, waitFor, within } from '@testing-library/react';
import { routes } from '@/app/router';
import { markSignedIn } from '@/lib/signed-in';
import { renderRoutes, renderWithProviders, stubApi } from './render';
import { ApproveDialog, activeVersion, nitrateMethod } from './fixtures';

// Plotly does not run in jsdom; the plots are not what these tests look at.
vi.mock('@/components/study-results/plotly-chart', () => ({ default: () => null }));

const author = { id: 'u-1', email: 'mira.okafor@lab.example', name: 'Mira Okafor', roles: ['analyst'] };
const colleague = { id: 'u-2', email: 'tomasz.weber@lab.example', name: 'Tomasz Weber', roles: ['analyst'] };
const reviewer = { id: 'u-3', email: 'priya.nair@lab.example', name: 'Priya Nair', roles: ['reviewer'] };

// An invented study of the demo laboratory: five standards, spikes, precision and a low-level blank set.
const data = {
  units: { x: 'mg/L', y: 'µS·min' },
  criteria: [],
  model: 'linear',
  weighting: 'none',
  standards: [
    { x: 0.5, y: 0.108 },
    { x: 1, y: 0.214 },
    { x: 2, y: 0.421 },
    { x: 5, y: 1.038 },
    { x: 10, y: 2.061 },
  ],
  recovery: [
    { id: 'S1', added: 1, found: 0.98 },
    { id: 'S2', added: 1, found: 1.02 },
    { id: 'S3', added: 1, found: 0.61 },
  ],
  lowSpikes: { spiked: [0.21, 0.19, 0.22, 0.2, 0.18, 0.23, 0.2], blanks: [0.01, null, 0.02] },
};

const study = (overrides: Record<string, unknown> = {}) => ({
  id: 'st-1',
  title: 'Nitrate by IC: validation',
  status: 'returned',
  methodVersionId: 'mv-2',
  method: nitrateMethod,
  methodVersion: activeVersion,
  data,
  result: evaluateStudy(data as never),
  resultErrors: null,
  engineVersion: '1.0.0',
  dataHash: 'x',
  meta: { conclusion: 'Fit for purpose.' },
  author: { id: 'u-1', name: 'Mira Okafor' },
  editorIds: ['u-1'],
  copiedFromId: null,
  lockVersion: 7,
  createdAt: '2026-11-30T09:00:00.000Z',
  updatedAt: '2026-11-30T09:00:00.000Z',
  submittedAt: '2026-11-30T10:00:00.000Z',
  approvedAt: null,
  ...overrides,
});

const history = [
  {
    id: 'audit-9',
    at: '2026-12-01T08:00:00.000Z',
    kind: 'status',
    action: 'study.returned',
    actorName: 'Priya Nair',
    summary: 'Returned to the author for changes',
    detail: 'State the working range in the conclusion.',
    changes: { status: { from: 'submitted', to: 'returned' } },
    lines: [],
  },
  {
    id: 'audit-10',
    at: '2026-12-01T09:00:00.000Z',
    kind: 'record',
    action: 'study.updated',
    actorName: 'Mira Okafor',
    summary: 'Study changed',
    detail: 'Working range stated as asked.',
    changes: {},
    lines: ['Conclusion: “Fit for purpose.” → “Fit for purpose from 0.5 to 10 mg/L.”'],
  },
];

const comment = (id: string, body: string, resolved = false) => ({
  id,
  section: 'recovery',
  threadId: null,
  authorId: 'u-3',
  authorName: 'Priya Nair',
  body,
  resolved,
  createdAt: '2026-12-01T07:50:00.000Z',
});
const comments = [
  comment('c-1', 'Spike S3 looks lost: check the vial.'),
  comment('c-2', 'Name the blank lot.'),
  comment('c-3', 'Done', true),
];

function openWizard(user: object, step: number, patch: (body: unknown) => { status?: number; body?: unknown }, overrides = {}) {
  markSignedIn();
  const calls = stubApi({
    'GET /api/auth/me': { body: user },
    'GET /api/studies/st-1': { body: study(overrides) },
    'GET /api/studies/st-1/history': { body: history },
    'GET /api/studies/st-1/comments': { body: comments },
    'PATCH /api/studies/st-1': patch,
  });
  return { ...renderRoutes(routes, `/studies/st-1/edit?step=${step}`), calls };
}

const patches = (calls: { key: string; body: unknown }[]) => calls.filter((c) => c.key === 'PATCH /api/studies/st-1');

describe('a returned study in the wizard', () => {
  it('shows the reviewer’s return comment and open comments, and saves a conclusion change only with a reason', async () => {
    const { user, calls } = openWizard(author, 8, (body) => ({ body: { ...study(), ...(body as object), lockVersion: 8 } }));
    const remarks = await screen.findByTestId('reviewer-remarks');
    expect(remarks).toHaveTextContent('State the working range in the conclusion.');
    expect(within(remarks).getByText('2 comments are still open')).toBeInTheDocument();
    expect(within(remarks).getByTestId('open-comments')).toHaveTextContent('Spike S3 looks lost: check the vial.');
    expect(within(remarks).queryByText(/Done/)).not.toBeInTheDocument();

    await user.type(screen.getByRole('textbox', { name: /Your conclusion/ }), ' From 0.5 to 10 mg/L.');
    expect(await screen.findByText(/Your change is not saved yet/, {}, { timeout: 5000 })).toBeInTheDocument();
    expect(patches(calls)).toHaveLength(0);

    await user.type(screen.getByRole('textbox', { name: /Why the study changes now/ }), 'Working range stated as asked.');
    await waitFor(() => expect(patches(calls)).toHaveLength(1), { timeout: 5000 });
    expect(patches(calls)[0].body).toMatchObject({
      lockVersion: 7,
      reason: 'Working range stated as asked.',
      meta: { conclusion: 'Fit for purpose. From 0.5 to 10 mg/L.' },
    });
  });

  it('is read-only for anyone but its author, and says why', async () => {
    const { calls } = openWizard(colleague, 8, () => ({ status: 403, body: { statusCode: 403, message: 'no' } }));
    expect(await screen.findByTestId('read-only-reason')).toHaveTextContent(
      'Only its author, Mira Okafor, may change this study; you can read it.',
    );
    expect(screen.getByRole('textbox', { name: /Your conclusion/ })).toHaveAttribute('readonly');
    expect(screen.queryByRole('textbox', { name: /Why the study changes now/ })).not.toBeInTheDocument();
    expect(patches(calls)).toHaveLength(0);
  });

  it('excludes a recovery row with a reason, as for a standard', async () => {
    const { user, calls } = openWizard(author, 4, (body) => ({ body: { ...study(), ...(body as object), lockVersion: 8 } }), {
      status: 'draft',
    });
    const grid = await screen.findByRole('table', { name: 'Recovery spikes' });
    await user.click(within(grid).getAllByRole('button', { name: 'Exclude…' })[2]);
    const dialog = await screen.findByRole('dialog');
    expect(dialog).toHaveTextContent('Exclude the spiked sample S3, found 0.61?');
    await user.type(within(dialog).getByRole('textbox', { name: /Reason/ }), 'Vial spilt before injection');
    await user.click(within(dialog).getByRole('button', { name: 'Exclude the spiked sample' }));
    expect(await within(grid).findByText('Excluded: Vial spilt before injection')).toBeInTheDocument();
    await waitFor(() => expect(patches(calls)).toHaveLength(1), { timeout: 5000 });
    expect((patches(calls)[0].body as { data: { recovery: unknown[] } }).data.recovery[2]).toEqual({
      id: 'S3',
      added: 1,
      found: 0.61,
      excluded: { reason: 'Vial spilt before injection' },
    });
  });
});

describe('the review page shows the reviewer what the author saw', () => {
  function openReview() {
    markSignedIn();
    stubApi({
      'GET /api/auth/me': { body: reviewer },
      'GET /api/studies/st-1': { body: study({ status: 'submitted' }) },
      'GET /api/studies/st-1/signatures': { body: [] },
      'GET /api/studies/st-1/history': { body: history },
      'GET /api/studies/st-1/comments': { body: comments },
      'GET /api/studies/st-1/diff': { body: null },
    });
    return renderRoutes(routes, '/studies/st-1');
  }

  it('has the points to check on the results, the method blanks on the data tab and each change in words in the history', async () => {
    const { user } = openReview();
    expect(await screen.findByRole('heading', { name: 'Points to check' })).toBeInTheDocument();
    await user.click(screen.getByRole('tab', { name: 'Data' }));
    expect(await screen.findByRole('heading', { name: 'Method blanks (detection limit)' })).toBeInTheDocument();
    expect(screen.getByRole('table', { name: 'Method blanks (detection limit)' })).toHaveTextContent('not detected');
    await user.click(screen.getByRole('tab', { name: 'History' }));
    const changes = await screen.findByTestId('history-changes');
    expect(changes).toHaveTextContent('Conclusion: “Fit for purpose.” → “Fit for purpose from 0.5 to 10 mg/L.”');
    expect(screen.getByText('Reason: Working range stated as asked.')).toBeInTheDocument();
  });

  it('tells the approver how many comments are still open and lists them', async () => {
    markSignedIn();
    stubApi({ 'GET /api/studies/st-1/comments': { body: comments } });
    const { user } = renderWithProviders(<ApproveDialog studyId="st-1" lockVersion={7} />);
    await user.click(screen.getByRole('button', { name: 'Approve' }));
    const note = await screen.findByTestId('open-comments-note');
    expect(note).toHaveTextContent('2 comments are still open.');
    expect(within(note).getByTestId('open-comments')).toHaveTextContent('Name the blank lot.');
  });
});
