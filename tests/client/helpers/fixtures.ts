import type { SessionUser } from '../../../src/lib/session.ts';

export const ORRERY = '6f1c2d3e-4a5b-4c6d-8e7f-0a1b2c3d4e5f';
export const SPARE = '0b9a8c7d-6e5f-4a3b-9c2d-1e0f9a8b7c6d';
export const VENUE_HALL = '3c4d5e6f-7a8b-4c9d-8e0f-1a2b3c4d5e6f';

const base = { email: 'demo@ballast.test', units: 'metric' as const, isAdmin: false };

export const planner: SessionUser = {
  ...base,
  id: '11111111-1111-4111-8111-111111111111',
  name: 'Pia Planner',
  memberships: [
    { productionId: ORRERY, productionName: 'Orrery Seven tour', role: 'planner', venueIds: [], paperSize: 'A4' },
    { productionId: SPARE, productionName: 'Winter revival', role: 'rigger', venueIds: [], paperSize: 'Letter' },
  ],
};

export const rigger: SessionUser = {
  ...base,
  id: '22222222-2222-4222-8222-222222222222',
  name: 'Rik Rigger',
  memberships: [{ productionId: ORRERY, productionName: 'Orrery Seven tour', role: 'rigger', venueIds: [], paperSize: 'A4' }],
};

export const venueUser: SessionUser = {
  ...base,
  id: '33333333-3333-4333-8333-333333333333',
  name: 'Vera Venue',
  memberships: [{ productionId: ORRERY, productionName: 'Orrery Seven tour', role: 'venue', venueIds: [VENUE_HALL], paperSize: 'A4' }],
};

export const admin: SessionUser = {
  ...base,
  id: '44444444-4444-4444-8444-444444444444',
  name: 'Ada Admin',
  isAdmin: true,
  memberships: [{ productionId: ORRERY, productionName: 'Orrery Seven tour', role: 'rigger', venueIds: [], paperSize: 'A4' }],
};

export const adminWithoutProductions: SessionUser = { ...admin, memberships: [] };
export const newcomer: SessionUser = { ...base, id: '55555555-5555-4555-8555-555555555555', name: 'Nico New', memberships: [] };

export function production(over: Partial<{ id: string; name: string; machineName: string; paperSize: 'A4' | 'Letter'; defaultUnits: 'metric' | 'imperial'; version: number }> = {}) {
  return {
    id: ORRERY,
    name: 'Orrery Seven tour',
    machineName: 'Orrery Seven',
    paperSize: 'A4',
    defaultUnits: 'metric',
    version: 3,
    updatedAt: '2026-03-01T09:30:00.000Z',
    ...over,
  };
}
