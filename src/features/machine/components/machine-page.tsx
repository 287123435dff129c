import { useState } from 'react';
import type { AssemblyView, BreakdownLineView } from '@domain/contracts/machine.ts';
import { EmptyState, ErrorState, PageHeader, PageLoading } from '../../../components/ui/index.ts';
import { useCurrentProduction, useMay } from '../../../lib/current-production.ts';
import { cx } from '../../../lib/cx.ts';
import { useUnits } from '../../../lib/use-units.ts';
import { useMachine, useMachineMass } from '../api/get-machine.ts';
import { BreakdownTable } from './breakdown-table.tsx';
import { LinePanel } from './line-panel.tsx';
import { AssemblyPanel } from './assembly-panel.tsx';
import { MaterialsView } from './materials-view.tsx';
import { SectionsView } from './sections-view.tsx';
import { ImportExportView } from './import-export-view.tsx';

const TABS = [
  { id: 'sections', label: 'Sections' },
  { id: 'breakdown', label: 'Breakdown' },
  { id: 'import', label: 'Import and export' },
  { id: 'materials', label: 'Materials' },
] as const;
type TabId = (typeof TABS)[number]['id'];

/** The machine screen: sections with their mass properties, the breakdown, import and export, materials. */
export function MachinePage() {
  const { productionId } = useCurrentProduction();
  const pid = productionId ?? '';
  const mayEdit = useMay('machine.edit');
  const u = useUnits();
  const summary = useMachine(pid);
  const mass = useMachineMass(pid);
  const [tab, setTab] = useState<TabId>('sections');
  const [line, setLine] = useState<BreakdownLineView | null>(null);
  const [assembly, setAssembly] = useState<AssemblyView | null>(null);

  if (summary.isPending) return <PageLoading label="Loading the machine…" />;
  if (summary.isError) return <ErrorState title="The machine could not be loaded" error={summary.error} onRetry={() => summary.refetch()} retrying={summary.isFetching} />;
  const s = summary.data;
  const visibleTabs = TABS.filter((t) => t.id !== 'import' || mayEdit || s.lineCount > 0);

  return (
    <div className="flex flex-col gap-5">
      <PageHeader
        eyebrow="Machine"
        title={s.machine.name || 'Machine breakdown'}
        description={
          mass.data
            ? `${s.lineCount.toLocaleString('en-GB')} part lines in ${s.assemblyCount} assemblies · ${u.formatMass(mass.data.total.massKg)} in all · margin ${s.machine.marginPercent} % unless a section sets its own.`
            : `${s.lineCount.toLocaleString('en-GB')} part lines in ${s.assemblyCount} assemblies.`
        }
      />
      <div role="tablist" aria-label="Machine views" className="flex flex-wrap gap-1 border-b border-ink-200">
        {visibleTabs.map((t) => (
          <button
            key={t.id}
            role="tab"
            type="button"
            id={`machine-tab-${t.id}`}
            aria-selected={tab === t.id}
            aria-controls={`machine-panel-${t.id}`}
            className={cx('-mb-px min-h-11 border-b-2 px-4 font-semibold', tab === t.id ? 'border-tide-600 text-tide-800' : 'border-transparent text-ink-700 hover:text-ink-900')}
            onClick={() => setTab(t.id)}
          >
            {t.label}
          </button>
        ))}
      </div>
      <div role="tabpanel" id={`machine-panel-${tab}`} aria-labelledby={`machine-tab-${tab}`}>
        {tab === 'sections' &&
          (mass.isPending ? (
            <PageLoading label="Computing mass properties…" />
          ) : mass.isError ? (
            <ErrorState title="The mass properties could not be computed" error={mass.error} onRetry={() => mass.refetch()} retrying={mass.isFetching} />
          ) : s.lineCount === 0 && s.sections.length === 0 ? (
            <EmptyState title="This machine has no parts yet">{mayEdit ? 'Import a parts list (CSV or XLSX) under “Import and export”, then add sections.' : 'A planner imports the parts list.'}</EmptyState>
          ) : (
            <SectionsView productionId={pid} summary={s} mass={mass.data} mayEdit={mayEdit} />
          ))}
        {tab === 'breakdown' && (
          <div className={cx('grid gap-5', (line || assembly) && '2xl:grid-cols-[minmax(0,1fr)_28rem]')}>
            <BreakdownTable
              productionId={pid}
              sections={s.sections}
              mass={mass.data}
              onSelectLine={(l) => (setAssembly(null), setLine(l))}
              onSelectAssembly={(a) => (setLine(null), setAssembly(a))}
              selectedLineId={line?.id ?? assembly?.id ?? null}
            />
            {line && <LinePanel key={line.id} productionId={pid} line={line} materials={s.materials} mayEdit={mayEdit} onClose={() => setLine(null)} />}
            {assembly && <AssemblyPanel key={assembly.id} productionId={pid} assembly={assembly} sections={s.sections} mass={mass.data?.assemblies[assembly.id]} mayEdit={mayEdit} onClose={() => setAssembly(null)} />}
          </div>
        )}
        {tab === 'import' && <ImportExportView productionId={pid} mayEdit={mayEdit} />}
        {tab === 'materials' && <MaterialsView productionId={pid} materials={s.materials} mayEdit={mayEdit} />}
      </div>
    </div>
  );
}
