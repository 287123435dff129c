/**
 * Chargeable weight per shipment (REFERENCES §4.2).
 *  - Air: volumetric kg = L × W × H (cm) / divisor; divisor 6,000 cm³/kg [S: airport authority tariff;
 *    IATA practice], some couriers 5,000: a setting. Chargeable = max(actual, volumetric).
 *  - Road: loading metres = length × width (m) / 2.4 (the trailer's usable width); the kg charged per
 *    loading metre varies by carrier (1,750–1,850): a setting, default 1,750 [CP].
 *  - Sea: revenue tonnes = max(m³, t) [CP].
 * Pieces in mm and kg. Air is summed piece by piece, each piece's size as measured (some carriers
 * round each dimension up to the whole cm: the `roundUpCm` option).
 */

export interface ShipmentPiece {
  lengthMm: number;
  widthMm: number;
  heightMm: number;
  massKg: number;
  quantity?: number;
}

export const AIR_DIVISOR_CM3_PER_KG = 6000;
export const ROAD_KG_PER_LOADING_METRE = 1750;
export const LOADING_METRE_WIDTH_M = 2.4;

function checkPiece(p: ShipmentPiece, i: number): number {
  for (const k of ['lengthMm', 'widthMm', 'heightMm'] as const) {
    if (!Number.isFinite(p[k]) || p[k] <= 0) throw new Error(`Piece ${i + 1}: ${k} must be above zero (got ${String(p[k])}).`);
  }
  if (!Number.isFinite(p.massKg) || p.massKg < 0) throw new Error(`Piece ${i + 1}: massKg must not be below zero (got ${String(p.massKg)}).`);
  const q = p.quantity ?? 1;
  if (!Number.isInteger(q) || q < 1) throw new Error(`Piece ${i + 1}: quantity must be a whole number of at least 1 (got ${String(q)}).`);
  return q;
}

export interface AirChargeable {
  actualKg: number;
  volumetricKg: number;
  chargeableKg: number;
  divisorCm3PerKg: number;
}

export function airChargeable(pieces: readonly ShipmentPiece[], options: { divisorCm3PerKg?: number; roundUpCm?: boolean } = {}): AirChargeable {
  const divisor = options.divisorCm3PerKg ?? AIR_DIVISOR_CM3_PER_KG;
  if (!(divisor > 0)) throw new Error(`Air divisor must be above zero (got ${String(divisor)} cm³/kg).`);
  let actual = 0;
  let volumetric = 0;
  pieces.forEach((p, i) => {
    const q = checkPiece(p, i);
    const cm = (mm: number) => (options.roundUpCm ? Math.ceil(mm / 10 - 1e-9) : mm / 10);
    actual += q * p.massKg;
    volumetric += (q * cm(p.lengthMm) * cm(p.widthMm) * cm(p.heightMm)) / divisor;
  });
  return { actualKg: actual, volumetricKg: volumetric, chargeableKg: Math.max(actual, volumetric), divisorCm3PerKg: divisor };
}

export interface RoadChargeable {
  actualKg: number;
  loadingMetres: number;
  loadingMetreKg: number;
  chargeableKg: number;
}

/**
 * Road: loading metres of pieces standing on the floor. Pieces that stand on others take no floor
 * (`stackedOnOthers`), so give only the floor-standing pieces, or set that flag per piece.
 */
export function roadChargeable(pieces: readonly (ShipmentPiece & { stackedOnOthers?: boolean })[], options: { kgPerLoadingMetre?: number } = {}): RoadChargeable {
  const kgPerLdm = options.kgPerLoadingMetre ?? ROAD_KG_PER_LOADING_METRE;
  if (!(kgPerLdm > 0)) throw new Error(`Kg per loading metre must be above zero (got ${String(kgPerLdm)}).`);
  let actual = 0;
  let ldm = 0;
  pieces.forEach((p, i) => {
    const q = checkPiece(p, i);
    actual += q * p.massKg;
    if (!p.stackedOnOthers) ldm += (q * (p.lengthMm / 1000) * (p.widthMm / 1000)) / LOADING_METRE_WIDTH_M;
  });
  const loadingMetreKg = ldm * kgPerLdm;
  return { actualKg: actual, loadingMetres: ldm, loadingMetreKg, chargeableKg: Math.max(actual, loadingMetreKg) };
}

export interface SeaChargeable {
  actualKg: number;
  volumeM3: number;
  revenueTonnes: number;
}

export function seaChargeable(pieces: readonly ShipmentPiece[]): SeaChargeable {
  let actual = 0;
  let volume = 0;
  pieces.forEach((p, i) => {
    const q = checkPiece(p, i);
    actual += q * p.massKg;
    volume += (q * p.lengthMm * p.widthMm * p.heightMm) / 1e9;
  });
  return { actualKg: actual, volumeM3: volume, revenueTonnes: Math.max(volume, actual / 1000) };
}
