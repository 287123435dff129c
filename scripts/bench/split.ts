// Split advisor benchmark (issue 8): a machine of 3,000 parts in 200 assemblies under three limits
// (section mass, crate-able size, number of sections). Targets: first valid proposal under 1 s;
// best of a 10 s budget. Figures only; run with `npx tsx scripts/bench/split.ts [budgetMs]`.
import { proposeSplits, rng, type SplitAssembly, type SplitInput, type SplitPart } from '../../src/domain/split/index.ts';

function machine(seed: number, assemblyCount: number, partCount: number): { assemblies: SplitAssembly[]; parts: SplitPart[] } {
  const r = rng(seed);
  const assemblies: SplitAssembly[] = [{ id: 'machine', parentId: null, keepTogether: false }];
  const depth = new Map<string, number>([['machine', 0]]);
  const origin = new Map<string, [number, number, number]>([['machine', [0, 0, 0]]]);
  for (let i = 1; i < assemblyCount; i++) {
    // parents chosen among earlier assemblies, at most 4 deep; the first 8 hang on the root
    let parent = i <= 8 ? 'machine' : assemblies[1 + Math.floor(r() * (i - 1))].id;
    while ((depth.get(parent) ?? 0) >= 4) parent = assemblies.find((a) => a.id === parent)?.parentId ?? 'machine';
    const id = `A${i}`;
    const d = (depth.get(parent) ?? 0) + 1;
    depth.set(id, d);
    const po = origin.get(parent) as [number, number, number];
    const spread = 2000 / d;
    origin.set(id, [po[0] + (r() - 0.5) * spread, po[1] + (r() - 0.5) * spread, Math.max(0, po[2] + (r() - 0.3) * spread * 0.5)]);
    assemblies.push({ id, parentId: parent, keepTogether: false });
  }
  // About 30 % of the leaf assemblies must travel whole.
  const hasChild = new Set(assemblies.map((a) => a.parentId));
  for (const a of assemblies) if (!hasChild.has(a.id) && r() < 0.3) a.keepTogether = true;
  const parts: SplitPart[] = [];
  for (let k = 0; k < partCount; k++) {
    const a = assemblies[1 + Math.floor(r() * (assemblyCount - 1))];
    const o = origin.get(a.id) as [number, number, number];
    const size: [number, number, number] = [20 + r() * 300, 20 + r() * 300, 20 + r() * 200];
    const min: [number, number, number] = [o[0] + (r() - 0.5) * 300, o[1] + (r() - 0.5) * 300, o[2] + r() * 200];
    const max: [number, number, number] = [min[0] + size[0], min[1] + size[1], min[2] + size[2]];
    const massKg = r() < 0.05 ? 5 + r() * 25 : 0.05 + r() * 0.8;
    parts.push({ assemblyId: a.id, massKg, cogMm: [min[0] + size[0] / 2, min[1] + size[1] / 2, min[2] + size[2] / 2], bboxMinMm: min, bboxMaxMm: max });
  }
  return { assemblies, parts };
}

const budgetMs = Number(process.argv[2] ?? 10_000);
const m = machine(2024, 200, 3000);
const total = m.parts.reduce((s, p) => s + p.massKg, 0);
const limits = { maxSectionMassKg: 150, maxSectionSizeMm: [2400, 1600, 1600] as [number, number, number], maxSections: 40 };
console.log(`machine: ${m.assemblies.length} assemblies, ${m.parts.length} parts, ${total.toFixed(0)} kg; limits ${limits.maxSectionMassKg} kg, ${limits.maxSectionSizeMm.join(' × ')} mm, ≤ ${limits.maxSections} sections`);
console.log(`lower bound on sections by mass: ${Math.ceil(total / limits.maxSectionMassKg)}`);

const base: SplitInput = { ...m, limits };
let t = performance.now();
const first = proposeSplits({ ...base, options: { maxIterations: 0, seed: 1 } });
const firstMs = performance.now() - t;
const f = first.proposals[0]?.score;
console.log(`first valid proposal: ${firstMs.toFixed(0)} ms (target < 1,000 ms): ${f ? `${f.sections} sections, heaviest ${f.heaviestKg.toFixed(1)} kg` : `none: ${first.infeasible.map((i) => i.reason).join('; ')}`}`);

t = performance.now();
let lastProgress = 0;
const best = proposeSplits({ ...base, options: { maxIterations: 1e9, timeLimitMs: budgetMs, seed: 1, maxProposals: 3, onProgress: (x) => (lastProgress = x) } });
const bestMs = performance.now() - t;
void lastProgress;
best.proposals.forEach((p, i) => {
  const s = p.score;
  if (s) console.log(`best-of-budget #${i + 1} (${(bestMs / 1000).toFixed(1)} s budget ${budgetMs / 1000} s): ${s.sections} sections, heaviest ${s.heaviestKg.toFixed(1)} kg, Σ CoG offset ${s.cogOffsetSumMm.toFixed(0)} mm`);
});
console.log(`method: ${best.method}`);
