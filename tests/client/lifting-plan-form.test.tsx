import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { fakeApi, sessionRoutes } from './helpers/fake-api.ts';
import { ORRERY, planner } from './helpers/fixtures.ts';
import { renderApp } from './helpers/render-app.tsx';

const SECTION = '7a7a7a7a-1111-4222-8333-444455556666';
const base = `/api/productions/${ORRERY}/lifting`;

const load = {
  sectionId: SECTION,
  code: 'DC',
  name: 'Drive core',
  massKg: 400,
  marginPercent: 0,
  weighed: true,
  weighedOn: '2027-01-25',
  cogMm: [0, 0, 300],
  cogUncertaintyMm: null,
  boundsMm: { minMm: [-700, -400, 0], maxMm: [700, 400, 600] },
  complete: true,
  gapCount: 0,
};
const gear = [
  { id: 'h1', kind: 'hoist', identifier: 'CH-1', ratedLoadKg: 1000, selfWeightKg: 40, chainWeightKg: 15, hoistClass: 'D8+', nextInspectionDate: '2099-01-01', version: 1, updatedAt: '' },
  { id: 's1', kind: 'sling', identifier: 'RS-1', slingType: 'roundsling', verticalRatingKg: 1000, lengthMm: 1200, massKg: 2, nextInspectionDate: '2099-01-01', version: 1, updatedAt: '' },
  { id: 's2', kind: 'sling', identifier: 'RS-2', slingType: 'roundsling', verticalRatingKg: 1000, lengthMm: 1200, massKg: 2, nextInspectionDate: '2099-01-01', version: 1, updatedAt: '' },
];
const settings = {
  handlingMethod: 'niosh', guidelineColumn: 'women', handlingThresholdKg: 5, maxTeamSize: 3, dynamicFactor: 1.1,
  dynamicFactorSource: 'Test source, Table 5-1', hoistRuleSet: 'igvw-sq-p2', exclusionMarginMm: 1000, version: 1, updatedAt: null,
};

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
