/**
 * Stock cases, boxes and pallets as data, with sources. Sizes in mm, masses in kg.
 */

export interface StockItem {
  id: string;
  name: string;
  kind: 'pallet' | 'case' | 'box';
  /** Outer length, width, height, mm. */
  outerMm: [number, number, number];
  /** Inner length, width, height, mm (a pallet has none). */
  innerMm?: [number, number, number];
  tareKg: number;
  /** Largest gross (pallet: its safe working load on top), kg. */
  maxLoadKg?: number;
  stackable: boolean;
  source: string;
}

/** EUR pallet, EN 13698-1: 1,200 × 800 × 144 mm, about 25 kg, safe working load 1,500 kg (REFERENCES §4.1 [S, EPAL]). */
export const EUR_PALLET: StockItem = {
  id: 'eur-pallet',
  name: 'EUR pallet (EN 13698-1)',
  kind: 'pallet',
  outerMm: [1200, 800, 144],
  tareKg: 25,
  maxLoadKg: 1500,
  stackable: true,
  source: '[S, EPAL] EN 13698-1, REFERENCES §4.1',
};

/**
 * ISO 6780 plan sizes (REFERENCES §4.1 [S, 3rd party]). The standard fixes the plan only; the height
 * (about 150 mm) and tare are typical [PRACTICE].
 */
export const ISO_6780_PALLETS: readonly StockItem[] = (
  [
    [1200, 800],
    [1200, 1000],
    [1219, 1016],
    [1140, 1140],
    [1067, 1067],
    [1100, 1100],
  ] as const
).map(([l, w]) => ({
  id: `iso6780-${l}x${w}`,
  name: `ISO 6780 pallet ${l} × ${w}`,
  kind: 'pallet' as const,
  outerMm: [l, w, 150] as [number, number, number],
  tareKg: Math.round((25 * (l * w)) / (1200 * 800)),
  stackable: true,
  source: '[S, 3rd party] ISO 6780 plan size (REFERENCES §4.1); height 150 mm and tare scaled from the EUR pallet [PRACTICE]',
}));

/**
 * Ballast's stock cases, sized on the 600 × 400 mm packaging module of ISO 3394 so that they tile a
 * EUR pallet (two by two) [M]. Wall 12 mm plywood with aluminium edging; tares are estimates
 * [PRACTICE]: weigh your own cases.
 */
export const STOCK_CASES: readonly StockItem[] = [
  { id: 'case-600x400x400', name: 'Stock case 600 × 400 × 400', kind: 'case', outerMm: [600, 400, 400], innerMm: [570, 370, 360], tareKg: 9, maxLoadKg: 60, stackable: true, source: '[M] ISO 3394 module; tare [PRACTICE]' },
  { id: 'case-600x400x600', name: 'Stock case 600 × 400 × 600', kind: 'case', outerMm: [600, 400, 600], innerMm: [570, 370, 560], tareKg: 12, maxLoadKg: 80, stackable: true, source: '[M] ISO 3394 module; tare [PRACTICE]' },
  { id: 'case-1200x800x800', name: 'Stock case 1200 × 800 × 800', kind: 'case', outerMm: [1200, 800, 800], innerMm: [1160, 760, 730], tareKg: 45, maxLoadKg: 400, stackable: true, source: '[M] ISO 3394 module ×2; tare [PRACTICE]' },
  { id: 'box-400x300x300', name: 'Carton 400 × 300 × 300', kind: 'box', outerMm: [400, 300, 300], innerMm: [390, 290, 285], tareKg: 0.6, maxLoadKg: 20, stackable: true, source: '[M] ISO 3394 module 400 × 300; tare [PRACTICE]' },
];
