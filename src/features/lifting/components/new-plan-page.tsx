import { Link, useNavigate } from 'react-router-dom';
import { buttonClasses, ErrorState, PageHeader, PageLoading } from '../../../components/ui/index.ts';
import { useCurrentProduction } from '../../../lib/current-production.ts';
import { useSavePlan } from '../api/plans.ts';
import { PlanEditor } from './plan-editor.tsx';
import { useEditorContext } from './use-editor-context.ts';

/** `/p/:productionId/lifting/plans/new`. */
export function NewPlanPage() {
  const { productionId } = useCurrentProduction();
  const pid = productionId ?? '';
  const { ctx, pending, error } = useEditorContext(pid);
  const save = useSavePlan(pid);
  const navigate = useNavigate();
  if (pending) return <PageLoading />;
  if (!ctx) return <ErrorState title="The plan form could not be loaded" error={error} />;
  return (
    <div className="flex flex-col gap-5">
      <PageHeader eyebrow="Lifting" title="New lift plan" actions={<Link to="../.." relative="path" className={buttonClasses({ variant: 'secondary' })}>Back to plans</Link>} />
      <PlanEditor
        ctx={ctx}
        initial={null}
        saving={save.isPending}
        saveLabel="Save draft"
        error={save.error}
        onSave={(inputs) => save.mutate({ inputs }, { onSuccess: (plan) => navigate(`../${plan.id}`, { relative: 'path' }) })}
      />
    </div>
  );
}
