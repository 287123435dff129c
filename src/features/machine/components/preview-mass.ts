import type { MachineMassView, NodeMassView, SectionMassView } from '@domain/contracts/machine.ts';
import { massProperties, type MassPropertiesInput } from '@domain/mass/index.ts';

/**
 * The instant client-side recompute while the planner moves assemblies between sections: the same core
 * function the server runs, on the same input the server built, with the chosen assemblies re-assigned.
 * The server's answer after saving is the authority.
 */
export function previewMove(
  input: MassPropertiesInput,
  sectionMargins: Record<string, number | null>,
  move: { assemblyIds: ReadonlySet<string>; lineIds?: ReadonlySet<string>; sectionId: string | null },
): { sections: Record<string, NodeMassView & { marginPercent: number }>; loose: NodeMassView } {
  const moved: MassPropertiesInput = {
    ...input,
    assemblies: input.assemblies.map((a) => (move.assemblyIds.has(a.id) ? { ...a, sectionId: move.sectionId } : a)),
    lines: move.lineIds?.size ? input.lines.map((l) => (move.lineIds!.has(l.id) ? { ...l, sectionId: move.sectionId } : l)) : input.lines,
  };
  const result = massProperties(moved);
  const sections: Record<string, NodeMassView & { marginPercent: number }> = {};
  for (const [id, node] of Object.entries(result.sections)) {
    const marginPercent = sectionMargins[id] ?? result.marginPercent;
    sections[id] = { ...(node as NodeMassView), marginPercent, massWithMarginKg: node.massKg * (1 + marginPercent / 100) };
  }
  return { sections, loose: result.loose as NodeMassView };
}

/** The governing figure for a section: the latest weighing when there is one, else the computed mass. */
export function governingMassKg(s: SectionMassView): number {
  return s.weighing ? s.weighing.massKg : s.massKg;
}

export type { MachineMassView };
