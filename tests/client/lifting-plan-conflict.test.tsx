import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { evaluatePlanFields, liftPlanFields, type LiftPlanFields, type LiftPlanView } from '../../src/domain/contracts/lifting-api.ts';
import { fakeApi, sessionRoutes } from './helpers/fake-api.ts';
import { ORRERY, planner } from './helpers/fixtures.ts';
import { SECTION, base, gear, load, settings } from './helpers/lifting-fixtures.ts';
import { renderApp } from './helpers/render-app.tsx';

const PLAN = '9b9b9b9b-1111-4222-8333-444455556666';

const fields = (over: Partial<LiftPlanFields>): LiftPlanFields =>
  liftPlanFields.parse({
    title: 'Lift the drive core',
    sectionId: SECTION,
    liftDate: '2027-02-01',
    pickPoints: [
      { id: 'A', positionMm: [-350, 0, 600], hitch: 'vertical', slingGearId: 's1', shackleGearIds: [] },
      { id: 'B', positionMm: [350, 0, 600], hitch: 'vertical', slingGearId: 's2', shackleGearIds: [] },
    ],
    suspension: { kind: 'single-hook', hoistGearId: 'h1', hangingPoint: { label: 'Beam 3', ratingKg: 2000, source: 'typed' } },
    ...over,
  });

/** A plan as the server answers it, evaluated by the same core function the server uses. */
function planView(inputs: LiftPlanFields, over: Partial<LiftPlanView>): LiftPlanView {
  const { input, result } = evaluatePlanFields(inputs, { load: load as never, gear: gear as never, settings, venuePoints: [] });
  return {
    id: PLAN, title: inputs.title, status: 'draft', sectionId: SECTION, sectionCode: 'DC', venueId: null, verdict: result.verdict, authorId: planner.id, authorName: planner.name,
    liftDate: inputs.liftDate, version: 4, updatedAt: '2027-01-30T10:00:00.000Z', inputs, evaluatedInput: input, result, load: load as never, reviewerId: null, reviewerName: null,
    reviewedAt: null, reviewComment: '', submittedAt: null, createdAt: '2027-01-29T10:00:00.000Z', events: [], ...over,
  };
}

const mine = planView(fields({}), {});
const theirs = planView(fields({ title: 'Lift the drive core (rigger’s copy)', method: 'Tag lines on both ends.' }), { version: 5, status: 'approved' });
const patchKey = `PATCH ${base}/plans/${PLAN}`;

function setup() {
  return fakeApi({
    ...sessionRoutes(planner),
    [`GET ${base}/plans/${PLAN}`]: { body: { plan: mine } },
    [`GET ${base}/loads`]: { body: { loads: [load] } },
    [`GET ${base}/gear`]: { body: { gear } },
    [`GET ${base}/settings`]: { body: { settings } },
    [`GET ${base}/hanging-points`]: { body: { hangingPoints: [] } },
    [`GET ${base}/plans`]: { body: { plans: [] } },
    [patchKey]: (call) =>
      (call.body as { version: number }).version === 4
        ? { status: 409, body: { error: { code: 'conflict', message: 'Someone else saved this in the meantime.', current: theirs } } }
        : { body: { plan: { ...theirs, inputs: (call.body as { inputs: LiftPlanFields }).inputs, version: 6, status: 'draft' } } },
  });
}

async function editTitleAndSave() {
  fireEvent.click(await screen.findByRole('button', { name: 'Edit' }, { timeout: 15_000 }));
  const title = await screen.findByLabelText('Title', {}, { timeout: 15_000 });
  fireEvent.change(title, { target: { value: 'Lift the drive core, north door' } });
  fireEvent.click(screen.getByRole('button', { name: 'Save' }));
}

describe('lift plan: saving over someone else’s save', { timeout: 30_000 }, () => {
  it('shows their version beside mine and warns that keeping mine withdraws their approval', async () => {
    const api = setup();
    renderApp(`/p/${ORRERY}/lifting/plans/${PLAN}`);
    await editTitleAndSave();
    const notice = (await screen.findByText('Someone else saved this plan while you were editing')).closest('[role="alert"]') as HTMLElement;
    expect(within(notice).getByRole('row', { name: /Title/ }).textContent).toContain('rigger’s copy');
    expect(within(notice).getByRole('row', { name: /Title/ }).textContent).toContain('north door');
    expect(within(notice).getByRole('row', { name: /Method statement/ }).textContent).toContain('Tag lines on both ends.');
    expect(within(notice).queryByRole('row', { name: /Suspension/ })).toBeNull();
    expect(notice.textContent).toMatch(/Their version is approved; keeping yours returns it to draft and withdraws the approval/);

    fireEvent.click(within(notice).getByRole('button', { name: 'Keep mine' }));
    await waitFor(() => expect(api.callsTo(patchKey)).toHaveLength(2));
    const [first, second] = api.callsTo(patchKey).map((c) => c.body as { version: number; inputs: LiftPlanFields });
    expect(first.version).toBe(4);
    expect(second.version).toBe(5);
    expect(second.inputs.title).toBe('Lift the drive core, north door');
  });

  it('"Reload their version" starts the form again from theirs and saves nothing', async () => {
    const api = setup();
    renderApp(`/p/${ORRERY}/lifting/plans/${PLAN}`);
    await editTitleAndSave();
    fireEvent.click(await screen.findByRole('button', { name: 'Reload their version' }));
    await waitFor(() => expect((screen.getByLabelText('Title') as HTMLInputElement).value).toBe('Lift the drive core (rigger’s copy)'));
    expect(screen.queryByText('Someone else saved this plan while you were editing')).toBeNull();
    expect(api.callsTo(patchKey)).toHaveLength(1);
  });
});
