import { ORRERY } from './fixtures.ts';

/** A 400 kg weighed section, two slings and a hoist, and the lifting settings: the lift plan screens' test data. */
export const SECTION = '7a7a7a7a-1111-4222-8333-444455556666';
export const base = `/api/productions/${ORRERY}/lifting`;

export const load = {
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
export const gear = [
  { id: 'h1', kind: 'hoist', identifier: 'CH-1', ratedLoadKg: 1000, selfWeightKg: 40, chainWeightKg: 15, hoistClass: 'D8+', nextInspectionDate: '2099-01-01', version: 1, updatedAt: '' },
  { id: 's1', kind: 'sling', identifier: 'RS-1', slingType: 'roundsling', verticalRatingKg: 1000, lengthMm: 1200, massKg: 2, nextInspectionDate: '2099-01-01', version: 1, updatedAt: '' },
  { id: 's2', kind: 'sling', identifier: 'RS-2', slingType: 'roundsling', verticalRatingKg: 1000, lengthMm: 1200, massKg: 2, nextInspectionDate: '2099-01-01', version: 1, updatedAt: '' },
];
export const settings = {
  handlingMethod: 'niosh', guidelineColumn: 'women', handlingThresholdKg: 5, maxTeamSize: 3, dynamicFactor: 1.1,
  dynamicFactorSource: 'Test source, Table 5-1', hoistRuleSet: 'igvw-sq-p2', exclusionMarginMm: 1000, version: 1, updatedAt: null,
};

