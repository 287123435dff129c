import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { SessionUser } from '../../src/lib/session.ts';
import { fakeApi, sessionRoutes } from './helpers/fake-api.ts';
import { ORRERY, planner, production, venueUser } from './helpers/fixtures.ts';
import { renderApp } from './helpers/render-app.tsx';

const CRATE = '11111111-2222-4333-8444-555555555555';
const ENGAGEMENT = '99999999-8888-4777-8666-555555555555';

function routes(user: SessionUser) {
  return {
    ...sessionRoutes(user),
    [`GET /api/productions/${ORRERY}`]: { body: { production: production() } },
    [`GET /api/productions/${ORRERY}/members`]: { body: { members: [] } },
    [`GET /api/productions/${ORRERY}/crates`]: { body: { crates: [{ id: CRATE, code: 'DC', name: 'Drive core' }] } },
    [`GET /api/productions/${ORRERY}/tour`]: { body: { tour: { engagements: [{ id: ENGAGEMENT, venueName: 'Loomworks Hall', venueCity: 'Manchester', loadInOn: '2027-03-01' }] } } },
  };
}

describe('documents panel on the production overview', () => {
  it('a planner gets the packing list, labels, customs list and manifest links', async () => {
    fakeApi(routes(planner));
    renderApp(`/p/${ORRERY}`);
    const card = (await screen.findByRole('heading', { name: 'Documents' })).closest('section')!;
    const packing = await within(card).findByRole('link', { name: 'Packing list (PDF)' });
    expect(packing.getAttribute('href')).toBe(`/api/productions/${ORRERY}/documents/crates/${CRATE}/packing-list.pdf`);
    expect(within(card).getByRole('link', { name: 'Labels of all 1 crates (PDF)' }).getAttribute('href')).toBe(`/api/productions/${ORRERY}/documents/crates/labels.pdf`);
    expect(within(card).getByRole('link', { name: 'XLSX' }).getAttribute('href')).toBe(`/api/productions/${ORRERY}/documents/customs-list.xlsx`);
    const manifest = await within(card).findByRole('link', { name: 'Manifest (PDF)' });
    expect(manifest.getAttribute('href')).toBe(`/api/productions/${ORRERY}/documents/engagements/${ENGAGEMENT}/manifest.pdf`);
  });

  it('venue staff see only the manifest, and the crates are not even asked for', async () => {
    const api = fakeApi(routes(venueUser));
    renderApp(`/p/${ORRERY}`);
    const card = (await screen.findByRole('heading', { name: 'Documents' })).closest('section')!;
    expect(await within(card).findByRole('link', { name: 'Manifest (PDF)' })).toBeTruthy();
    expect(within(card).queryByRole('link', { name: 'Packing list (PDF)' })).toBeNull();
    expect(within(card).queryByRole('link', { name: 'XLSX' })).toBeNull();
    expect(api.callsTo(`GET /api/productions/${ORRERY}/crates`)).toHaveLength(0);
  });
});
