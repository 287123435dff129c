/**
 * Tipping of a free-standing crate under transport accelerations.
 *
 * Statics [C] (REFERENCES §4.4): under a horizontal acceleration a (in g) and a vertical one c_z (in g,
 * 1.0 on the road), a rigid block tips about its leading bottom edge when a > c_z · b / h, with b the
 * horizontal distance from the CoG to that edge and h the CoG height above the floor. Friction and
 * sliding are a separate matter (a crate may slide before it tips): this check is only about tipping.
 * A crate that tips must be lashed or blocked: say so on its packing list.
 *
 * The crate rests on its footprint [0, L] × [0, W] (outer skids flush with its sides).
 */
import type { Vec3 } from '../geometry/vec3.ts';

export interface AccelerationProfile {
  id: string;
  name: string;
  /** Horizontal accelerations, g. */
  forwardG: number;
  backwardG: number;
  sidewaysG: number;
  /** Vertical acceleration acting with each horizontal one, g (1.0 on the road). */
  verticalWithLongitudinalG: number;
  verticalWithSidewaysG: number;
  source: string;
}

/** Road, insurers' packaging handbook: 1.0 g forward, 0.5 g back and sideways (REFERENCES §4.4 [S]). Default. */
export const ROAD_1G: AccelerationProfile = {
  id: 'road-1g',
  name: 'Road (1.0 g forward)',
  forwardG: 1.0,
  backwardG: 0.5,
  sidewaysG: 0.5,
  verticalWithLongitudinalG: 1.0,
  verticalWithSidewaysG: 1.0,
  source: "[S] insurers' packaging handbook, as summarised in REFERENCES §4.4",
};

/** Road per the IMO/ILO/UNECE CTU Code (2014): 0.8 g forward (REFERENCES §4.4 [M]). */
export const ROAD_CTU: AccelerationProfile = {
  ...ROAD_1G,
  id: 'road-ctu',
  name: 'Road (CTU Code, 0.8 g forward)',
  forwardG: 0.8,
  source: '[M] CTU Code (2014) Annex 7, road; REFERENCES §4.4',
};

/**
 * Sea areas A, B, C of the CTU Code (2014) Annex 7 [M]: longitudinal 0.3 / 0.3 / 0.4 g with vertical
 * 0.5 / 0.3 / 0.2 g; transverse 0.5 / 0.7 / 0.8 g with vertical 1.0 g. From memory: confirm against
 * the Code before relying on them.
 */
export const SEA_AREAS: readonly AccelerationProfile[] = [
  { id: 'sea-a', name: 'Sea area A', forwardG: 0.3, backwardG: 0.3, sidewaysG: 0.5, verticalWithLongitudinalG: 0.5, verticalWithSidewaysG: 1.0, source: '[M] CTU Code (2014) Annex 7' },
  { id: 'sea-b', name: 'Sea area B', forwardG: 0.3, backwardG: 0.3, sidewaysG: 0.7, verticalWithLongitudinalG: 0.3, verticalWithSidewaysG: 1.0, source: '[M] CTU Code (2014) Annex 7' },
  { id: 'sea-c', name: 'Sea area C', forwardG: 0.4, backwardG: 0.4, sidewaysG: 0.8, verticalWithLongitudinalG: 0.2, verticalWithSidewaysG: 1.0, source: '[M] CTU Code (2014) Annex 7' },
];

export type TipEdge = 'x=0' | 'x=L' | 'y=0' | 'y=W';

export interface TipDirection {
  /** The bottom edge the crate would tip about. */
  edge: TipEdge;
  /** Which acceleration acts towards that edge. */
  acts: 'forward' | 'backward' | 'sideways';
  accelerationG: number;
  verticalG: number;
  /** b / h, dimensionless. */
  bOverH: number;
  /** c_z · b/h − a, in g: negative when it tips. */
  marginG: number;
  tips: boolean;
}

export interface TippingResult {
  profile: string;
  directions: TipDirection[];
  tips: boolean;
  /** The direction with the least margin. */
  worst: TipDirection;
  /** What the packing list says. */
  action: 'free-standing' | 'lash or block';
  note: string;
}

/**
 * How the crate rides on the vehicle: 'length-along' (either end may face forward: both ends get the
 * forward acceleration, the sides the sideways one), 'width-along' (the other way), or 'any' (every
 * edge gets the largest acceleration: use when the loading is not yet planned). Default 'any'.
 */
export type RideOrientation = 'length-along' | 'width-along' | 'any';

/**
 * Tipping check of a crate with outer plan size L × W (mm) and CoG (crate frame, origin at the outer
 * bottom corner) under an acceleration profile. Throws when the CoG lies outside the footprint or at
 * or below the floor, naming the coordinate.
 */
export function tippingCheck(
  footprint: { lengthMm: number; widthMm: number },
  cogMm: Vec3,
  profile: AccelerationProfile = ROAD_1G,
  ride: RideOrientation = 'any',
): TippingResult {
  const { lengthMm: L, widthMm: W } = footprint;
  const [x, y, h] = cogMm;
  if (!(L > 0 && W > 0)) throw new Error(`Tipping: footprint must be positive (got ${L} × ${W} mm).`);
  if (!(x >= 0 && x <= L)) throw new Error(`Tipping: CoG x = ${x} mm lies outside the footprint length 0–${L} mm.`);
  if (!(y >= 0 && y <= W)) throw new Error(`Tipping: CoG y = ${y} mm lies outside the footprint width 0–${W} mm.`);
  if (!(h > 0)) throw new Error(`Tipping: CoG height must be above the floor (got ${h} mm).`);
  const edges: { edge: TipEdge; b: number; longitudinal: boolean }[] = [
    { edge: 'x=0', b: x, longitudinal: true },
    { edge: 'x=L', b: L - x, longitudinal: true },
    { edge: 'y=0', b: y, longitudinal: false },
    { edge: 'y=W', b: W - y, longitudinal: false },
  ];
  const long = { acts: 'forward' as const, a: profile.forwardG, cz: profile.verticalWithLongitudinalG };
  const side = { acts: 'sideways' as const, a: profile.sidewaysG, cz: profile.verticalWithSidewaysG };
  const directions: TipDirection[] = edges.map(({ edge, b, longitudinal }) => {
    let load: { acts: 'forward' | 'backward' | 'sideways'; a: number; cz: number };
    if (ride === 'any') {
      // Worst case: whichever acceleration gives the least margin on this edge.
      const options = [long, side];
      load = options.reduce((w, o) => ((b / h) * o.cz - o.a < (b / h) * w.cz - w.a ? o : w));
    } else {
      const alongEdge = ride === 'length-along' ? longitudinal : !longitudinal;
      load = alongEdge ? long : side;
    }
    const bOverH = b / h;
    const marginG = bOverH * load.cz - load.a;
    return { edge, acts: load.acts, accelerationG: load.a, verticalG: load.cz, bOverH, marginG, tips: marginG < 0 };
  });
  const worst = directions.reduce((w, d) => (d.marginG < w.marginG ? d : w));
  const tips = directions.some((d) => d.tips);
  return {
    profile: profile.id,
    directions,
    tips,
    worst,
    action: tips ? 'lash or block' : 'free-standing',
    note: tips
      ? `Tips under ${worst.accelerationG} g ${worst.acts} (${profile.name}): b/h = ${worst.bOverH.toFixed(2)} at edge ${worst.edge}. Lash or block.`
      : `Stands under ${profile.name}: least b/h margin ${worst.marginG.toFixed(2)} g at edge ${worst.edge}. Secure against sliding all the same.`,
  };
}
