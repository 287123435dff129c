import { lazy, Suspense, useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import type { LiftPlanView } from '@domain/contracts/lifting-api.ts';
import { decide } from '@domain/policy/index.ts';
import { Alert, Button, buttonClasses, Card, ErrorState, PageHeader, PageLoading, Spinner, controlClasses } from '../../../components/ui/index.ts';
import { errorMessage } from '../../../lib/api.ts';
import { useCurrentProduction, useMay } from '../../../lib/current-production.ts';
import { useSessionUser } from '../../../lib/session.ts';
import { useUnits } from '../../../lib/use-units.ts';
import { planConflict, planPdfUrl, usePlan, usePlanAction, useSavePlan, type PlanAction } from '../api/plans.ts';
import { StatusBadge } from './badges.tsx';
import { PlanEditor } from './plan-editor.tsx';
import { PlanResultView } from './plan-result.tsx';
import { useEditorContext } from './use-editor-context.ts';

const Plan3d = lazy(() => import('./plan-3d.tsx'));

const EVENT_LABEL: Record<string, string> = {
  created: 'Created',
  edited: 'Edited',
  submitted: 'Submitted for review',
  approved: 'Approved',
  rejected: 'Rejected',
  'approval-withdrawn': 'Approval withdrawn',
  'returned-to-draft': 'Returned to draft',
};

/** `/p/:productionId/lifting/plans/:planId`: the plan, its figures, 3D view, sign-off and history. */
export function PlanPage() {
  const { productionId } = useCurrentProduction();
  const pid = productionId ?? '';
  const { planId = '' } = useParams();
  const plan = usePlan(pid, planId);
  const user = useSessionUser();
  const units = useUnits();
  const mayEdit = useMay('liftplan.edit');
  const action = usePlanAction(pid, planId);
  const [editing, setEditing] = useState(false);
  const [comment, setComment] = useState('');
  const [show3d, setShow3d] = useState(false);

  if (plan.isPending) return <PageLoading />;
  if (plan.isError) return <ErrorState title="The lift plan could not be loaded" error={plan.error} onRetry={() => plan.refetch()} retrying={plan.isFetching} />;
  const p = plan.data;
  const review = user ? decide({ userId: user.id, isAdmin: user.isAdmin, memberships: user.memberships.map((m) => ({ productionId: m.productionId, role: m.role, venueIds: m.venueIds })) }, 'liftplan.review', { productionId: pid, authorId: p.authorId }) : null;
  const mayReview = Boolean(review?.allowed) && p.status === 'submitted';
  const ownPlan = user?.id === p.authorId;
  const clean = p.result.verdict === 'ok' && p.result.problems.length === 0;
  const act = (a: PlanAction) => action.mutate({ action: a, version: p.version, comment: comment.trim() || undefined }, { onSuccess: () => setComment('') });
  const stale = planConflict(action.error);

  return (
    <div className="flex flex-col gap-5">
      <PageHeader
        eyebrow={`Lift plan · ${p.sectionCode ?? 'section removed'} · ${p.liftDate}`}
        title={p.title}
        actions={
          <>
            <Link to="../.." relative="path" className={buttonClasses({ variant: 'secondary' })}>
              All plans
            </Link>
            <a href={planPdfUrl(pid, p.id)} target="_blank" rel="noreferrer" className={buttonClasses({ variant: 'secondary' })}>
              PDF
            </a>
            {mayEdit && !editing && (
              <Button variant="secondary" onClick={() => setEditing(true)}>
                Edit
              </Button>
            )}
          </>
        }
      />
      <Card>
        <div className="flex flex-col gap-3">
          <div className="flex flex-wrap items-center gap-3">
            <StatusBadge status={p.status} />
            <span className="text-ink-700">
              by {p.authorName ?? '—'}
              {p.reviewerName ? ` · ${p.status} by ${p.reviewerName} on ${p.reviewedAt?.slice(0, 10)}` : ''}
            </span>
          </div>
          {p.reviewComment && <p className="text-ink-700">Review comment: {p.reviewComment}</p>}
          {p.status === 'approved' && <Alert tone="ok">Approved for these figures. Any change to the section, the gear or the plan withdraws the approval.</Alert>}
          {stale && <Alert tone="caution" title="The plan changed while you were reading it">{errorMessage(action.error)} The new figures are shown below.</Alert>}
          {action.error && !stale ? (
            <Alert tone="danger" title="Not done">
              {errorMessage(action.error)}
            </Alert>
          ) : null}
          {(mayReview || (mayEdit && (p.status === 'draft' || p.status === 'rejected'))) && (
            <label className="flex flex-col gap-1.5">
              <span className="text-sm font-semibold text-ink-800">Comment{mayReview ? ' (required to reject)' : ''}</span>
              <textarea className={`${controlClasses} min-h-16 py-2`} value={comment} onChange={(e) => setComment(e.target.value)} />
            </label>
          )}
          <div className="flex flex-wrap gap-2">
            {mayEdit && (p.status === 'draft' || p.status === 'rejected') && (
              <Button onClick={() => act('submit')} loading={action.isPending}>
                Submit for review
              </Button>
            )}
            {mayReview && (
              <>
                <Button onClick={() => act('approve')} loading={action.isPending} disabled={!clean}>
                  Approve
                </Button>
                <Button variant="danger" onClick={() => act('reject')} loading={action.isPending} disabled={!comment.trim()}>
                  Reject
                </Button>
              </>
            )}
          </div>
          {p.status === 'submitted' && ownPlan && <p className="text-sm text-ink-600">A rigger who did not write this plan reviews it.</p>}
          {mayReview && !clean && <p className="text-sm text-danger-700">It cannot be approved while it has unresolved problems.</p>}
        </div>
      </Card>

      {editing ? (
        <EditPlan productionId={pid} plan={p} onDone={() => setEditing(false)} />
      ) : (
        <>
          <div className="flex gap-2">
            <Button size="sm" variant="secondary" onClick={() => setShow3d((v) => !v)}>
              {show3d ? 'Hide 3D view' : 'Show 3D view'}
            </Button>
          </div>
          {show3d && (
            <div className="h-[28rem] overflow-hidden rounded-panel border border-ink-200">
              <Suspense fallback={<Spinner />}>
                <Plan3d input={p.evaluatedInput} result={p.result} formatMass={(kg) => units.formatMass(kg)} />
              </Suspense>
            </div>
          )}
          <PlanResultView result={p.result} input={p.evaluatedInput} title="Figures (server)" />
          {p.inputs.method && (
            <Card title="Method statement">
              <p className="whitespace-pre-wrap">{p.inputs.method}</p>
            </Card>
          )}
        </>
      )}

      <Card title="History">
        <ol className="flex flex-col gap-2">
          {p.events.map((e) => (
            <li key={e.id} className="text-sm">
              <span className="font-semibold">{EVENT_LABEL[e.kind] ?? e.kind}</span> · {e.actorName ?? 'Ballast'} · {new Date(e.createdAt).toLocaleString()}
              {e.verdict ? ` · verdict ${e.verdict}` : ''}
              {e.comment && <p className="text-ink-700">{e.comment}</p>}
            </li>
          ))}
        </ol>
      </Card>
    </div>
  );
}

/**
 * The plan form for an existing plan; its data loads only when the person edits. A save carries the version the
 * edit started from; when someone saved in between, the editor shows both versions and the person reloads theirs
 * (the form starts again from it) or keeps their own (saved on top of theirs).
 */
function EditPlan({ productionId, plan, onDone }: { productionId: string; plan: LiftPlanView; onDone: () => void }) {
  const { ctx, error } = useEditorContext(productionId);
  const save = useSavePlan(productionId);
  const [base, setBase] = useState(plan);
  const theirs = planConflict(save.error);
  if (!ctx) return error ? <ErrorState error={error} /> : <PageLoading />;
  return (
    <PlanEditor
      key={base.version}
      ctx={ctx}
      initial={base.inputs}
      saving={save.isPending}
      saveLabel={base.status === 'approved' ? 'Save (withdraws the approval)' : base.status === 'draft' ? 'Save' : 'Save (returns it to draft)'}
      error={save.error}
      onSave={(inputs) => save.mutate({ id: base.id, version: base.version, inputs }, { onSuccess: onDone })}
      stale={
        theirs
          ? {
              theirs: theirs.inputs,
              note: theirs.status === 'draft' ? null : `Their version is ${theirs.status}; keeping yours returns it to draft${theirs.status === 'approved' ? ' and withdraws the approval' : ''}.`,
              onReload: () => {
                setBase(theirs);
                save.reset();
              },
              onKeepMine: (inputs) => save.mutate({ id: theirs.id, version: theirs.version, inputs }, { onSuccess: onDone }),
            }
          : undefined
      }
      actions={
        <Button variant="ghost" onClick={onDone}>
          Cancel
        </Button>
      }
    />
  );
}
