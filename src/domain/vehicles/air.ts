/**
 * Air-freight pallet: the common 96 × 125 in main-deck pallet (IATA ULD type code PMC / P6P).
 * Base 2,438 × 3,175 mm; about 50 mm is lost at each edge to the net's rail, so the usable plan is
 * taken as 3,073 × 2,336 mm; main-deck contour height 2,438 mm (96 in; freighters take up to 118 in);
 * max gross 6,804 kg (15,000 lb); tare with net about 120 kg. All [M]: the airline's ULD sheet and the
 * aircraft's contour prevail.
 */
import { KG_PER_POUND, MM_PER_INCH } from '../units.ts';
import type { Vehicle } from './types.ts';

const MAX_GROSS_KG = Math.round(15000 * KG_PER_POUND);
const TARE_KG = 120;

export const AIR_PALLET_MAIN_DECK: Vehicle = Object.freeze({
  id: 'air-pmc-main-deck',
  name: 'Air pallet 96 × 125 in (PMC), main deck 96 in contour',
  kind: 'air-pallet',
  lengthMm: Math.round(125 * MM_PER_INCH) - 102,
  widthMm: Math.round(96 * MM_PER_INCH) - 102,
  heightMm: Math.round(96 * MM_PER_INCH),
  maxGrossKg: MAX_GROSS_KG,
  tareKg: TARE_KG,
  maxPayloadKg: MAX_GROSS_KG - TARE_KG,
  source: '[M] IATA ULD PMC/P6P base 96 × 125 in, 15,000 lb gross, 96 in main-deck contour; usable margin and tare [PRACTICE]',
}) as Vehicle;
