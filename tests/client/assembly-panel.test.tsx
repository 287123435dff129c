import { fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { AppProviders } from '../../src/app/providers.tsx';
import { createQueryClient } from '../../src/lib/query-client.ts';
import { AssemblyPanel } from '../../src/features/machine/components/assembly-panel.tsx';
import { fakeApi, sessionRoutes } from './helpers/fake-api.ts';
import { ORRERY, planner } from './helpers/fixtures.ts';

const A = '00000000-0000-4000-8000-0000000000c1';
const S1 = '00000000-0000-4000-8000-0000000000a1';
const base = `/api/productions/${ORRERY}/machine/assemblies/${A}`;
const assembly = { id: A, number: 'AC', name: 'Arm carousel', parentId: null, sectionId: null, keepTogether: true, notes: '', version: 2 };
const sections = [{ id: S1, code: 'S1', name: 'Drive core', marginPercent: null, cogUncertaintyMm: null, sortOrder: 0, version: 1 }];

function show(onClose: () => void = () => undefined) {
  render(
    <AppProviders queryClient={createQueryClient({ retry: false })}>
      <AssemblyPanel productionId={ORRERY} assembly={assembly} sections={sections} mass={undefined} mayEdit onClose={onClose} />
    </AppProviders>,
  );
  return screen.getByRole('form', { name: 'Edit assembly AC' });
}

describe('assembly panel', () => {
  it('saves only what changed with the version it started from', async () => {
    const api = fakeApi({ ...sessionRoutes(planner), [`PATCH ${base}`]: (call) => ({ body: { assembly: { ...assembly, ...(call.body as object), version: 3 } } }) });
    const form = show();
    fireEvent.click(within(form).getByLabelText(/Travels in one piece/));
    fireEvent.change(within(form).getByLabelText('Section'), { target: { value: S1 } });
    fireEvent.click(within(form).getByRole('button', { name: 'Save assembly' }));
    expect(await within(form).findByText('Saved.')).toBeTruthy();
    expect(api.callsTo(`PATCH ${base}`)[0].body).toEqual({ version: 2, keepTogether: false, sectionId: S1 });
  });

  it('deletes an assembly that holds parts only after the second, explicit choice', async () => {
    let closed = false;
    const api = fakeApi({
      ...sessionRoutes(planner),
      [`DELETE ${base}`]: (call) =>
        call.path.includes('withContents=true') ? { status: 204 } : { status: 409, body: { error: { code: 'conflict', message: 'Assembly AC holds 2 sub-assemblies and 40 part lines: delete them with it, or move them first.' } } },
    });
    const form = show(() => {
      closed = true;
    });
    fireEvent.click(within(form).getByRole('button', { name: 'Delete assembly' }));
    fireEvent.click(within(form).getByRole('button', { name: 'Delete AC' }));
    expect(await within(form).findByText(/holds 2 sub-assemblies and 40 part lines/)).toBeTruthy();
    expect(closed).toBe(false);
    fireEvent.click(within(form).getByRole('button', { name: 'Delete it with everything it holds' }));
    await waitFor(() => expect(closed).toBe(true));
    expect(api.callsTo(`DELETE ${base}`).map((c) => c.path.includes('withContents=true'))).toEqual([false, true]);
  });
});
