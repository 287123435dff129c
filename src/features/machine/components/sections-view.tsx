import { lazy, Suspense, useState } from 'react';
import type { MachineMassView, MachineSummaryView, SectionView } from '@domain/contracts/machine.ts';
import { Alert, Button, Card, EmptyState, ErrorState, PageLoading } from '../../../components/ui/index.ts';
import { errorMessage } from '../../../lib/api.ts';
import { useMachineChange } from '../api/edit-machine.ts';
import { useUnits } from '../../../lib/use-units.ts';
import { SectionCard } from './section-card.tsx';
import { MovePanel } from './move-panel.tsx';
import { WeighingForm } from './weighing-form.tsx';
import { SectionForm } from './section-form.tsx';
import { MarginForm } from './margin-form.tsx';
import { AddOnsPanel } from './add-ons-panel.tsx';

// three.js is large: the 3D view loads only when someone opens it.
const SectionView3d = lazy(() => import('./section-view-3d.tsx'));

export interface SectionsViewProps {
  productionId: string;
  summary: MachineSummaryView;
  mass: MachineMassView;
  mayEdit: boolean;
}

/** Section cards, the loose parts, and (for planners) moving assemblies between sections with a live preview. */
export function SectionsView({ productionId, summary, mass, mayEdit }: SectionsViewProps) {
  const u = useUnits();
  const [weighing, setWeighing] = useState<string | null>(null);
  const [viewing, setViewing] = useState<string | null>(null);
  const [moving, setMoving] = useState(false);
  const [adding, setAdding] = useState(false);
  const [editing, setEditing] = useState<string | null>(null);
  const sections = summary.sections;

  return (
    <div className="flex flex-col gap-5">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <p className="text-ink-700">
          Machine {u.formatMass(mass.machine.massKg)}
          {mass.total.addOnCount > 0 && <>, with add-ons {u.formatMass(mass.total.massKg)}</>}; loose parts {u.formatMass(mass.loose.massKg)} in {mass.loose.lineCount} lines.
          {mass.gaps.length > 0 && <span className="text-caution-800"> {mass.gaps.length} lines not counted yet (gaps).</span>}
        </p>
        {mayEdit && (
          <div className="flex flex-wrap items-end gap-2">
            <MarginForm productionId={productionId} machine={summary.machine} />
            <Button variant="secondary" onClick={() => setAdding((v) => !v)}>
              New section
            </Button>
            <Button variant={moving ? 'secondary' : 'primary'} onClick={() => setMoving((v) => !v)} disabled={sections.length === 0}>
              {moving ? 'Close moving' : 'Move assemblies'}
            </Button>
          </div>
        )}
      </div>
      {adding && mayEdit && (
        <Card title="New section">
          <SectionForm productionId={productionId} onDone={() => setAdding(false)} />
        </Card>
      )}
      {moving && mayEdit && <MovePanel productionId={productionId} summary={summary} mass={mass} onClose={() => setMoving(false)} />}
      {sections.length === 0 ? (
        <EmptyState title="No sections yet">
          Sections are the units the machine travels in. {mayEdit ? 'Add one, then move assemblies into it.' : 'A planner adds them.'}
        </EmptyState>
      ) : (
        <div className="grid gap-5 xl:grid-cols-2">
          {sections.map((s) => {
            const m = mass.sections[s.id];
            if (!m) return <ErrorState key={s.id} title={`${s.code}: no mass properties`} />;
            return (
              <div key={s.id} className="flex flex-col gap-3">
                <SectionCard
                  section={s}
                  mass={m}
                  actions={
                    <>
                      <Button size="sm" variant="ghost" onClick={() => setViewing(viewing === s.id ? null : s.id)}>
                        3D view
                      </Button>
                      {mayEdit && (
                        <>
                          <Button size="sm" variant="ghost" onClick={() => setEditing(editing === s.id ? null : s.id)}>
                            Edit
                          </Button>
                          <Button size="sm" variant="ghost" onClick={() => setWeighing(weighing === s.id ? null : s.id)}>
                            Record weighing
                          </Button>
                        </>
                      )}
                    </>
                  }
                />
                {editing === s.id && mayEdit && (
                  <Card title={`Edit section ${s.code}`} actions={<DeleteSection productionId={productionId} section={s} onDone={() => setEditing(null)} />}>
                    <SectionForm productionId={productionId} section={s} onDone={() => setEditing(null)} />
                  </Card>
                )}
                <AddOnsPanel productionId={productionId} sectionId={s.id} addOns={summary.addOns.filter((a) => a.sectionId === s.id)} mayEdit={mayEdit} />
                {viewing === s.id && (
                  <Card
                    title={`3D view of ${s.code}`}
                    description="Parts as boxes (or their meshes), the CoG marked, axes in the machine frame (z up)."
                    actions={
                      <Button size="sm" variant="ghost" onClick={() => setViewing(null)}>
                        Close 3D view
                      </Button>
                    }
                  >
                    <Suspense fallback={<PageLoading label="Loading the 3D view…" />}>
                      <SectionView3d productionId={productionId} section={s} mass={m} addOns={summary.addOns.filter((a) => a.sectionId === s.id)} />
                    </Suspense>
                  </Card>
                )}
                {weighing === s.id && (
                  <Card title={`Weighing of ${s.code}`}>
                    <WeighingForm productionId={productionId} sectionId={s.id} sectionCode={s.code} onDone={() => setWeighing(null)} />
                  </Card>
                )}
              </div>
            );
          })}
        </div>
      )}
    </div>
  );
}

/** Deleting a section asks once more; its assemblies and lines become loose parts, its add-ons and weighings go. */
function DeleteSection({ productionId, section, onDone }: { productionId: string; section: SectionView; onDone: () => void }) {
  const [asking, setAsking] = useState(false);
  const change = useMachineChange(productionId);
  if (!asking)
    return (
      <Button size="sm" variant="ghost" onClick={() => setAsking(true)}>
        Delete section
      </Button>
    );
  return (
    <div className="flex flex-col items-end gap-2">
      {change.isError && <Alert tone="danger">{errorMessage(change.error)}</Alert>}
      <p className="text-sm text-ink-800">Delete {section.code}? Its assemblies and lines become loose parts; its add-ons and weighings are deleted.</p>
      <div className="flex gap-2">
        <Button size="sm" variant="danger" loading={change.isPending} onClick={() => change.mutate({ kind: 'deleteSection', id: section.id }, { onSuccess: onDone })}>
          Delete {section.code}
        </Button>
        <Button size="sm" variant="ghost" onClick={() => setAsking(false)}>
          Keep it
        </Button>
      </div>
    </div>
  );
}
