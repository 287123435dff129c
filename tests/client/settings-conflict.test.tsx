import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { CSRF_TOKEN, fakeApi, sessionRoutes } from './helpers/fake-api.ts';
import { ORRERY, planner, production } from './helpers/fixtures.ts';
import { renderApp } from './helpers/render-app.tsx';

const theirs = production({ name: 'Orrery Seven — spring leg', paperSize: 'Letter', version: 4 });
const patchKey = `PATCH /api/productions/${ORRERY}`;

function setup(onPatch: Parameters<typeof fakeApi>[0][string]) {
  return fakeApi({
    ...sessionRoutes(planner),
    [`GET /api/productions/${ORRERY}`]: { body: { production: production() } },
    [patchKey]: onPatch,
  });
}

const conflictReply = { status: 409, body: { error: { code: 'conflict', message: 'Someone else saved this in the meantime.', current: theirs } } };

async function editAndSave(name: string) {
  const field = await screen.findByLabelText('Production name');
  fireEvent.change(field, { target: { value: name } });
  fireEvent.click(screen.getByRole('button', { name: 'Save settings' }));
}

describe('production settings: stale save (409)', () => {
  it('saves only the changes, with the version the edit started from', async () => {
    const api = setup((call) => ({ body: { production: { ...production(), ...(call.body as object), version: 4 } } }));
    renderApp(`/p/${ORRERY}/settings`);
    await editAndSave('Orrery Seven — autumn');
    expect(await screen.findByText('Settings saved.')).toBeTruthy();
    const [patch] = api.callsTo(patchKey);
    expect(patch.body).toEqual({ version: 3, name: 'Orrery Seven — autumn' });
    expect(patch.headers['x-csrf-token']).toBe(CSRF_TOKEN);
  });

  it('offers reload or keep mine, showing what differs', async () => {
    setup(conflictReply);
    renderApp(`/p/${ORRERY}/settings`);
    await editAndSave('Orrery Seven — autumn');

    const notice = await screen.findByRole('alert');
    expect(within(notice).getByText('Someone else saved these settings while you were editing')).toBeTruthy();
    expect(within(notice).getByRole('button', { name: 'Reload their version' })).toBeTruthy();
    expect(within(notice).getByRole('button', { name: 'Keep mine' })).toBeTruthy();
    const nameRow = within(notice).getByRole('row', { name: /Name/ });
    expect(nameRow.textContent).toContain('Orrery Seven — spring leg');
    expect(nameRow.textContent).toContain('Orrery Seven — autumn');
    // Nothing was overwritten: the field still holds what the planner typed.
    expect((screen.getByLabelText('Production name') as HTMLInputElement).value).toBe('Orrery Seven — autumn');
  });

  it('"Reload their version" takes their values and drops the edit', async () => {
    const api = setup(conflictReply);
    renderApp(`/p/${ORRERY}/settings`);
    await editAndSave('Orrery Seven — autumn');
    fireEvent.click(await screen.findByRole('button', { name: 'Reload their version' }));

    await waitFor(() => expect((screen.getByLabelText('Production name') as HTMLInputElement).value).toBe(theirs.name));
    expect((screen.getByRole('radio', { name: 'Letter' }) as HTMLInputElement).checked).toBe(true);
    expect(screen.queryByText('Someone else saved these settings while you were editing')).toBeNull();
    expect(api.callsTo(patchKey)).toHaveLength(1);
  });

  it('"Keep mine" saves my change on top of their version', async () => {
    const api = setup((call, nth) =>
      nth === 0 ? conflictReply : { body: { production: { ...theirs, ...(call.body as object), version: 5 } } },
    );
    renderApp(`/p/${ORRERY}/settings`);
    await editAndSave('Orrery Seven — autumn');
    fireEvent.click(await screen.findByRole('button', { name: 'Keep mine' }));

    expect(await screen.findByText('Settings saved.')).toBeTruthy();
    const patches = api.callsTo(patchKey);
    expect(patches).toHaveLength(2);
    // Their paper size change survives: only my own edit is resent, on their version.
    expect(patches[1].body).toEqual({ version: 4, name: 'Orrery Seven — autumn' });
    expect((screen.getByLabelText('Production name') as HTMLInputElement).value).toBe('Orrery Seven — autumn');
    expect((screen.getByRole('radio', { name: 'Letter' }) as HTMLInputElement).checked).toBe(true);
  });

  it('shows the load error with a retry when the production cannot be read', async () => {
    let fail = true;
    fakeApi({
      ...sessionRoutes(planner),
      [`GET /api/productions/${ORRERY}`]: () =>
        fail ? { status: 503, body: { error: { code: 'unavailable', message: 'The database is not reachable right now.' } } } : { body: { production: production() } },
    });
    renderApp(`/p/${ORRERY}/settings`);
    expect(await screen.findByText('The database is not reachable right now.')).toBeTruthy();
    fail = false;
    fireEvent.click(screen.getByRole('button', { name: 'Try again' }));
    expect(await screen.findByLabelText('Production name')).toBeTruthy();
  });
});
