import { fireEvent, screen, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { switchTarget } from '../../src/app/navigation.ts';
import { fakeApi, sessionRoutes } from './helpers/fake-api.ts';
import { ORRERY, planner, production, SPARE } from './helpers/fixtures.ts';
import { renderApp } from './helpers/render-app.tsx';

function routes() {
  return {
    ...sessionRoutes(planner),
    [`GET /api/productions/${ORRERY}`]: { body: { production: production() } },
    [`GET /api/productions/${ORRERY}/members`]: { body: { members: [] } },
    [`GET /api/productions/${SPARE}`]: { body: { production: production({ id: SPARE, name: 'Winter revival', paperSize: 'Letter' }) } },
    [`GET /api/productions/${SPARE}/members`]: { body: { members: [] } },
  };
}

describe('production switcher', () => {
  it('lists the memberships and changes the URL to the chosen production', async () => {
    fakeApi(routes());
    const { router } = renderApp(`/p/${ORRERY}`);
    const select = (await screen.findByRole('combobox', { name: 'Production' })) as HTMLSelectElement;
    expect([...select.options].map((o) => o.textContent)).toEqual(['Orrery Seven tour', 'Winter revival']);
    expect(select.value).toBe(ORRERY);

    fireEvent.change(select, { target: { value: SPARE } });

    await waitFor(() => expect(router.state.location.pathname).toBe(`/p/${SPARE}`));
    expect(await screen.findByRole('heading', { name: 'Winter revival', level: 1 })).toBeTruthy();
    expect((screen.getByRole('combobox', { name: 'Production' }) as HTMLSelectElement).value).toBe(SPARE);
  });

  it('keeps the screen when the role there may see it, else opens the overview', () => {
    expect(switchTarget(`/p/${SPARE}/settings`, ORRERY, 'planner', false)).toBe(`/p/${ORRERY}/settings`);
    expect(switchTarget(`/p/${ORRERY}/settings`, SPARE, 'rigger', false)).toBe(`/p/${SPARE}`);
    expect(switchTarget('/account', SPARE, 'rigger', false)).toBe(`/p/${SPARE}`);
  });

  it('the planner on settings lands on the overview of a production where they are a rigger', async () => {
    fakeApi(routes());
    const { router } = renderApp(`/p/${ORRERY}/settings`);
    fireEvent.change(await screen.findByRole('combobox', { name: 'Production' }), { target: { value: SPARE } });
    await waitFor(() => expect(router.state.location.pathname).toBe(`/p/${SPARE}`));
  });

  it('remembers the last production on this device and opens it next time', async () => {
    fakeApi(routes());
    const first = renderApp(`/p/${SPARE}`);
    await screen.findByRole('heading', { name: 'Winter revival', level: 1 });
    first.unmount();

    const { router } = renderApp('/');
    await waitFor(() => expect(router.state.location.pathname).toBe(`/p/${SPARE}`));
  });

  it('opens the first production when nothing is remembered', async () => {
    fakeApi(routes());
    const { router } = renderApp('/');
    await waitFor(() => expect(router.state.location.pathname).toBe(`/p/${ORRERY}`));
  });
});
