/**
 * Mass-core benchmark: prints figures, asserts nothing (targets from issue 3: 100,000 part lines < 50 ms,
 * a 1,000,000-triangle mesh < 1 s). Run: npx tsx scripts/bench/mass.ts
 */
import { loadavg, cpus } from 'node:os';
import { massProperties, meshMassProperties, parseStl, type MassAssembly, type MassPartLine } from '../../src/domain/mass/index.ts';
import { torus } from '../../tests/domain/mass/mesh-builders.ts';

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

/** Wall-clock and CPU time per run. CPU time (this process, all threads) is the steadier figure when the
 * machine is shared; on a busy machine wall time can be several times larger. */
function time<T>(fn: () => T, runs: number): { ms: number[]; cpuMs: number[]; result: T } {
  const ms: number[] = [];
  const cpuMs: number[] = [];
  let result!: T;
  for (let i = 0; i < runs; i++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    result = fn();
    ms.push(performance.now() - t0);
    const c = process.cpuUsage(c0);
    cpuMs.push((c.user + c.system) / 1000);
  }
  return { ms, cpuMs, result };
}

function fmt(r: { ms: number[]; cpuMs: number[] }): string {
  return `wall median ${median(r.ms).toFixed(1)} ms (best ${Math.min(...r.ms).toFixed(1)}), CPU median ${median(r.cpuMs).toFixed(1)} ms (best ${Math.min(...r.cpuMs).toFixed(1)}), ${r.ms.length} runs`;
}

console.log(`machine: ${cpus().length} cores, load average ${loadavg().map((l) => l.toFixed(1)).join(' / ')} (1 / 5 / 15 min)`);

// --- 100,000 part lines: 2,000 assemblies four levels deep, 20 sections, a tenth of the lines placed as
// instances (half of those turned), most with boxes, a few gaps.
let seed = 12345;
const rand = (): number => ((seed = (seed * 48271) % 2147483647) - 1) / 2147483646;
const SOURCES = ['weighed', 'catalogue', 'cad', 'estimated'] as const;
const assemblies: MassAssembly[] = [];
for (let i = 0; i < 2000; i++) {
  const parentId = i < 20 ? null : `A${Math.floor(rand() * Math.min(i, 20 * Math.ceil(i / 400)))}`;
  assemblies.push({ id: `A${i}`, parentId, sectionId: i < 20 ? `S${i}` : null });
}
const sections = Array.from({ length: 20 }, (_, i) => ({ id: `S${i}` }));
const lines: MassPartLine[] = [];
for (let i = 0; i < 100_000; i++) {
  const c: [number, number, number] = [rand() * 4000 - 2000, rand() * 4000 - 2000, rand() * 3000];
  const half = [5 + rand() * 200, 5 + rand() * 200, 5 + rand() * 200];
  const withInstances = i % 10 === 0;
  const q = withInstances ? 1 + Math.floor(rand() * 8) : 1 + Math.floor(rand() * 4);
  lines.push({
    id: `L${i}`,
    assemblyId: `A${Math.floor(rand() * 2000)}`,
    quantity: q,
    unitMassKg: i % 997 === 0 ? null : rand() * 20,
    massSource: SOURCES[i % 4],
    cogMm: withInstances ? [0, 0, 0] : c,
    bboxMm: i % 7 === 0 ? null : withInstances
      ? { minMm: [-half[0], -half[1], -half[2]], maxMm: [half[0], half[1], half[2]] }
      : { minMm: [c[0] - half[0], c[1] - half[1], c[2] - half[2]], maxMm: [c[0] + half[0], c[1] + half[1], c[2] + half[2]] },
    instances: withInstances
      ? Array.from({ length: q }, (_, k) => ({ positionMm: [c[0] + k * 100, c[1], c[2]] as [number, number, number], eulerZyxDeg: (i % 20 === 0 ? [k * 45, 0, 10] : [0, 0, 0]) as [number, number, number] }))
      : undefined,
  });
}
const addOns = sections.map((s, i) => ({ id: `F${i}`, sectionId: s.id, massKg: 40, massSource: 'weighed' as const, cogMm: [0, 0, 50] as [number, number, number] }));
const input = { lines, assemblies, sections, addOns, marginPercent: 10 };
time(() => massProperties(input), 5); // warm-up
const tree = time(() => massProperties(input), 21);
const r = tree.result;
console.log(`massProperties, 100,000 part lines (${assemblies.length} assemblies, ${sections.length} sections): ${fmt(tree)}  [target < 50 ms]`);
console.log(`  total ${r.total.massKg.toFixed(1)} kg, ${r.gaps.length} gaps, ${r.total.approximateLineCount} approximate lines`);

