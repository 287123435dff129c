import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { fakeApi, sessionRoutes } from './helpers/fake-api.ts';
import { ORRERY, planner } from './helpers/fixtures.ts';
import { renderApp } from './helpers/render-app.tsx';
import { SECTION, base, gear, load, settings } from './helpers/lifting-fixtures.ts';

function setup() {
  return fakeApi({
    ...sessionRoutes(planner),
    [`GET ${base}/loads`]: { body: { loads: [load] } },
    [`GET ${base}/gear`]: { body: { gear } },
    [`GET ${base}/settings`]: { body: { settings } },
    [`GET ${base}/hanging-points`]: { body: { hangingPoints: [] } },
    [`POST ${base}/plans`]: { status: 400, body: { error: { code: 'invalid', message: 'stop here' } } },
  });
}

const preview = () => screen.getByRole('generic', { name: 'Preview' });

describe('lift plan form: instant preview with the core', () => {
  it('shows no verdict while gear and hanging point are missing, then the legs and verdict as they are chosen', async () => {
    const api = setup();
    renderApp(`/p/${ORRERY}/lifting/plans/new`);
    await screen.findByRole('heading', { name: 'New lift plan' }, { timeout: 15_000 });

    // The starter plan: two pick points at x = ±350 mm on top of the box, no slings, no hanging point yet.
    await waitFor(() => expect(within(preview()).getByText('No verdict: the plan is incomplete')).toBeTruthy());
    expect(within(preview()).getByText(/suspension\.hangingPoint\.label/)).toBeTruthy();

    fireEvent.change(screen.getByLabelText('Hanging point'), { target: { value: 'Beam 3' } });
    // Complete enough to evaluate: the core names what is missing, and gives no verdict.
    await waitFor(() => expect(within(preview()).getByRole('list', { name: 'Problems' }).textContent).toMatch(/no sling chosen/));
    expect(within(preview()).getByRole('list', { name: 'Problems' }).textContent).toMatch(/no rating/);
    // Cautions always show with a verdict.
    expect(within(preview()).getByText('Never stand or pass under a suspended load.')).toBeTruthy();

    fireEvent.change(screen.getByLabelText('A sling'), { target: { value: 's1' } });
    fireEvent.change(screen.getByLabelText('B sling'), { target: { value: 's2' } });
    fireEvent.change(screen.getByLabelText('Its rating (kg)'), { target: { value: '2000' } });

    await waitFor(() => expect(within(preview()).getByText('Within capacity')).toBeTruthy());
    // Two equal legs from a hook plumb over the CoG: T = W / (2 sin θ), sin θ = √(1200² − 350²) / 1200 [COMP].
    const sin = Math.sqrt(1200 ** 2 - 350 ** 2) / 1200;
    const t = 400 / (2 * sin);
    expect(within(preview()).getByTestId('leg-A-worst').textContent).toBe(`${t.toFixed(1)} kg`);
    // Dynamic hook load = (load + rigging below the hook) × 1.1.
    expect(within(preview()).getByTestId('dynamic-hook-load').textContent).toContain(`${((400 + 4) * 1.1).toFixed(1)} kg`);

    // Someone beneath the load: refused at once.
    fireEvent.click(screen.getByLabelText('Anyone beneath the load at any time'));
    await waitFor(() => expect(within(preview()).getByRole('list', { name: 'Problems' }).textContent).toMatch(/over people/));
    expect(within(preview()).queryByText('Within capacity')).toBeNull();

    // The server gets the typed inputs (it evaluates again as the authority).
    fireEvent.click(screen.getByLabelText('Anyone beneath the load at any time'));
    fireEvent.click(screen.getByRole('button', { name: 'Save draft' }));
    await waitFor(() => expect(api.callsTo(`POST ${base}/plans`)).toHaveLength(1));
    const body = api.callsTo(`POST ${base}/plans`)[0].body as { inputs: { sectionId: string; pickPoints: { slingGearId: string }[]; peopleBelow: boolean } };
    expect(body.inputs.sectionId).toBe(SECTION);
    expect(body.inputs.pickPoints.map((p) => p.slingGearId)).toEqual(['s1', 's2']);
    expect(body.inputs.peopleBelow).toBe(false);
    expect(await screen.findByText('stop here')).toBeTruthy();
  }, 30_000);
});
