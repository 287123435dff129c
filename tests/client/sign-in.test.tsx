import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { CSRF_TOKEN, fakeApi, sessionRoutes } from './helpers/fake-api.ts';
import { ORRERY, planner, production } from './helpers/fixtures.ts';
import { renderApp } from './helpers/render-app.tsx';

function fill(label: string | RegExp, value: string) {
  fireEvent.change(screen.getByLabelText(label), { target: { value } });
}

async function openSignIn(path = '/sign-in') {
  const app = renderApp(path);
  await screen.findByRole('heading', { name: 'Sign in' });
  return app;
}

describe('sign-in', () => {
  it('shows field errors from the contract schema and sends nothing', async () => {
    const api = fakeApi(sessionRoutes(null));
    await openSignIn();
    fill('E-mail', 'not-an-address');
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByText('Enter a valid e-mail address.')).toBeTruthy();
    expect(screen.getByText('Enter your password.')).toBeTruthy();
    expect(screen.getByLabelText('E-mail').getAttribute('aria-invalid')).toBe('true');
    // The error is linked to the input for screen readers.
    const describedBy = screen.getByLabelText('E-mail').getAttribute('aria-describedby') ?? '';
    expect(document.getElementById(describedBy.split(' ').pop()!)?.textContent).toBe('Enter a valid e-mail address.');
    expect(api.callsTo('POST /api/auth/sign-in')).toHaveLength(0);
  });

  it('says when e-mail and password do not match', async () => {
    fakeApi({
      ...sessionRoutes(null),
      'POST /api/auth/sign-in': { status: 401, body: { error: { code: 'invalid_credentials', message: 'That e-mail and password do not match an active account.' } } },
    });
    await openSignIn();
    fill('E-mail', 'pia@ballast.test');
    fill('Password', 'wrong password');
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));

    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toContain('E-mail or password is not right');
  });

  it('shows the rate-limit message with the server’s time to wait', async () => {
    fakeApi({
      ...sessionRoutes(null),
      'POST /api/auth/sign-in': { status: 429, body: { error: { code: 'rate_limited', message: 'Too many failed sign-ins. Try again in 14 minutes.' } } },
    });
    await openSignIn();
    fill('E-mail', 'pia@ballast.test');
    fill('Password', 'guess number six');
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));

    const alert = await screen.findByRole('alert');
    expect(within(alert).getByText('Too many attempts')).toBeTruthy();
    expect(alert.textContent).toContain('Try again in 14 minutes.');
  });

  it('puts field problems the server names next to their fields', async () => {
    fakeApi({
      ...sessionRoutes(null),
      'POST /api/auth/sign-in': { status: 400, body: { error: { code: 'invalid', message: 'Some fields are not valid.', issues: [{ path: 'email', message: 'No such domain.' }] } } },
    });
    await openSignIn();
    fill('E-mail', 'pia@ballast.test');
    fill('Password', 'something long');
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByText('No such domain.')).toBeTruthy();
    expect(screen.queryByRole('alert')).toBeNull();
  });

  it('signs in with the CSRF token, normalises the e-mail and returns to the page asked for', async () => {
    let signedIn = false;
    const api = fakeApi({
      ...sessionRoutes(null),
      'GET /api/auth/me': () => (signedIn ? { body: { user: planner } } : { status: 401, body: { error: { code: 'unauthenticated', message: 'Sign in.' } } }),
      'POST /api/auth/sign-in': () => {
        signedIn = true;
        return { body: { user: planner, csrfToken: 'fresh-session-token' } };
      },
      [`GET /api/productions/${ORRERY}`]: { body: { production: production() } },
      [`GET /api/productions/${ORRERY}/members`]: { body: { members: [] } },
    });
    const { router } = renderApp(`/p/${ORRERY}/settings`);
    await screen.findByRole('heading', { name: 'Sign in' });
    expect(router.state.location.search).toBe(`?next=${encodeURIComponent(`/p/${ORRERY}/settings`)}`);

    fill('E-mail', '  Pia@Ballast.TEST ');
    fill('Password', 'correct horse');
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByRole('heading', { name: 'Production settings' })).toBeTruthy();
    expect(router.state.location.pathname).toBe(`/p/${ORRERY}/settings`);
    const [post] = api.callsTo('POST /api/auth/sign-in');
    expect(post.body).toEqual({ email: 'pia@ballast.test', password: 'correct horse' });
    expect(post.headers['x-csrf-token']).toBe(CSRF_TOKEN);
  });

  it('fetches a new CSRF token once when the server refuses a stale one', async () => {
    const tokens = ['stale-token', 'new-token'];
    const api = fakeApi({
      ...sessionRoutes(null),
      'GET /api/auth/csrf': (_call, nth) => ({ body: { csrfToken: tokens[Math.min(nth, 1)] } }),
      'POST /api/auth/sign-in': (call) =>
        call.headers['x-csrf-token'] === 'new-token'
          ? { status: 401, body: { error: { code: 'invalid_credentials', message: 'No match.' } } }
          : { status: 403, body: { error: { code: 'csrf', message: 'The form expired.' } } },
    });
    await openSignIn();
    fill('E-mail', 'pia@ballast.test');
    fill('Password', 'whatever it is');
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));

    await screen.findByText('E-mail or password is not right');
    expect(api.callsTo('POST /api/auth/sign-in').map((c) => c.headers['x-csrf-token'])).toEqual(['stale-token', 'new-token']);
    expect(api.callsTo('GET /api/auth/csrf')).toHaveLength(2);
  });

  it('sends anonymous visitors of a signed-in page to sign in', async () => {
    fakeApi(sessionRoutes(null));
    const { router } = renderApp('/account');
    await screen.findByRole('heading', { name: 'Sign in' });
    await waitFor(() => expect(router.state.location.pathname).toBe('/sign-in'));
  });

  it('goes back to sign-in when the session ends while a screen loads (any 401)', async () => {
    fakeApi({
      ...sessionRoutes(planner),
      [`GET /api/productions/${ORRERY}`]: { status: 401, body: { error: { code: 'unauthenticated', message: 'Sign in to continue.' } } },
    });
    const { router } = renderApp(`/p/${ORRERY}`);
    await screen.findByRole('heading', { name: 'Sign in' });
    expect(router.state.location.pathname).toBe('/sign-in');
    expect(router.state.location.search).toBe(`?next=${encodeURIComponent(`/p/${ORRERY}`)}`);
  });
});
