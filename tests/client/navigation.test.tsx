import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { SessionUser } from '../../src/lib/session.ts';
import { NAV_ITEMS, navigationFor, type NavItem } from '../../src/app/navigation.ts';
import { fakeApi, sessionRoutes } from './helpers/fake-api.ts';
import { admin, adminWithoutProductions, newcomer, ORRERY, planner, production, rigger, SPARE, venueUser } from './helpers/fixtures.ts';
import { renderApp } from './helpers/render-app.tsx';

function productionRoutes(user: SessionUser) {
  return {
    ...sessionRoutes(user),
    [`GET /api/productions/${ORRERY}`]: { body: { production: production() } },
    [`GET /api/productions/${ORRERY}/members`]: { body: { members: [] } },
  };
}

async function navLinks(): Promise<string[]> {
  const nav = await screen.findByRole('navigation', { name: 'Main' });
  return within(nav)
    .getAllByRole('link')
    .map((a) => a.textContent ?? '');
}

describe('navigation fits the role in the current production', () => {
  // Each feature adds its own entries; these are the foundation's, which must (not) show.
  const cases: Array<[string, SessionUser, string[], string[]]> = [
    ['planner sees Overview and Settings', planner, ['Overview', 'Settings'], ['People', 'Mail']],
    ['rigger sees Overview but not Settings', rigger, ['Overview'], ['Settings', 'People', 'Mail']],
    ['venue sees Overview but not Settings', venueUser, ['Overview'], ['Settings', 'People', 'Mail']],
    ['admin who is a rigger here sees Overview, People and Mail', admin, ['Overview', 'People', 'Mail'], ['Settings']],
  ];

  it.each(cases)('%s', async (_name, user, has, hasNot) => {
    fakeApi(productionRoutes(user));
    renderApp(`/p/${ORRERY}`);
    await screen.findByRole('heading', { name: 'Orrery Seven tour', level: 1 });
    const links = await navLinks();
    for (const l of has) expect(links).toContain(l);
    for (const l of hasNot) expect(links).not.toContain(l);
    // The screen shows exactly what the pure navigation function decides for this role.
    const m = user.memberships.find((x) => x.productionId === ORRERY)!;
    const decided = navigationFor({ productionId: ORRERY, role: m.role, isAdmin: user.isAdmin });
    expect(links).toEqual([...decided.production, ...decided.company].map((l) => l.label));
  });

  it('hides the settings button on the overview from roles that may not edit', async () => {
    fakeApi(productionRoutes(rigger));
    renderApp(`/p/${ORRERY}`);
    await screen.findByRole('heading', { name: 'Orrery Seven tour', level: 1 });
    expect(screen.queryByRole('link', { name: 'Edit settings' })).toBeNull();
  });

  it('refuses the settings screen to a rigger who follows a link there', async () => {
    const api = fakeApi(productionRoutes(rigger));
    renderApp(`/p/${ORRERY}/settings`);
    expect(await screen.findByText('This screen is not part of your role')).toBeTruthy();
    expect(api.callsTo(`PATCH /api/productions/${ORRERY}`)).toHaveLength(0);
  });

  it('an admin with no productions sees company entries and a friendly empty state', async () => {
    fakeApi(sessionRoutes(adminWithoutProductions));
    renderApp('/');
    expect(await screen.findByText('You are not on any production yet')).toBeTruthy();
    expect(await navLinks()).toEqual(['People', 'Mail', 'Archives']);
    expect(screen.queryByRole('combobox', { name: 'Production' })).toBeNull();
  });

  it('a person with no productions and no admin rights sees only the empty state', async () => {
    fakeApi(sessionRoutes(newcomer));
    renderApp('/');
    expect(await screen.findByText('You are not on any production yet')).toBeTruthy();
    expect(screen.getByText(/An administrator adds you to a production/)).toBeTruthy();
    expect(within(screen.getByRole('navigation', { name: 'Main' })).queryAllByRole('link')).toHaveLength(0);
  });

  it('keeps the last production’s entries at hand on screens outside a production', async () => {
    fakeApi(sessionRoutes(planner));
    window.localStorage.setItem('ballast.lastProduction', JSON.stringify({ [planner.id]: SPARE }));
    renderApp('/account');
    await screen.findByRole('heading', { name: 'Your account', level: 1 });
    // On the spare production the planner is a rigger: no Settings there.
    const nav = screen.getByRole('navigation', { name: 'Main' });
    const entries = within(nav).getAllByRole('link').map((a) => [a.textContent, a.getAttribute('href')]);
    expect(entries[0]).toEqual(['Overview', `/p/${SPARE}`]);
    expect(entries.map((e) => e[0])).not.toContain('Settings');
    for (const [, href] of entries) expect(href).toMatch(new RegExp(`^/p/${SPARE}`));
    expect((screen.getByRole('combobox', { name: 'Production' }) as HTMLSelectElement).value).toBe(SPARE);
  });

  it('says so when the URL names a production the person is not on', async () => {
    fakeApi(sessionRoutes(rigger));
    renderApp('/p/9d8c7b6a-5f4e-4d3c-8b2a-1f0e9d8c7b6a');
    expect(await screen.findByText('You are not on this production')).toBeTruthy();
  });

  it('shows the 404 page inside the shell for unknown addresses', async () => {
    fakeApi(sessionRoutes(planner));
    renderApp('/no/such/page');
    expect(await screen.findByText('This page does not exist')).toBeTruthy();
    expect(screen.getByRole('navigation', { name: 'Main' })).toBeTruthy();
  });
});

describe('the navigation list is one table filtered by the policy', () => {
  // What a later issue does: add one entry; the policy decides who sees it.
  const extended: NavItem[] = [...NAV_ITEMS, { label: 'Machine', path: 'machine', action: 'machine.read', scope: 'production' }];
  const labels = (role: 'planner' | 'rigger' | 'venue', isAdmin = false) =>
    navigationFor({ productionId: ORRERY, role, isAdmin }, extended).production.map((l) => l.label);

  it('shows a new entry to the roles the policy lets read it', () => {
    expect(labels('planner')).toContain('Machine');
    expect(labels('rigger')).toContain('Machine');
    expect(labels('venue')).not.toContain('Machine');
  });

  it('builds production links under /p/:productionId and company links as given', () => {
    const nav = navigationFor({ productionId: ORRERY, role: 'planner', isAdmin: true });
    const links = nav.production.map((l) => l.to);
    expect(links[0]).toBe(`/p/${ORRERY}`);
    expect(links).toContain(`/p/${ORRERY}/settings`);
    for (const l of links) expect(l).toMatch(new RegExp(`^/p/${ORRERY}(/[a-z-]+)?$`));
    expect(nav.company.map((l) => l.to)).toEqual(['/admin/people', '/admin/mail', '/admin/archives']);
  });

  it('shows no production entries outside a production', () => {
    expect(navigationFor({ productionId: null, role: null, isAdmin: false }).production).toEqual([]);
  });
});
