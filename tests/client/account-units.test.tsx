import { fireEvent, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { fakeApi, sessionRoutes } from './helpers/fake-api.ts';
import { planner } from './helpers/fixtures.ts';
import { renderApp } from './helpers/render-app.tsx';

describe('account: units preference', () => {
  it('switches every formatter to imperial after the server saves the choice', async () => {
    const api = fakeApi({
      ...sessionRoutes(planner),
      'PATCH /api/auth/me/preferences': (call) => ({ body: { user: { ...planner, ...(call.body as object) } } }),
    });
    renderApp('/account');
    // 1,250 mm and 418.5 kg in the example line, from src/domain/units.ts.
    expect(await screen.findByText('1,250 mm and 418.5 kg')).toBeTruthy();

    fireEvent.click(screen.getByRole('radio', { name: 'Imperial' }));

    // 1250 / 25.4 = 49.21 in; 418.5 / 0.45359237 = 922.6 lb.
    expect(await screen.findByText('49.2 in and 922.6 lb')).toBeTruthy();
    expect(api.callsTo('PATCH /api/auth/me/preferences')[0].body).toEqual({ units: 'imperial' });
    expect((screen.getByRole('radio', { name: 'Imperial' }) as HTMLInputElement).checked).toBe(true);
  });

  it('checks the new password pair before sending it', async () => {
    const api = fakeApi(sessionRoutes(planner));
    renderApp('/account');
    fireEvent.change(await screen.findByLabelText('Current password'), { target: { value: 'old one' } });
    fireEvent.change(screen.getByLabelText('New password'), { target: { value: 'short' } });
    fireEvent.change(screen.getByLabelText('New password again'), { target: { value: 'different' } });
    fireEvent.click(screen.getByRole('button', { name: 'Change password' }));

    expect(await screen.findByText('Use at least 10 characters.')).toBeTruthy();
    expect(screen.getByText('The two passwords are not the same.')).toBeTruthy();
    expect(api.callsTo('POST /api/auth/me/password')).toHaveLength(0);
  });

  it('shows a wrong current password next to that field', async () => {
    fakeApi({
      ...sessionRoutes(planner),
      'POST /api/auth/me/password': {
        status: 400,
        body: { error: { code: 'invalid', message: 'Your current password is not right.', issues: [{ path: 'currentPassword', message: 'Not your current password.' }] } },
      },
    });
    renderApp('/account');
    fireEvent.change(await screen.findByLabelText('Current password'), { target: { value: 'old one' } });
    fireEvent.change(screen.getByLabelText('New password'), { target: { value: 'a much longer phrase' } });
    fireEvent.change(screen.getByLabelText('New password again'), { target: { value: 'a much longer phrase' } });
    fireEvent.click(screen.getByRole('button', { name: 'Change password' }));

    expect(await screen.findByText('Not your current password.')).toBeTruthy();
    expect(screen.getByLabelText('Current password').getAttribute('aria-invalid')).toBe('true');
  });
});