// --- 1,000,000-triangle closed mesh (a torus, 1,000 × 500 quads), as number data in a Float64Array and as
// float32 from a binary STL.
const mesh = torus(1000, 250, 1000, 500);
console.log(`\nmesh: ${mesh.length / 9} triangles`);
meshMassProperties(mesh, 7850); // warm-up
const m64 = time(() => meshMassProperties(mesh, 7850), 5);
console.log(`meshMassProperties, 1,000,000 triangles (Float64Array): ${fmt(m64)}  [target < 1,000 ms]`);
const exactV = 2 * Math.PI ** 2 * 1000 * 250 ** 2;
console.log(`  volume ${m64.result.volumeMm3.toExponential(6)} mm³ (torus 2π²Rr² = ${exactV.toExponential(6)}), mass ${m64.result.massKg.toFixed(2)} kg`);

const n = mesh.length / 9;
const stl = new Uint8Array(84 + 50 * n);
const view = new DataView(stl.buffer);
view.setUint32(80, n, true);
for (let t = 0; t < n; t++) for (let j = 0; j < 9; j++) view.setFloat32(84 + 50 * t + 12 + 4 * j, mesh[9 * t + j], true);
const parse = time(() => parseStl(stl, 'mm'), 3);
console.log(`parseStl, binary, 1,000,000 triangles (${(stl.length / 1e6).toFixed(0)} MB): ${fmt(parse)}`);
const m32 = time(() => meshMassProperties(parse.result.trianglesMm, 7850), 3);
console.log(`meshMassProperties on the STL's triangles: ${fmt(m32)}`);

// --- Parts-list validation (the pure part of an import): 10,000 CSV rows read by papaparse, then checked.
const { importBreakdownRows, defaultColumnMapping } = await import('../../src/domain/breakdown/index.ts');
const Papa = (await import('papaparse')).default;
const csvLines = ['Part number,Name,Assembly,Quantity,Unit mass (kg),Mass source,Material,CoG x (mm),CoG y (mm),CoG z (mm)'];
for (let i = 0; i < 10_000; i++) csvLines.push(`P-${i},Part ${i},A${i % 200},${1 + (i % 5)},${(i % 97) / 10},catalogue,steel,${i % 1000},-${i % 300},${i % 50}`);
const csvText = csvLines.join('\n');
const knownAssemblies = Array.from({ length: 200 }, (_, i) => `A${i}`);
const materialList = [{ code: 'steel', densityKgPerM3: 7850 }];
const units = { length: 'mm', mass: 'kg' } as const;
const imp = time(() => {
  const parsed = Papa.parse<Record<string, unknown>>(csvText, { header: true, skipEmptyLines: true });
  return importBreakdownRows(parsed.data, { mapping: defaultColumnMapping(units, ['partNumber', 'name', 'assemblyNumber', 'quantity', 'unitMass', 'massSource', 'material', 'cogX', 'cogY', 'cogZ']), units }, { materials: materialList, assemblyNumbers: knownAssemblies, headers: parsed.meta.fields });
}, 5);
console.log(`\nparts-list CSV parse + validation, 10,000 rows: ${fmt(imp)}; ${imp.result.lines.length} lines, ${imp.result.problems.length} problems, ok ${imp.result.ok}`);
