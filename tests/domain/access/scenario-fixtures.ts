/**
 * Crates and venues of the demo scenario (/work/shared/SCENARIO.md), with invented but plausible
 * figures. Nothing here is real.
 */
import type { AccessCrate, AccessVenue } from '../../../src/domain/access/index.ts';

/** Drive core crate: ~420 kg section + ~100 kg crate. 1,150 mm wide, so upright it misses a 1,100 mm door. */
export const driveCoreCrate: AccessCrate = {
  id: 'DC',
  lengthMm: 1600,
  widthMm: 1150,
  heightMm: 1000,
  grossKg: 520,
  mayTilt: false,
  supports: { kind: 'skids', count: 2, widthMm: 100 },
};

/** A planet carrier case: one person lifts it. */
export const planetCase: AccessCrate = { id: 'PC1', lengthMm: 600, widthMm: 400, heightMm: 400, grossKg: 18, mayTilt: true, carriedByHand: true };

/** Control desk on four castors. */
export const controlDesk: AccessCrate = {
  id: 'CD',
  lengthMm: 1400,
  widthMm: 800,
  heightMm: 1100,
  grossKg: 70,
  mayTilt: false,
  supports: { kind: 'castors', count: 4 },
};

/** Barcelona: a 1,100 mm corridor door on the route. */
export const salaVentolina: AccessVenue = {
  doors: [
    { name: 'scene dock door', widthMm: 2400, heightMm: 3000 },
    { name: 'corridor door', widthMm: 1100, heightMm: 2100 },
  ],
  floorRatingKnPerM2: 7.5,
};

/** Gothenburg: freight lift of unknown class, 2,000 kg rated. */
export const havsljusScen: AccessVenue = {
  doors: [{ name: 'goods door', widthMm: 2000, heightMm: 2400 }],
  lift: { name: 'goods lift', carLengthMm: 2700, carWidthMm: 1500, carHeightMm: 2200, doorWidthMm: 1300, doorHeightMm: 2100, ratedLoadKg: 2000 },
  floorRatingKnPerM2: 7.5,
  handlingEquipmentKg: 65,
};

/** Gdańsk: stage floor 5.0 kN/m². */
export const teatrBursztynowy: AccessVenue = {
  doors: [{ name: 'stage door', widthMm: 2000, heightMm: 2500 }],
  floorRatingKnPerM2: 5.0,
};

/** Lyon: a 9 % ramp, only a hand pallet truck on site. */
export const forumAurelian: AccessVenue = {
  doors: [{ name: 'ramp door', widthMm: 2200, heightMm: 2600 }],
  floorRatingKnPerM2: 7.5,
  ramps: [{ name: 'access ramp', gradientPct: 9 }],
  equipment: [{ kind: 'hand-pallet-truck', capacityKg: 2000 }],
};

/** Rotterdam: street-level doors, no dock. */
export const kelderwerfHall: AccessVenue = {
  doors: [{ name: 'street doors', widthMm: 3000, heightMm: 3500 }],
  floorRatingKnPerM2: 10,
  dock: { kind: 'street' },
  handlingEquipmentKg: 65,
};
