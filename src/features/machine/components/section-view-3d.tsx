import { useQuery } from '@tanstack/react-query';
import type { AddOnView, BreakdownLineView, SectionMassView, SectionView } from '@domain/contracts/machine.ts';
import { parseStl, rotationFromEulerZyxDeg, type StlLengthUnit } from '@domain/mass/index.ts';
import { SectionScene, type SceneMesh, type ScenePart, type ScenePlacement } from '../../../viewer/section-scene.tsx';
import { EmptyState, ErrorState, PageLoading } from '../../../components/ui/index.ts';
import { ApiError } from '../../../lib/api.ts';
import { useUnits } from '../../../lib/use-units.ts';
import { getBreakdownPage } from '../api/get-breakdown.ts';
import { machineKeys, machinePath } from '../api/keys.ts';

/** Meshes fetched per view; beyond this, parts show as boxes (keeps the view quick on a phone). */
const MAX_MESHES = 30;
/** A part with a CoG but no box is drawn as a small cube so it is still seen. */
const POINT_BOX_MM = 40;

function placements(line: BreakdownLineView): ScenePlacement[] | null {
  if (line.instances.length === 0) return null;
  return line.instances.map((i) => ({ positionMm: i.positionMm, rotation: rotationFromEulerZyxDeg(i.eulerZyxDeg ?? [0, 0, 0]) }));
}

async function loadScene(productionId: string, sectionId: string): Promise<{ parts: ScenePart[]; meshes: SceneMesh[] }> {
  const page = await getBreakdownPage(productionId, { sectionId }, 0, 20_000);
  const parts: ScenePart[] = [];
  const meshLines = page.lines.filter((l) => l.hasMesh).slice(0, MAX_MESHES);
  const meshed = new Set(meshLines.map((l) => l.id));
  for (const l of page.lines) {
    if (meshed.has(l.id) || !l.cogMm) continue;
    const h = POINT_BOX_MM / 2;
    const boxMm = l.bboxMm ?? { minMm: [l.cogMm[0] - h, l.cogMm[1] - h, l.cogMm[2] - h], maxMm: [l.cogMm[0] + h, l.cogMm[1] + h, l.cogMm[2] + h] };
    parts.push({ id: l.id, boxMm, placements: placements(l), kind: 'part' });
  }
  const meshes = await Promise.all(
    meshLines.map(async (l): Promise<SceneMesh> => {
      const res = await fetch(`/api${machinePath(productionId, `/lines/${encodeURIComponent(l.id)}/mesh/stl`)}`, { credentials: 'same-origin' });
      if (!res.ok) throw new ApiError(res.status, 'mesh', `The mesh of ${l.partNumber} could not be loaded (HTTP ${res.status}).`);
      const unit = (res.headers.get('x-length-unit') ?? 'mm') as StlLengthUnit;
      const stl = parseStl(new Uint8Array(await res.arrayBuffer()), unit, { fileName: l.partNumber });
      return { id: l.id, trianglesMm: stl.trianglesMm, placements: placements(l) };
    }),
  );
  return { parts, meshes };
}

/** The lazily loaded 3D view of one section (default export for React.lazy). */
export default function SectionView3d({ productionId, section, mass, addOns }: { productionId: string; section: SectionView; mass: SectionMassView | undefined; addOns: AddOnView[] }) {
  const u = useUnits();
  const scene = useQuery({ queryKey: machineKeys.scene(productionId, section.id), queryFn: () => loadScene(productionId, section.id) });
  if (scene.isPending) return <PageLoading label="Loading parts…" />;
  if (scene.isError) return <ErrorState title="The 3D view could not be loaded" error={scene.error} onRetry={() => scene.refetch()} />;
  const addOnParts: ScenePart[] = addOns.filter((a) => a.bboxMm).map((a) => ({ id: a.id, boxMm: a.bboxMm!, placements: null, kind: 'addOn' }));
  const parts = [...scene.data.parts, ...addOnParts];
  if (parts.length === 0 && scene.data.meshes.length === 0) {
    return <EmptyState title="Nothing placed in this section yet">Parts show here once they have a position (CoG) or a box.</EmptyState>;
  }
  return (
    <div>
      <div className="h-[28rem] w-full overflow-hidden rounded-control border border-ink-200" role="img" aria-label={`3D view of section ${section.code}: ${parts.length} parts as boxes, ${scene.data.meshes.length} meshes, CoG marked`}>
        <SectionScene parts={parts} meshes={scene.data.meshes} cogMm={mass?.cogMm ?? null} bboxMm={mass?.bboxMm ?? null} formatLength={(mm) => u.formatLength(mm)} />
      </div>
      <p className="mt-2 text-sm text-ink-600">
        Drag to turn, scroll to zoom. Teal: parts; amber: add-ons; red: the CoG with its plumb line. Axes x (red), y (green), z up (teal).
      </p>
    </div>
  );
}
