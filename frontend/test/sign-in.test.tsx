import { screen, waitFor } from '@testing-library/react';
import { routes } from '@/app/router';
import { isSignedIn } from '@/lib/signed-in';
import { renderRoutes, stubApi } from './render';

const analyst = { id: 'u-1', email: 'mira.okafor@lab.example', name: 'Mira Okafor', roles: ['analyst'] };

describe('sign-in page', () => {
  it('asks for both fields before sending anything', async () => {
    const calls = stubApi({});
    const { user } = renderRoutes(routes, '/sign-in');

    await user.click(await screen.findByRole('button', { name: 'Sign in' }));

    expect(await screen.findByText('Enter your e-mail address.')).toBeInTheDocument();
    expect(screen.getByText('Enter your password.')).toBeInTheDocument();
    expect(screen.getByLabelText('E-mail')).toHaveAttribute('aria-invalid', 'true');
    expect(calls).toHaveLength(0);
  });

  it('rejects an e-mail address without a domain', async () => {
    stubApi({});
    const { user } = renderRoutes(routes, '/sign-in');

    await user.type(await screen.findByLabelText('E-mail'), 'mira.okafor');
    await user.type(screen.getByLabelText('Password'), 'whatever-it-is');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByText('Enter a valid e-mail address.')).toBeInTheDocument();
  });

  it('shows the server message when the credentials are wrong and stores no token', async () => {
    stubApi({
      'POST /api/auth/login': { status: 401, body: { statusCode: 401, message: 'E-mail or password is incorrect.' } },
    });
    const { user } = renderRoutes(routes, '/sign-in');

    await user.type(await screen.findByLabelText('E-mail'), analyst.email);
    await user.type(screen.getByLabelText('Password'), 'not-the-password');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByRole('alert')).toHaveTextContent('E-mail or password is incorrect.');
    expect(isSignedIn()).toBe(false);
  });

  it('signs in and returns to the page the visitor first asked for', async () => {
    const calls = stubApi({
      'POST /api/auth/login': { body: { accessToken: 'token-123', user: analyst } },
      'GET /api/auth/me': { body: analyst },
    });
    const { user, router } = renderRoutes(routes, '/sign-in?redirectTo=%2Fstudies');

    await user.type(await screen.findByLabelText('E-mail'), `  ${analyst.email} `);
    await user.type(screen.getByLabelText('Password'), 'correct horse');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    await waitFor(() => expect(router.state.location.pathname).toBe('/studies'));
    expect(await screen.findByRole('heading', { name: 'Validation studies', level: 1 })).toBeInTheDocument();
    expect(isSignedIn()).toBe(true);
    expect(localStorage.getItem('meritline.signed-in')).toBe('1');
    expect(JSON.stringify({ ...localStorage })).not.toContain('token-123');
    expect(calls[0]).toMatchObject({ key: 'POST /api/auth/login', body: { email: analyst.email, password: 'correct horse' } });
    expect(calls[0]?.headers).not.toHaveProperty('Authorization');
  });

  it('never follows a redirect to another site', async () => {
    stubApi({
      'POST /api/auth/login': { body: { accessToken: 'token-123', user: analyst } },
      'GET /api/auth/me': { body: analyst },
    });
    const { user, router } = renderRoutes(routes, '/sign-in?redirectTo=%2F%2Fevil.example');

    await user.type(await screen.findByLabelText('E-mail'), analyst.email);
    await user.type(screen.getByLabelText('Password'), 'correct horse');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    await waitFor(() => expect(router.state.location.pathname).toBe('/'));
  });
});
