import type { PackItem, PackVehicle } from '../types.ts';

/**
 * Martello–Pisinger–Vigo (2000) 3D bin-packing instances: line 1 `W H D` (bin), line 2 `n`, then `w h d`
 * per item. In the standard experiment items keep their orientation.
 */
export interface MpvInstance {
  bin: [number, number, number];
  items: [number, number, number][];
}

export function parseMpv(text: string): MpvInstance {
  const nums = text.trim().split(/\s+/).map(Number);
  if (nums.length < 4 || nums.some((v) => !Number.isFinite(v))) throw new Error('3D-BPP file: expected numbers "W H D n w h d …"');
  const n = nums[3];
  if (nums.length !== 4 + 3 * n) throw new Error(`3D-BPP file: ${n} items need ${4 + 3 * n} numbers, found ${nums.length}`);
  const items: [number, number, number][] = [];
  for (let i = 0; i < n; i++) items.push([nums[4 + 3 * i], nums[5 + 3 * i], nums[6 + 3 * i]]);
  return { bin: [nums[0], nums[1], nums[2]], items };
}

export function formatMpv(inst: MpvInstance): string {
  return [inst.bin.join(' '), String(inst.items.length), ...inst.items.map((d) => d.join(' '))].join('\n') + '\n';
}

/**
 * The instance as engine input: w along x, h along y, d along z, fixed orientation, one vehicle per item
 * (enough for any packing; unused ones are not counted).
 */
export function mpvToPackInput(inst: MpvInstance): { vehicles: PackVehicle[]; items: PackItem[] } {
  const [W, H, D] = inst.bin;
  return {
    vehicles: inst.items.map((_, i) => ({ id: `bin-${i + 1}`, lengthMm: W, widthMm: H, heightMm: D })),
    items: inst.items.map((d, i) => ({ id: `item-${i + 1}`, lengthMm: d[0], widthMm: d[1], heightMm: d[2], quantity: 1, orientation: 'fixed' as const })),
  };
}
