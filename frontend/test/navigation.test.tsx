import { Role } from '@meritline/shared';
import { screen, waitFor, within } from '@testing-library/react';
import { navigationFor } from '@/app/layout/navigation';
import { routes } from '@/app/router';
import { markSignedIn } from '@/lib/signed-in';
import { renderRoutes, stubApi } from './render';

const ENTRIES_BY_ROLE: Record<Role, string[]> = {
  [Role.Analyst]: ['Validation studies', 'Routine batches', 'Standard preparations'],
  [Role.Reviewer]: ['Review queue'],
  [Role.QualityManager]: ['Methods', 'Version comparison', 'Audit trail', 'Self-qualification'],
  [Role.Admin]: ['Validation studies', 'Users', 'Outbox', 'Audit trail', 'Self-qualification'],
};
const FOR_EVERYONE = ['Overview', 'Reference materials', 'Verify a report'];
const ALL_ROLE_ENTRIES = Object.values(ENTRIES_BY_ROLE).flat();

function signInAs(roles: Role[]) {
  const user = { id: 'u-7', email: 'jonas.weber@lab.example', name: 'Jonas Weber', roles };
  markSignedIn();
  return stubApi({ 'GET /api/auth/me': { body: user }, 'GET /api/users': { body: [] }, 'GET /api/outbox': { body: [] } });
}

async function mainNavigationLinks() {
  // jsdom applies no media queries, so the desktop sidebar counts as hidden there.
  const nav = await screen.findByRole('navigation', { name: 'Main', hidden: true });
  return within(nav)
    .getAllByRole('link', { hidden: true })
    .map((link) => link.textContent);
}

describe('navigation by role', () => {
  it.each(Object.values(Role))('shows %s their own entries and no others', async (role) => {
    signInAs([role]);
    renderRoutes(routes, '/');

    const links = await mainNavigationLinks();
    const expected = [...FOR_EVERYONE, ...ENTRIES_BY_ROLE[role]];
    expect(links.sort()).toEqual(expected.sort());
    expect(links.filter((label) => ALL_ROLE_ENTRIES.includes(label ?? '') && !ENTRIES_BY_ROLE[role].includes(label ?? ''))).toEqual([]);
  });

  it('shows the union of entries to someone holding several roles', async () => {
    signInAs([Role.Analyst, Role.Reviewer]);
    renderRoutes(routes, '/');

    const links = await mainNavigationLinks();
    expect(links.sort()).toEqual(
      [...FOR_EVERYONE, 'Validation studies', 'Routine batches', 'Standard preparations', 'Review queue'].sort(),
    );
  });

  it('names the signed-in user and their roles in the shell', async () => {
    signInAs([Role.QualityManager, Role.Admin]);
    renderRoutes(routes, '/');

    expect(await screen.findByTestId('user-roles')).toHaveTextContent('Quality manager, Administrator');
    expect(screen.getByTestId('user-menu')).toHaveTextContent('Jonas Weber');
  });

  it('keeps the order of the sections whatever the order of the roles', () => {
    const labels = (roles: Role[]) => navigationFor(roles).map((section) => section.label);
    expect(labels([Role.Admin, Role.Analyst])).toEqual(labels([Role.Analyst, Role.Admin]));
  });
});

describe('route guards', () => {
  it('sends a signed-out visitor to sign-in and remembers the page', async () => {
    stubApi({});
    const { router } = renderRoutes(routes, '/admin/users');

    await waitFor(() => expect(router.state.location.pathname).toBe('/sign-in'));
    expect(router.state.location.search).toBe('?redirectTo=%2Fadmin%2Fusers');
  });

  it('tells a user without the role that the page is not for them', async () => {
    signInAs([Role.Analyst]);
    renderRoutes(routes, '/admin/users');

    expect(await screen.findByRole('heading', { name: /This page is for the role Administrator/ })).toBeInTheDocument();
    expect(screen.queryByRole('table', { name: 'Users' })).not.toBeInTheDocument();
  });

  it('forgets the page after signing out on purpose', async () => {
    signInAs([Role.Reviewer]);
    const { user, router } = renderRoutes(routes, '/reviews');

    await user.click(await screen.findByTestId('user-menu'));
    await user.click(await screen.findByRole('menuitem', { name: 'Sign out' }));

    await waitFor(() => expect(router.state.location.pathname).toBe('/sign-in'));
    expect(router.state.location.search).toBe('');
    expect(localStorage.length).toBe(0);
  });

  it('signs out when the server no longer accepts the session', async () => {
    markSignedIn();
    stubApi({ 'GET /api/auth/me': { status: 401, body: { statusCode: 401, message: 'Unauthorized' } } });
    const { router } = renderRoutes(routes, '/runs');

    await waitFor(() => expect(router.state.location.pathname).toBe('/sign-in'));
    expect(router.state.location.search).toBe('?redirectTo=%2Fruns');
    expect(localStorage.length).toBe(0);
  });
});
