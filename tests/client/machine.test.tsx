import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { massProperties } from '../../src/domain/mass/index.ts';
import type { MassPropertiesInput } from '../../src/domain/contracts/mass.ts';
import { fakeApi, sessionRoutes } from './helpers/fake-api.ts';
import { ORRERY, planner, rigger, venueUser } from './helpers/fixtures.ts';
import { renderApp } from './helpers/render-app.tsx';

const S1 = '00000000-0000-4000-8000-0000000000a1';
const S2 = '00000000-0000-4000-8000-0000000000a2';
const A = '00000000-0000-4000-8000-0000000000b1';
const B = '00000000-0000-4000-8000-0000000000b2';

/** Two sections: S1 holds assembly A (10 kg at x = 0 and 30 kg at x = 1,000 mm), S2 holds B (5 kg). */
const input: MassPropertiesInput = {
  marginPercent: 5,
  sections: [
    { id: S1, label: 'S1' },
    { id: S2, label: 'S2' },
  ],
  assemblies: [
    { id: A, label: 'A', parentId: null, sectionId: S1 },
    { id: B, label: 'B', parentId: null, sectionId: S2 },
  ],
  lines: [
    { id: 'l1', label: 'P-1', assemblyId: A, quantity: 1, unitMassKg: 10, massSource: 'weighed', cogMm: [0, 0, 0], bboxMm: { minMm: [-50, -50, -50], maxMm: [50, 50, 50] } },
    { id: 'l2', label: 'P-2', assemblyId: A, quantity: 1, unitMassKg: 30, massSource: 'estimated', cogMm: [1000, 0, 0], bboxMm: { minMm: [950, -50, -50], maxMm: [1050, 50, 50] } },
    { id: 'l3', label: 'P-3', assemblyId: B, quantity: 1, unitMassKg: 5, massSource: 'catalogue', cogMm: [0, 2000, 0] },
    { id: 'l4', label: 'P-4', assemblyId: B, quantity: 1, unitMassKg: null, massSource: null, cogMm: [0, 0, 0] },
  ],
  addOns: [],
};

function machineRoutes() {
  const r = massProperties(input);
  const sections = Object.fromEntries(Object.entries(r.sections).map(([id, n]) => [id, { ...n, marginPercent: 5, weighing: null }]));
  const base = `/api/productions/${ORRERY}/machine`;
  const section = (id: string, code: string) => ({ id, code, name: `Section ${code}`, marginPercent: null, cogUncertaintyMm: null, sortOrder: 0, version: 1 });
  const assembly = (id: string, number: string, sectionId: string) => ({ id, number, name: `Assembly ${number}`, parentId: null, sectionId, keepTogether: false, notes: '', version: 3 });
  return {
    [`GET ${base}`]: {
      body: {
        machine: { id: 'm', name: 'Test orrery', marginPercent: 5, version: 1, updatedAt: '2027-01-01T00:00:00.000Z' },
        sections: [section(S1, 'S1'), section(S2, 'S2')],
        addOns: [],
        materials: [],
        lineCount: 4,
        assemblyCount: 2,
      },
    },
    [`GET ${base}/mass-properties`]: {
      body: { massProperties: { marginPercent: 5, sections, assemblies: r.assemblies, loose: r.loose, machine: r.machine, total: r.total, gaps: r.gaps, warnings: r.warnings } },
    },
    [`GET ${base}/mass-input`]: { body: { input, sectionMargins: { [S1]: null, [S2]: null } } },
    [`GET ${base}/breakdown`]: { body: { assemblies: [assembly(A, 'A', S1), assembly(B, 'B', S2)], lines: [], total: 4, offset: 0 } },
  };
}

const card = (code: string) => screen.getByRole('heading', { name: new RegExp(`^${code}`) }).closest('section') as HTMLElement;

