import { fireEvent, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { AccessMatrixView } from '../../src/domain/contracts/tour.ts';
import { fakeApi, sessionRoutes } from './helpers/fake-api.ts';
import { ORRERY, planner, production, venueUser } from './helpers/fixtures.ts';
import { renderApp } from './helpers/render-app.tsx';

const E_SALA = 'e0000000-0000-4000-8000-000000000001';
const E_HAVS = 'e0000000-0000-4000-8000-000000000002';
const DC = 'c0000000-0000-4000-8000-000000000001';
const BQ1 = 'c0000000-0000-4000-8000-000000000002';

const matrix: AccessMatrixView = {
  rows: [
    { id: DC, kind: 'crate', code: 'DC', name: 'Drive core', lengthMm: 1200, widthMm: 1120, heightMm: 1050, grossKg: 700, mayTilt: false },
    { id: BQ1, kind: 'crate', code: 'BQ1', name: 'Base quadrant 1', lengthMm: 1300, widthMm: 900, heightMm: 700, grossKg: 130, mayTilt: true },
  ],
  columns: [
    { venueId: 'v1', engagementId: E_SALA, venueName: 'Sala Ventolina', city: 'Barcelona', loadInOn: '2027-02-15', vehicleName: 'Semi-trailer 1' },
    { venueId: 'v2', engagementId: E_HAVS, venueName: 'Havsljus Scen', city: 'Gothenburg', loadInOn: '2027-02-24', vehicleName: null },
  ],
  cells: [
    {
      rowId: DC,
      engagementId: E_SALA,
      verdict: 'fail',
      tightestText: 'corridor door B2: -20 mm',
      findings: [
        { check: 'door', verdict: 'fail', where: 'corridor door B2', reason: 'corridor door B2: does not pass upright (this way up; tilting not allowed); best face 1,120 wide × 1,050 high is 20 mm over the door width of 1,100 mm', margin: -20, marginUnit: 'mm', marginRatio: -0.018 },
        { check: 'floor', verdict: 'pass', where: 'floor', reason: 'floor: 5.11 kN/m² over the 1.34 m² footprint against a rating of 7.50 kN/m²', margin: 2.39, marginUnit: 'kN/m²' },
      ],
    },
    {
      rowId: DC,
      engagementId: E_HAVS,
      verdict: 'unknown',
      tightestText: 'door: unknown',
      findings: [{ check: 'door', verdict: 'unknown', reason: 'not checked: no doors recorded on the route (door width unknown)' }],
    },
    { rowId: BQ1, engagementId: E_SALA, verdict: 'pass', tightestText: 'corridor door B2: +200 mm', findings: [{ check: 'door', verdict: 'pass', where: 'corridor door B2', reason: 'passes', margin: 200, marginUnit: 'mm' }] },
    { rowId: BQ1, engagementId: E_HAVS, verdict: 'pass', tightestText: 'floor: +8.00 kN/m²', findings: [{ check: 'floor', verdict: 'pass', reason: 'floor ok', margin: 8, marginUnit: 'kN/m²' }] },
  ],
  verdict: 'fail',
  counts: { pass: 2, fail: 1, unknown: 1 },
};

function setup(user = planner) {
  return fakeApi({
    ...sessionRoutes(user),
    [`GET /api/productions/${ORRERY}`]: { body: { production: production() } },
    [`GET /api/productions/${ORRERY}/tour/access-matrix`]: { body: { matrix } },
  });
}

describe('tour access matrix', () => {
  it('shows each crate at each venue with its verdict in words and its tightest point', async () => {
    setup();
    renderApp(`/p/${ORRERY}/tour/matrix`);
    const table = await screen.findByRole('table', { name: /Access matrix/ });
    expect(within(table).getAllByRole('columnheader').map((h) => h.textContent)).toEqual(['Crate', expect.stringContaining('Sala Ventolina'), expect.stringContaining('Havsljus Scen')]);
    const fail = within(table).getByRole('button', { name: 'DC at Sala Ventolina: fails (corridor door B2: -20 mm)' });
    expect(fail.textContent).toContain('fails');
    // An unknown is marked as such, never as a pass.
    const unknown = within(table).getByRole('button', { name: /DC at Havsljus Scen: not checked/ });
    expect(unknown.textContent).toContain('not checked');
    expect(unknown.textContent).not.toContain('pass');
  });

  it('lists every failure with its reason and margin, and every check that could not be made', async () => {
    setup();
    renderApp(`/p/${ORRERY}/tour/matrix`);
    const failures = await screen.findByRole('region', { name: /Failures \(1\)/ });
    expect(failures.textContent).toContain('DC at Sala Ventolina');
    expect(failures.textContent).toContain('20 mm over the door width of 1,100 mm');
    expect(failures.textContent).toContain('margin −20 mm');
    const unknowns = screen.getByRole('region', { name: /Not checked: data missing \(1\)/ });
    expect(unknowns.textContent).toContain('door width unknown');
  });

  it('opens a cell to show all its findings, and can hide crates that pass everywhere', async () => {
    setup();
    renderApp(`/p/${ORRERY}/tour/matrix`);
    fireEvent.click(await screen.findByRole('button', { name: /DC at Sala Ventolina/ }));
    const detail = screen.getByRole('region', { name: 'Checks of DC at Sala Ventolina' });
    expect(within(detail).getByText(/against a rating of 7.50/)).toBeTruthy();
    expect(within(detail).getByText('margin +2.39 kN/m²')).toBeTruthy();

    const table = screen.getByRole('table', { name: /Access matrix/ });
    expect(within(table).getByRole('rowheader', { name: /BQ1/ })).toBeTruthy();
    fireEvent.click(screen.getByLabelText('Only crates with problems'));
    expect(within(table).queryByRole('rowheader', { name: /BQ1/ })).toBeNull();
    expect(within(table).getByRole('rowheader', { name: /DC/ })).toBeTruthy();
  });

  it('is not offered to venue staff', async () => {
    const api = setup(venueUser);
    renderApp(`/p/${ORRERY}/tour/matrix`);
    expect(await screen.findByText('This screen is not part of your role')).toBeTruthy();
    expect(api.callsTo(`GET /api/productions/${ORRERY}/tour/access-matrix`)).toHaveLength(0);
  });
});
