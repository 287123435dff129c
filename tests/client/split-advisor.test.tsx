import { fireEvent, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { SplitInputView, SplitLimitsView, SplitRunView } from '../../src/domain/contracts/split.ts';
import { fakeApi, sessionRoutes } from './helpers/fake-api.ts';
import { ORRERY, planner, production, rigger } from './helpers/fixtures.ts';
import { renderApp } from './helpers/render-app.tsx';

const A = 'a0000000-0000-4000-8000-00000000000a';
const B = 'a0000000-0000-4000-8000-00000000000b';
const C = 'a0000000-0000-4000-8000-00000000000c';

const box = (x: number, w: number): { bboxMinMm: [number, number, number]; bboxMaxMm: [number, number, number] } => ({ bboxMinMm: [x, 0, 0], bboxMaxMm: [x + w, 600, 800] });
const input: SplitInputView = {
  machineVersion: 4,
  stamp: 'stamp-1',
  assemblies: [
    { id: A, number: '100', name: 'Frame', parentId: null, keepTogether: true, sectionId: null },
    { id: B, number: '200', name: 'Drive', parentId: null, keepTogether: true, sectionId: null },
    { id: C, number: '300', name: 'Desk', parentId: null, keepTogether: true, sectionId: null },
  ],
  parts: [
    { assemblyId: A, massKg: 300, cogMm: [300, 300, 400], ...box(0, 600) },
    { assemblyId: B, massKg: 250, cogMm: [1000, 300, 400], ...box(700, 600) },
    { assemblyId: C, massKg: 100, cogMm: [1700, 300, 400], ...box(1400, 600) },
  ],
  sections: [],
  gaps: [],
  lineCount: 3,
};
const limits: SplitLimitsView = {
  mass: { mode: 'hoist', maxSectionMassKg: 400, working: ['hoist CH-1: rated 500 kg', '= 400 kg of parts per section'], sources: [{ what: 'hoist CH-1', detail: 'largest' }], problems: [] },
  size: {
    crateMaxMm: [2600, 1100, 2100],
    crateOverheadMm: [174, 174, 255],
    sectionMaxMm: [2426, 926, 1845],
    setBy: [{ axis: 'width', venueId: 'v1', venueName: 'Sala Ventolina', where: 'corridor door B2 width', limitMm: 1100 }],
    venuesChecked: 1,
    verified: [{ venueId: 'v1', venueName: 'Sala Ventolina', verdict: 'pass', tightest: 'corridor door B2: +0 mm' }],
    problems: [],
  },
  maxSections: null,
  limits: { maxSectionMassKg: 400, maxSectionSizeMm: [2426, 926, 1845] },
  cautions: ['Never stand or pass under a suspended load.'],
};
const section = (ids: string[], massKg: number) => ({ units: ids.map((assemblyId) => ({ assemblyId, scope: 'whole' as const })), assemblyIds: ids, massKg, cogMm: [0, 0, 0] as [number, number, number], sizeMm: [600, 600, 800] as [number, number, number], massMarginKg: 400 - massKg, sizeMarginMm: [1826, 326, 1045] as [number, number, number] });
const run: SplitRunView = {
  id: 'r0000000-0000-4000-8000-000000000001',
  status: 'done',
  progress: 1,
  error: null,
  createdAt: '2027-01-01T00:00:00Z',
  limits,
  stamp: 'stamp-1',
  machineVersion: 4,
  result: {
    method: 'exact',
    proposals: [
      { sections: [section([A, C], 400), section([B], 250)], score: { sections: 2, heaviestKg: 400, cogOffsetSumMm: 0 } },
      { sections: [section([A], 300), section([B, C], 350)], score: { sections: 2, heaviestKg: 350, cogOffsetSumMm: 0 } },
    ],
    infeasible: [],
  },
};

function setup(user = planner) {
  return fakeApi({
    ...sessionRoutes(user),
    [`GET /api/productions/${ORRERY}`]: { body: { production: production() } },
    [`GET /api/productions/${ORRERY}/split/input`]: { body: { input } },
    [`GET /api/productions/${ORRERY}/split/limits`]: { body: { limits } },
    [`POST /api/productions/${ORRERY}/split/runs`]: { status: 202, body: { run: { ...run, status: 'queued', progress: 0, result: null } } },
    [`GET /api/productions/${ORRERY}/split/runs/${run.id}`]: { body: { run } },
    [`POST /api/productions/${ORRERY}/split/adopt`]: { body: { adopted: { machineVersion: 5, sections: [{ id: 's1', code: 'S1', created: true }, { id: 's2', code: 'S2', created: true }], emptied: [], assembliesChanged: 3, linesChanged: 0 } } },
  });
}

describe('split advisor screen', () => {
  it('shows each limit with its source, proposals side by side, a live hand edit by the core, and adopts with the breakdown stamp', async () => {
    const api = setup();
    renderApp(`/p/${ORRERY}/split`);
    const size = await screen.findByRole('region', { name: 'Size limit' });
    expect(within(size).getByText(/set by Sala Ventolina, corridor door B2 width/)).toBeTruthy();
    expect(screen.getByText(/Never stand or pass under a suspended load/)).toBeTruthy();

    fireEvent.click(screen.getByRole('button', { name: 'Propose splits' }));
    const first = await screen.findByRole('region', { name: 'Proposal 1' });
    expect(screen.getByRole('region', { name: 'Proposal 2' })).toBeTruthy();
    expect(within(first).getByText(/100 Frame, 300 Desk/)).toBeTruthy();

    // Hand edit: all three in one section is 650 kg, over the 400 kg limit — the core says so at once.
    fireEvent.click(within(first).getByRole('button', { name: 'Edit by hand' }));
    fireEvent.change(await screen.findByRole('combobox', { name: 'Section of 200 Drive' }), { target: { value: '0' } });
    const live = screen.getByRole('list', { name: 'Live check' });
    expect(within(live).getByText(/S1: 650 kg .*over a limit/)).toBeTruthy();
    expect(screen.getByText(/Section S1: mass 650.0 kg is 250.0 kg over the 400.0 kg limit/)).toBeTruthy();
    expect((screen.getByRole('button', { name: 'Adopt this split' }) as HTMLButtonElement).disabled).toBe(true);

    fireEvent.click(within(first).getByRole('button', { name: 'Adopt proposal 1' }));
    expect(await screen.findByText(/Sections S1, S2 now hold the machine/)).toBeTruthy();
    const body = api.callsTo(`POST /api/productions/${ORRERY}/split/adopt`)[0].body as { stamp: string; machineVersion: number; sections: unknown[] };
    expect(body.stamp).toBe('stamp-1');
    expect(body.machineVersion).toBe(4);
    expect(body.sections).toHaveLength(2);
  });

  it('a rigger sees the limits but may not run or adopt', async () => {
    setup(rigger);
    renderApp(`/p/${ORRERY}/split`);
    await screen.findByRole('region', { name: 'Mass limit' });
    expect(screen.queryByRole('button', { name: 'Propose splits' })).toBeNull();
  });
});
