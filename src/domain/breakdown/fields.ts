import type { BreakdownField, BreakdownLine, ImportUnits } from '../contracts/breakdown.ts';

/** How a column's cells are read: text, a plain number, or a quantity in the file's length, mass or volume unit. */
export type FieldKind = 'text' | 'number' | 'length' | 'mass' | 'volume';

export interface FieldInfo {
  kind: FieldKind;
  /** The BreakdownLine field it fills. */
  lineField: keyof BreakdownLine;
  /** Default column header, with the unit where it has one ({L}, {M} are replaced by the unit). */
  header: string;
}

/** Every importable field: how it is read and what it fills. */
export const FIELD_INFO: Record<BreakdownField, FieldInfo> = {
  partNumber: { kind: 'text', lineField: 'partNumber', header: 'Part number' },
  name: { kind: 'text', lineField: 'name', header: 'Name' },
  assemblyNumber: { kind: 'text', lineField: 'assemblyNumber', header: 'Assembly' },
  quantity: { kind: 'number', lineField: 'quantity', header: 'Quantity' },
  unitMass: { kind: 'mass', lineField: 'unitMassKg', header: 'Unit mass ({M})' },
  massSource: { kind: 'text', lineField: 'massSource', header: 'Mass source' },
  material: { kind: 'text', lineField: 'materialCode', header: 'Material' },
  volume: { kind: 'volume', lineField: 'volumeMm3', header: 'Volume ({L}³)' },
  procurement: { kind: 'text', lineField: 'procurement', header: 'Bought or made' },
  unitValue: { kind: 'number', lineField: 'unitValue', header: 'Unit value' },
  currency: { kind: 'text', lineField: 'currency', header: 'Currency' },
  countryOfOrigin: { kind: 'text', lineField: 'countryOfOrigin', header: 'Country of origin' },
  serialNumbers: { kind: 'text', lineField: 'serialNumbers', header: 'Serial numbers' },
  cogX: { kind: 'length', lineField: 'cogMm', header: 'CoG x ({L})' },
  cogY: { kind: 'length', lineField: 'cogMm', header: 'CoG y ({L})' },
  cogZ: { kind: 'length', lineField: 'cogMm', header: 'CoG z ({L})' },
  bboxMinX: { kind: 'length', lineField: 'bboxMm', header: 'Box min x ({L})' },
  bboxMinY: { kind: 'length', lineField: 'bboxMm', header: 'Box min y ({L})' },
  bboxMinZ: { kind: 'length', lineField: 'bboxMm', header: 'Box min z ({L})' },
  bboxMaxX: { kind: 'length', lineField: 'bboxMm', header: 'Box max x ({L})' },
  bboxMaxY: { kind: 'length', lineField: 'bboxMm', header: 'Box max y ({L})' },
  bboxMaxZ: { kind: 'length', lineField: 'bboxMm', header: 'Box max z ({L})' },
  sizeX: { kind: 'length', lineField: 'bboxMm', header: 'Size x ({L})' },
  sizeY: { kind: 'length', lineField: 'bboxMm', header: 'Size y ({L})' },
  sizeZ: { kind: 'length', lineField: 'bboxMm', header: 'Size z ({L})' },
  notes: { kind: 'text', lineField: 'notes', header: 'Notes' },
};

/** The column header Ballast writes for a field in the given units, e.g. "Unit mass (kg)". */
export function defaultHeader(field: BreakdownField, units: ImportUnits): string {
  return FIELD_INFO[field].header.replace('{L}', units.length).replace('{M}', units.mass);
}

/** The fields Ballast exports, in order (the box as min/max, not size). */
export const EXPORT_FIELDS: readonly BreakdownField[] = [
  'partNumber',
  'name',
  'assemblyNumber',
  'quantity',
  'unitMass',
  'massSource',
  'material',
  'volume',
  'procurement',
  'unitValue',
  'currency',
  'countryOfOrigin',
  'serialNumbers',
  'cogX',
  'cogY',
  'cogZ',
  'bboxMinX',
  'bboxMinY',
  'bboxMinZ',
  'bboxMaxX',
  'bboxMaxY',
  'bboxMaxZ',
  'notes',
];

/** The mapping that reads back what Ballast exports in these units (field → default header). */
export function defaultColumnMapping(units: ImportUnits, fields: readonly BreakdownField[] = EXPORT_FIELDS): Partial<Record<BreakdownField, string>> {
  const m: Partial<Record<BreakdownField, string>> = {};
  for (const f of fields) m[f] = defaultHeader(f, units);
  return m;
}
