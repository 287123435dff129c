import { useMemo, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import type { AssemblyView, MachineMassView, MachineSummaryView } from '@domain/contracts/machine.ts';
import { Alert, Button, Card, ErrorState, PageLoading, SelectField } from '../../../components/ui/index.ts';
import { errorMessage, staleCurrent } from '../../../lib/api.ts';
import { useUnits } from '../../../lib/use-units.ts';
import { getBreakdownPage } from '../api/get-breakdown.ts';
import { useMassInput } from '../api/get-machine.ts';
import { machineKeys } from '../api/keys.ts';
import { useMachineChange } from '../api/edit-machine.ts';
import { previewMove } from './preview-mass.ts';
import { SectionCard } from './section-card.tsx';

/** Assemblies in tree order with their depth. */
function treeOrder(assemblies: AssemblyView[]): { a: AssemblyView; depth: number }[] {
  const children = new Map<string | null, AssemblyView[]>();
  for (const a of assemblies) {
    const list = children.get(a.parentId) ?? [];
    list.push(a);
    children.set(a.parentId, list);
  }
  const out: { a: AssemblyView; depth: number }[] = [];
  const walk = (parent: string | null, depth: number) => {
    for (const a of (children.get(parent) ?? []).sort((x, y) => x.number.localeCompare(y.number, undefined, { numeric: true }))) {
      out.push({ a, depth });
      walk(a.id, depth + 1);
    }
  };
  walk(null, 0);
  return out;
}

/**
 * Moves assemblies into a section (or out of every section). The cards below recompute at once in the
 * browser with the mass core; "Move" saves all of it in one transaction, and the server's figures replace
 * the preview.
 */
export function MovePanel({ productionId, summary, mass, onClose }: { productionId: string; summary: MachineSummaryView; mass: MachineMassView; onClose: () => void }) {
  const u = useUnits();
  const input = useMassInput(productionId);
  const assemblies = useQuery({
    queryKey: [...machineKeys.all(productionId), 'assemblies'],
    queryFn: async () => (await getBreakdownPage(productionId, {}, 0, 1)).assemblies,
  });
  const [target, setTarget] = useState<string>(summary.sections[0]?.id ?? '');
  const [picked, setPicked] = useState<Set<string>>(new Set());
  const change = useMachineChange(productionId);
  const sectionCode = useMemo(() => new Map(summary.sections.map((s) => [s.id, s.code])), [summary.sections]);

  const preview = useMemo(() => {
    if (!input.data || picked.size === 0) return null;
    try {
      return previewMove(input.data.input, input.data.sectionMargins, { assemblyIds: picked, sectionId: target === 'none' ? null : target });
    } catch (e) {
      return { error: errorMessage(e) };
    }
  }, [input.data, picked, target]);

  if (input.isPending || assemblies.isPending) return <PageLoading label="Loading the breakdown for the preview…" />;
  if (input.isError || assemblies.isError) return <ErrorState title="The breakdown could not be loaded" error={input.error ?? assemblies.error} onRetry={() => void (input.refetch(), assemblies.refetch())} />;

  const tree = treeOrder(assemblies.data);
  const byId = new Map(assemblies.data.map((a) => [a.id, a]));
  // Sections whose figures change: the target and wherever the picked assemblies sit now.
  const touched = new Set<string>();
  if (target !== 'none') touched.add(target);
  for (const id of picked) {
    let a = byId.get(id);
    while (a && !a.sectionId) a = a.parentId ? byId.get(a.parentId) : undefined;
    if (a?.sectionId) touched.add(a.sectionId);
  }
  const stale = staleCurrent(change.error);

  function toggle(id: string) {
    setPicked((p) => {
      const n = new Set(p);
      if (n.has(id)) n.delete(id);
      else n.add(id);
      return n;
    });
  }
  function apply() {
    change.mutate(
      {
        kind: 'move',
        body: { sectionId: target === 'none' ? null : target, assemblies: [...picked].map((id) => ({ id, version: byId.get(id)!.version })), lines: [] },
      },
      { onSuccess: () => setPicked(new Set()) },
    );
  }

  return (
    <Card
      title="Move assemblies between sections"
      description="Tick assemblies, pick where they go; the cards show the result before anything is saved."
      actions={
        <Button size="sm" variant="ghost" onClick={onClose}>
          Close
        </Button>
      }
    >
      <div className="grid gap-5 lg:grid-cols-[minmax(0,1fr)_minmax(0,1.3fr)]">
        <div className="flex flex-col gap-3">
          <SelectField label="Move to" value={target} onChange={(e) => setTarget(e.target.value)}>
            {summary.sections.map((s) => (
              <option key={s.id} value={s.id}>
                {s.code} — {s.name}
              </option>
            ))}
            <option value="none">No section (loose)</option>
          </SelectField>
          <fieldset className="max-h-96 overflow-auto rounded-control border border-ink-200 p-2">
            <legend className="px-1 text-sm font-semibold text-ink-800">Assemblies</legend>
            {tree.map(({ a, depth }) => (
              <label key={a.id} className="flex min-h-9 items-center gap-2 rounded px-1 hover:bg-ink-50" style={{ paddingLeft: `${depth * 1.25 + 0.25}rem` }}>
                <input type="checkbox" className="size-4 accent-tide-600" checked={picked.has(a.id)} onChange={() => toggle(a.id)} />
                <span className="font-semibold tabular-nums">{a.number}</span>
                <span className="truncate text-ink-700">{a.name}</span>
                <span className="ml-auto shrink-0 text-sm text-ink-600 tabular-nums">
                  {a.sectionId ? sectionCode.get(a.sectionId) : ''} {mass.assemblies[a.id] ? u.formatMass(mass.assemblies[a.id].massKg) : ''}
                </span>
              </label>
            ))}
          </fieldset>
          {stale !== null && <Alert tone="caution" title="Someone changed these assemblies meanwhile">Nothing was moved. The list has been reloaded; tick again and move.</Alert>}
          {change.isError && stale === null && <Alert tone="danger" title="Nothing was moved">{errorMessage(change.error)}</Alert>}
          {change.isSuccess && picked.size === 0 && <Alert tone="ok">Moved and saved; the cards show the server's figures.</Alert>}
          <Button onClick={apply} disabled={picked.size === 0} loading={change.isPending}>
            Move {picked.size || ''} {picked.size === 1 ? 'assembly' : 'assemblies'}
          </Button>
        </div>
        <div className="flex flex-col gap-4" aria-live="polite">
          {!preview && <p className="text-ink-600">Tick an assembly to see the sections change.</p>}
          {preview && 'error' in preview && <Alert tone="danger">{preview.error}</Alert>}
          {preview &&
            'sections' in preview &&
            summary.sections
              .filter((s) => touched.has(s.id))
              .map((s) => <SectionCard key={s.id} section={s} mass={preview.sections[s.id]} before={mass.sections[s.id]} preview />)}
        </div>
      </div>
    </Card>
  );
}
