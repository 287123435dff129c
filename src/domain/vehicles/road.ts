/**
 * Road vehicles: a European 13.6 m semi-trailer and a two-axle 18 t rigid truck, as editable defaults.
 *
 * Semi-trailer inside about 13,600 × 2,450–2,480 × 2,550–3,000 mm, 33 EUR pallets, payload about
 * 24 t (REFERENCES §4.1 [S, 3rd party]). Axle limits after Directive 96/53/EC Annex I [M]: tri-axle of
 * a semi-trailer 24 t (spacing over 1.3 m up to 1.4 m); single driving axle 11.5 t; two-axle motor
 * vehicle 18 t; articulated 40 t. Kingpin load limit (the tractor's fifth wheel rating), axle
 * positions, unladen axle loads, front-axle share and bed heights are typical figures [PRACTICE]:
 * use the actual vehicle's plate and the operator's figures. The defaults are set so that a full,
 * evenly spread payload keeps every group within its limit (checked in the tests).
 */
import type { Vehicle } from './types.ts';

export const EU_SEMI_TRAILER: Vehicle = Object.freeze({
  id: 'eu-semi-13.6',
  name: 'European semi-trailer 13.6 m',
  kind: 'semi-trailer',
  lengthMm: 13600,
  widthMm: 2480,
  heightMm: 2700,
  doorWidthMm: 2480,
  doorHeightMm: 2650,
  maxPayloadKg: 24000,
  tareKg: 6800,
  bedHeightMm: 1200,
  axles: {
    kind: 'semi-trailer',
    kingpin: { name: 'kingpin', positionMm: 1200, unladenKg: 2600, permittedKg: 12000 },
    axles: { name: 'trailer tri-axle', positionMm: 8900, unladenKg: 4200, permittedKg: 24000 },
  },
  cogLimits: { acrossMm: 0.05 * 2480 },
  source: 'REFERENCES §4.1 [S, 3rd party] sizes and payload; 96/53/EC Annex I [M] axle limits; positions and unladen loads [PRACTICE]',
}) as Vehicle;

export const RIGID_TRUCK_18T: Vehicle = Object.freeze({
  id: 'rigid-18t',
  name: 'Rigid truck 18 t, box body 7.3 m',
  kind: 'rigid-truck',
  lengthMm: 7300,
  widthMm: 2480,
  heightMm: 2600,
  doorWidthMm: 2480,
  doorHeightMm: 2500,
  maxPayloadKg: 10500,
  maxGrossKg: 18000,
  tareKg: 7000,
  bedHeightMm: 1150,
  tailLiftCapacityKg: 1500,
  axles: {
    kind: 'rigid',
    front: { name: 'front axle', positionMm: -1300, unladenKg: 4500, permittedKg: 7100 },
    rear: { name: 'rear axle', positionMm: 4700, unladenKg: 2500, permittedKg: 11500 },
    minFrontShare: 0.25,
  },
  cogLimits: { acrossMm: 0.05 * 2480 },
  source: '96/53/EC Annex I [M] gross and driving axle; body, positions, unladen loads, 25 % front share, tail lift [PRACTICE]',
}) as Vehicle;
