import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { CrateView } from '../../src/domain/contracts/crate-loads.ts';
import { toCrateView, type ContentRow, type CrateRow } from '../../server/modules/crates/crates.repository.ts';
import { CSRF_TOKEN, fakeApi, sessionRoutes } from './helpers/fake-api.ts';
import { ORRERY, planner, production, rigger } from './helpers/fixtures.ts';
import { renderApp } from './helpers/render-app.tsx';

const CRATE = '7a7a7a7a-1111-4222-8333-444455556666';

/** A stock case with one content line, viewed through the server's own view function (figures from the cores). */
function crate(over: Partial<CrateRow> = {}, massKg: number | null = 14): CrateView {
  const row: CrateRow = {
    id: CRATE,
    production_id: ORRERY,
    code: 'PC03',
    name: 'Planet 2 parts A',
    kind: 'stock',
    section_id: null,
    inner_length_mm: 570,
    inner_width_mm: 370,
    inner_height_mm: 360,
    outer_length_mm: 600,
    outer_width_mm: 400,
    outer_height_mm: 400,
    tare_kg: 9,
    max_gross_kg: 60,
    stackable: true,
    max_load_on_top_kg: 60,
    this_way_up: true,
    fragile: true,
    may_tilt: false,
    ispm15_required: false,
    design: { stockId: 'case-600x400x400', tareCogMm: [300, 200, 200], warnings: [] },
    notes: '',
    version: 3,
    updated_at: '2026-12-02T10:00:00.000Z',
    ...over,
  };
  const content: ContentRow = { id: 'c1', production_id: ORRERY, crate_id: CRATE, part_line_id: null, section_id: null, description: 'Planet 2 gear set', quantity: 1, mass_kg: massKg, cog_mm: [300, 200, 150], sort_order: 1, version: 1 };
  return toCrateView(row, [content], { handlingColumn: 'women' });
}

const crateKey = `/api/productions/${ORRERY}/crates/${CRATE}`;

function setup(user: typeof planner, patch?: Parameters<typeof fakeApi>[0][string], current: CrateView = crate()) {
  return fakeApi({
    ...sessionRoutes(user),
    [`GET /api/productions/${ORRERY}`]: { body: { production: production() } },
    [`GET ${crateKey}`]: { body: { crate: current } },
    ...(patch ? { [`PATCH ${crateKey}`]: patch } : {}),
  });
}

describe('crate editor', () => {
  it('shows gross, net and tare, the handling verdict with its cautions, and the packing-list notes', async () => {
    setup(planner);
    renderApp(`/p/${ORRERY}/crates/${CRATE}`);
    expect(await screen.findByRole('heading', { name: /Crate PC03/ })).toBeTruthy();
    // 9 kg tare + 14 kg content.
    expect(screen.getByTestId('gross').textContent).toMatch(/23(\.0)? kg/);
    const handling = screen.getByRole('region', { name: 'Manual handling' });
    expect(within(handling).getByText(/Never stand or pass under a suspended load/)).toBeTruthy();
    // [PUB-2] INDG143 Figure 1, women's column, hands close, lower leg to elbow: 13 kg; L23 team rule:
    // 2 people 2/3 × 26 = 17.3 kg, 3 people 1/2 × 39 = 19.5 kg; 23 kg exceeds both.
    expect(within(handling).getByText('mechanical aid required')).toBeTruthy();
    expect(screen.getByText('This way up.')).toBeTruthy();
    expect(screen.getByText('Planet 2 gear set')).toBeTruthy();
  });

  it('saves only what changed, with the version it started from, and offers reload or keep mine on 409', async () => {
    const theirs = crate({ name: 'Renamed by someone', version: 4 });
    const api = setup(planner, (call, nth) =>
      nth === 0 ? { status: 409, body: { error: { code: 'conflict', message: 'Someone else saved this in the meantime.', current: theirs } } } : { body: { crate: { ...theirs, ...(call.body as object), version: 5 } } },
    );
    renderApp(`/p/${ORRERY}/crates/${CRATE}`);
    fireEvent.change(await screen.findByLabelText('Name'), { target: { value: 'Planet 2 gears' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save crate' }));
    const notice = await screen.findByText('Someone else saved this crate while you were editing');
    expect(notice).toBeTruthy();
    const [first] = api.callsTo(`PATCH ${crateKey}`);
    expect(first.body).toEqual({ version: 3, name: 'Planet 2 gears' });
    expect(first.headers['x-csrf-token']).toBe(CSRF_TOKEN);
    fireEvent.click(screen.getByRole('button', { name: 'Keep mine' }));
    await waitFor(() => expect(api.callsTo(`PATCH ${crateKey}`)).toHaveLength(2));
    expect(api.callsTo(`PATCH ${crateKey}`)[1].body).toEqual({ version: 4, name: 'Planet 2 gears' });
  });

  it('says there is no verdict when a content mass is unknown', async () => {
    setup(planner, undefined, crate({}, null));
    renderApp(`/p/${ORRERY}/crates/${CRATE}`);
    const handling = await screen.findByRole('region', { name: 'Manual handling' });
    expect(within(handling).getByText('no verdict')).toBeTruthy();
    expect(screen.getAllByText(/at least/).length).toBeGreaterThan(0);
    expect(screen.getByText('unknown')).toBeTruthy();
  });

  it('lets the rigger read but not edit', async () => {
    setup(rigger);
    renderApp(`/p/${ORRERY}/crates/${CRATE}`);
    expect(await screen.findByRole('heading', { name: /Crate PC03/ })).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Save crate' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Add content' })).toBeNull();
    expect((screen.getByLabelText('Name') as HTMLInputElement).disabled).toBe(true);
  });
});

describe('crate editor: a newer crate arrives from the server (a refetch)', () => {
  it('keeps unsaved edits, and takes the newer crate when nothing is edited', async () => {
    let current = crate();
    fakeApi({ ...sessionRoutes(planner), [`GET /api/productions/${ORRERY}`]: { body: { production: production() } }, [`GET ${crateKey}`]: () => ({ body: { crate: current } }) });
    const { queryClient } = renderApp(`/p/${ORRERY}/crates/${CRATE}`);
    const form = await screen.findByRole('form', { name: 'Crate details' });
    fireEvent.change(within(form).getByLabelText('Notes'), { target: { value: 'Gears wrapped in foam' } });

    current = crate({ name: 'Planet 2 parts (renamed by someone)', version: 4 });
    await queryClient.invalidateQueries();
    await waitFor(() => expect((queryClient.getQueryData(['crates', ORRERY, 'one', CRATE]) as CrateView | undefined)?.version).toBe(4));
    // The edit in progress stays; the name is still the one this person started from.
    expect((within(form).getByLabelText('Notes') as HTMLInputElement).value).toBe('Gears wrapped in foam');
    expect((within(form).getByLabelText('Name') as HTMLInputElement).value).toBe('Planet 2 parts A');

    // With the edit undone, the next newer crate is taken into the form.
    fireEvent.change(within(form).getByLabelText('Notes'), { target: { value: '' } });
    current = crate({ name: 'Planet 2 parts B', version: 5 });
    await queryClient.invalidateQueries();
    await waitFor(() => expect((within(form).getByLabelText('Name') as HTMLInputElement).value).toBe('Planet 2 parts B'));
  });
});