// The machine screen is a large lazy module: its first transform can take seconds on a busy machine.
describe('machine screen: section cards', { timeout: 30_000 }, () => {
  it('shows each section with mass, margin, CoG, confidence and gaps', async () => {
    fakeApi({ ...sessionRoutes(planner), ...machineRoutes() });
    renderApp(`/p/${ORRERY}/machine`);
    await screen.findByRole('heading', { name: /^S1/ });
    const s1 = card('S1');
    // 10 kg at x = 0 and 30 kg at x = 1,000 mm: 40 kg with its CoG at x = 750 mm (hand sum); +5 % margin = 42 kg.
    expect(within(s1).getByTestId('section-mass').textContent).toBe('40.0 kg');
    expect(within(s1).getByText('42.0 kg')).toBeTruthy();
    expect(within(s1).getByText(/^750 mm, 0 mm, 0 mm/)).toBeTruthy();
    // Weighed 10 of 40 kg = 25 %; estimated 30 of 40 = 75 %.
    expect(within(s1).getByText('Weighed or catalogue 25 %')).toBeTruthy();
    expect(within(s1).getByText('Estimated 75 %')).toBeTruthy();
    const s2 = card('S2');
    expect(within(s2).getByText('1 gap')).toBeTruthy();
    expect(within(s2).getByText('P-4')).toBeTruthy();
  });

  it('previews a move at once with the mass core, before anything is saved', async () => {
    const api = fakeApi({ ...sessionRoutes(planner), ...machineRoutes() });
    renderApp(`/p/${ORRERY}/machine`);
    fireEvent.click(await screen.findByRole('button', { name: 'Move assemblies' }));
    const panel = (await screen.findByRole('heading', { name: 'Move assemblies between sections' })).closest('section') as HTMLElement;
    fireEvent.change(within(panel).getByLabelText('Move to'), { target: { value: S1 } });
    fireEvent.click(await within(panel).findByRole('checkbox', { name: /B/ }));
    // B (5 kg) joins S1 (40 kg): 45 kg, and S2 drops to 0 kg; shown as previews with the change.
    const previews = await within(panel).findAllByText('Preview');
    expect(previews.length).toBe(2);
    const masses = within(panel).getAllByTestId('section-mass').map((e) => e.textContent);
    expect(masses).toEqual(['45.0 kg', '0.0 kg']);
    expect(within(panel).getByText('+5.0 kg')).toBeTruthy();
    expect(api.callsTo(`POST /api/productions/${ORRERY}/machine/move`)).toHaveLength(0);
  });

  it('shows masses in pounds for a person who chose imperial units', async () => {
    fakeApi({ ...sessionRoutes({ ...planner, units: 'imperial' }), ...machineRoutes() });
    renderApp(`/p/${ORRERY}/machine`);
    await screen.findByRole('heading', { name: /^S1/ });
    // 40 kg / 0.45359237 kg/lb = 88.18 lb.
    expect(within(card('S1')).getByTestId('section-mass').textContent).toBe('88.2 lb');
  });

  it('hides editing from a rigger and the whole screen from a venue user', async () => {
    fakeApi({ ...sessionRoutes(rigger), ...machineRoutes() });
    const view = renderApp(`/p/${ORRERY}/machine`);
    await screen.findByRole('heading', { name: /^S1/ });
    expect(screen.queryByRole('button', { name: 'Move assemblies' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Record weighing' })).toBeNull();
    expect(screen.getAllByRole('button', { name: '3D view' }).length).toBe(2);
    view.unmount();

    fakeApi({ ...sessionRoutes(venueUser), ...machineRoutes() });
    renderApp(`/p/${ORRERY}/machine`);
    expect(await screen.findByText('This screen is not part of your role')).toBeTruthy();
  });
});

describe('machine screen: editing a section someone else saved meanwhile', { timeout: 30_000 }, () => {
  const patchKey = `PATCH /api/productions/${ORRERY}/machine/sections/${S1}`;
  const theirs = { id: S1, code: 'S1', name: 'Drive core (theirs)', marginPercent: 8, cogUncertaintyMm: null, sortOrder: 0, version: 2 };

  /** Opens S1's edit form, types a new name and saves; returns the form. */
  async function renameS1AndSave(): Promise<HTMLElement> {
    renderApp(`/p/${ORRERY}/machine`);
    await screen.findByRole('heading', { name: /^S1/ });
    fireEvent.click(within(card('S1')).getByRole('button', { name: 'Edit' }));
    const form = await screen.findByRole('form', { name: 'Edit section S1' });
    fireEvent.change(within(form).getByLabelText('Name'), { target: { value: 'Drive core (mine)' } });
    fireEvent.click(within(form).getByRole('button', { name: 'Save section' }));
    return form;
  }

  it('shows their version beside mine, and "Keep mine" saves only my change on top of theirs', async () => {
    const api = fakeApi({
      ...sessionRoutes(planner),
      ...machineRoutes(),
      [patchKey]: (call) =>
        (call.body as { version: number }).version === 1
          ? { status: 409, body: { error: { code: 'conflict', message: 'Someone else saved this in the meantime.', current: theirs } } }
          : { body: { section: { ...theirs, ...(call.body as object), version: 3 } } },
    });
    const form = await renameS1AndSave();

    const notice = await within(form).findByRole('alert');
    expect(within(notice).getByText('Someone else saved this section while you were editing')).toBeTruthy();
    expect(within(notice).getByRole('row', { name: /Name/ }).textContent).toContain('Drive core (theirs)');
    expect(within(notice).getByRole('row', { name: /Name/ }).textContent).toContain('Drive core (mine)');
    // Their margin differs from what this person sees too; it is shown, and keeping mine will not undo it.
    expect(within(notice).getByRole('row', { name: /Margin/ }).textContent).toContain('8');
    expect((within(form).getByLabelText('Name') as HTMLInputElement).value).toBe('Drive core (mine)');

    fireEvent.click(within(notice).getByRole('button', { name: 'Keep mine' }));
    await waitFor(() => expect(api.callsTo(patchKey)).toHaveLength(2));
    expect(api.callsTo(patchKey)[0].body).toEqual({ version: 1, name: 'Drive core (mine)' });
    expect(api.callsTo(patchKey)[1].body).toEqual({ version: 2, name: 'Drive core (mine)' });
  });

  it('"Reload their version" puts their values in the form and saves nothing', async () => {
    const api = fakeApi({ ...sessionRoutes(planner), ...machineRoutes(), [patchKey]: { status: 409, body: { error: { code: 'conflict', message: 'Stale.', current: theirs } } } });
    const form = await renameS1AndSave();
    fireEvent.click(await within(form).findByRole('button', { name: 'Reload their version' }));
    await waitFor(() => expect((within(form).getByLabelText('Name') as HTMLInputElement).value).toBe('Drive core (theirs)'));
    expect((within(form).getByLabelText('Margin (%)') as HTMLInputElement).value).toBe('8');
    expect(within(form).queryByRole('alert')).toBeNull();
    expect(api.callsTo(patchKey)).toHaveLength(1);
  });
});

describe('breakdown tree rows', () => {
  it('writes each assembly heading once, where its lines begin, at its depth', async () => {
    const { treeRows } = await import('../../src/features/machine/components/breakdown-table.tsx');
    const asm = (id: string, number: string, parentId: string | null) => ({ id, number, name: number, parentId, sectionId: null, keepTogether: false, notes: '', version: 1 });
    const line = (id: string, path: string[]) =>
      ({ id, assemblyPath: path, partNumber: id }) as unknown as Parameters<typeof treeRows>[0][number];
    const rows = treeRows([line('x', []), line('a', ['1', '1.1']), line('b', ['1', '1.1']), line('c', ['1', '1.2']), line('d', ['2'])], [asm('1', '1', null), asm('11', '1.1', '1'), asm('12', '1.2', '1'), asm('2', '2', null)], true);
    expect(rows.map((r) => `${r.kind === 'assembly' ? r.assembly.number : r.id}@${r.depth}`)).toEqual(['x@0', '1@0', '1.1@1', 'a@2', 'b@2', '1.2@1', 'c@2', '2@0', 'd@1']);
    expect(treeRows([line('a', ['1'])], [asm('1', '1', null)], false).map((r) => r.kind)).toEqual(['line']);
  });
});
