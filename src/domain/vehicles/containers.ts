/**
 * ISO series 1 freight containers, general purpose.
 *
 * External sizes: ISO 668 (REFERENCES §4.1 [S, 3rd party]). Maximum gross 30,480 kg for 20' and 40'
 * since ISO 668 Amd 1:2005 [S, 3rd party]: always use the plated value of the actual box.
 * Internal and door minima: ISO 1496-1 (8'6" box: internal width 2,330, height 2,350; length 20'
 * 5,867, 40' 11,998; door 2,286 wide, 2,261 high for 8'6" and 2,566 for 9'6") [S, 3rd party].
 * The 9'6" internal height minimum, 2,655 mm, is the 8'6" rule's allowance (2,591 − 2,350 = 241 mm)
 * applied to 2,896 [C]. Typical internal sizes: 20' GP 5,898 × 2,352 × 2,393, 40' HC
 * 12,032 × 2,352 × 2,698 [S, 3rd party; varies by maker]; the 40' GP typical follows the 40' HC length
 * and the 20' height [C]. Typical doors (2,340 wide; 2,280 / 2,585 high) and tares are [M]: they vary
 * by maker.
 *
 * The load's CoG should lie within about ±5 % of the length from the middle (the "60/40" rule: no more
 * than 60 % of the load in either half) [M, CTU Code]; across, within ±5 % of the width [PRACTICE].
 */
import type { Vehicle } from './types.ts';

export interface ContainerType {
  code: '20GP' | '40GP' | '40HC';
  name: string;
  externalMm: [number, number, number];
  /** ISO 1496-1 minimum internal length, width, height. */
  internalMinMm: [number, number, number];
  /** A common maker's internal size. */
  internalTypicalMm: [number, number, number];
  /** ISO 1496-1 minimum door opening width, height. */
  doorMinMm: [number, number];
  doorTypicalMm: [number, number];
  maxGrossKg: number;
  tareTypicalKg: number;
}

export const ISO_MAX_GROSS_KG = 30480;

export const CONTAINER_TYPES: readonly ContainerType[] = Object.freeze([
  {
    code: '20GP',
    name: "20' general purpose",
    externalMm: [6058, 2438, 2591],
    internalMinMm: [5867, 2330, 2350],
    internalTypicalMm: [5898, 2352, 2393],
    doorMinMm: [2286, 2261],
    doorTypicalMm: [2340, 2280],
    maxGrossKg: ISO_MAX_GROSS_KG,
    tareTypicalKg: 2200,
  },
  {
    code: '40GP',
    name: "40' general purpose",
    externalMm: [12192, 2438, 2591],
    internalMinMm: [11998, 2330, 2350],
    internalTypicalMm: [12032, 2352, 2393],
    doorMinMm: [2286, 2261],
    doorTypicalMm: [2340, 2280],
    maxGrossKg: ISO_MAX_GROSS_KG,
    tareTypicalKg: 3750,
  },
  {
    code: '40HC',
    name: "40' high cube",
    externalMm: [12192, 2438, 2896],
    internalMinMm: [11998, 2330, 2655],
    internalTypicalMm: [12032, 2352, 2698],
    doorMinMm: [2286, 2566],
    doorTypicalMm: [2340, 2585],
    maxGrossKg: ISO_MAX_GROSS_KG,
    tareTypicalKg: 3900,
  },
] as ContainerType[]);

/**
 * A container as a vehicle for packing. `sizes: 'minimum'` (default) uses the ISO 1496-1 minima, so a
 * plan that fits will fit any compliant box; 'typical' uses common makers' figures.
 */
export function containerVehicle(code: ContainerType['code'], sizes: 'minimum' | 'typical' = 'minimum', tareKg?: number): Vehicle {
  const t = CONTAINER_TYPES.find((c) => c.code === code);
  if (!t) throw new Error(`Container type "${code}" is not known (${CONTAINER_TYPES.map((c) => c.code).join(', ')}).`);
  const inside = sizes === 'minimum' ? t.internalMinMm : t.internalTypicalMm;
  const door = sizes === 'minimum' ? t.doorMinMm : t.doorTypicalMm;
  const tare = tareKg ?? t.tareTypicalKg;
  return {
    id: `container-${code.toLowerCase()}-${sizes}`,
    name: `${t.name} (${sizes === 'minimum' ? 'ISO 1496-1 minimum sizes' : 'typical sizes'})`,
    kind: 'container',
    lengthMm: inside[0],
    widthMm: inside[1],
    heightMm: inside[2],
    doorWidthMm: door[0],
    doorHeightMm: door[1],
    maxGrossKg: t.maxGrossKg,
    tareKg: tare,
    maxPayloadKg: t.maxGrossKg - tare,
    cogLimits: { alongMm: 0.05 * inside[0], acrossMm: 0.05 * inside[1] },
    source: 'ISO 668 / ISO 1496-1 via REFERENCES §4.1 [S, 3rd party]; tare and typical door [M]; CoG ±5 % [M, CTU Code]',
  };
}
