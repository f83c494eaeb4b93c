import { Role } from '@meritline/shared';
import { screen, within } from '@testing-library/react';
import { routes } from '@/app/router';
import { markSignedIn } from '@/lib/signed-in';
import { renderRoutes, stubApi } from './render';

const entry = {
  seq: 41,
  at: '2026-11-20T09:15:00.000Z',
  actorId: 'u-3',
  actorName: 'Priya Nair',
  action: 'study.returned',
  actionText: 'Study returned for changes',
  entity: 'study',
  entityId: 's-1',
  recordText: 'Validation study',
  changes: { status: { from: 'submitted', to: 'returned' } },
  changesInWords: [{ field: 'Status', from: 'Awaiting review', to: 'Returned for changes' }],
  reason: 'Blank 3 is higher than the others.',
};

function signInAs(roles: Role[]) {
  markSignedIn();
  return stubApi({
    'GET /api/auth/me': { body: { id: 'u-9', email: 'quality@lab.example', name: 'Noor Quality', roles } },
    'GET /api/audit?pageSize=25': {
      body: { items: [entry], total: 1, totalIsCapped: false, nextCursor: null, page: null, pageSize: 25, record: null },
    },
    'GET /api/audit/people': { body: [{ id: 'u-3', name: 'Priya Nair' }] },
    'GET /api/audit/reviews': { body: [] },
    'GET /api/audit/verify': {
      body: {
        ok: false,
        rows: 120,
        brokenAt: 17,
        reason: 'content does not match its hash',
        broken: [{ seq: 17, reason: 'content does not match its hash' }],
      },
    },
  });
}

describe('audit trail screen', () => {
  it('shows entries in words and explains a broken chain', async () => {
    signInAs([Role.QualityManager]);
    const { user } = renderRoutes(routes, '/audit-trail');

    const table = within(await screen.findByRole('table', { name: 'Audit trail' }));
    expect(await table.findByText('Study returned for changes')).toBeInTheDocument();
    expect(table.getByText(/Blank 3 is higher than the others\./)).toBeInTheDocument();
    expect(table.getByText('Returned for changes')).toBeInTheDocument();
    expect(screen.queryByText('study.returned')).not.toBeInTheDocument();

    await user.click(screen.getByRole('button', { name: 'Verify the chain' }));
    expect(await screen.findByText(/The chain is broken: 1 finding over 120 entries/)).toBeInTheDocument();
    expect(screen.getByText(/Entry 17: This entry was changed after it was written/)).toBeInTheDocument();
    expect(screen.getByText(/filter it to one record or give both the first and the last day/)).toBeInTheDocument();
  });

  it('offers an analyst the trail of their records without the chain check or the review', async () => {
    signInAs([Role.Analyst]);
    renderRoutes(routes, '/audit-trail');

    const table = within(await screen.findByRole('table', { name: 'Audit trail' }));
    expect(await table.findByText('Study returned for changes')).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Verify the chain' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Mark as reviewed' })).not.toBeInTheDocument();
  });
});
