import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { Badge, buttonClasses, Card, ErrorState, PageHeader, PageLoading } from '../../../components/ui/index.ts';
import { useCurrentProduction, useMay } from '../../../lib/current-production.ts';
import { ROLE_LABEL, ROLE_SUMMARY } from '../../../lib/roles.ts';
import { useProduction } from '../api/get-production.ts';
import { MembersCard } from './members-card.tsx';

export function OverviewPage() {
  const { productionId, role } = useCurrentProduction();
  const production = useProduction(productionId ?? '');
  const mayEdit = useMay('production.settings.edit');

  if (production.isPending) return <PageLoading />;
  if (production.isError) {
    return <ErrorState title="The production could not be loaded" error={production.error} onRetry={() => production.refetch()} retrying={production.isFetching} />;
  }
  const p = production.data;
  return (
    <div className="flex flex-col gap-5">
      <PageHeader
        eyebrow="Production"
        title={p.name}
        description={p.machineName ? `Touring ${p.machineName}` : undefined}
        actions={
          mayEdit && (
            <Link to="settings" className={buttonClasses({ variant: 'secondary' })}>
              Edit settings
            </Link>
          )
        }
      />
      <div className="grid gap-5 lg:grid-cols-2">
        <Card title="At a glance">
          <dl className="grid grid-cols-[auto_1fr] gap-x-6 gap-y-3">
            <Row term="Machine">{p.machineName || <span className="text-ink-500">Not named yet</span>}</Row>
            <Row term="Your role">
              {role ? (
                <span className="flex flex-col gap-1">
                  <Badge tone="accent" className="w-fit">
                    {ROLE_LABEL[role]}
                  </Badge>
                  <span className="text-sm text-ink-600">{ROLE_SUMMARY[role]}</span>
                </span>
              ) : (
                '—'
              )}
            </Row>
            <Row term="Paper size">{p.paperSize}</Row>
            <Row term="Paperwork units">{p.defaultUnits === 'imperial' ? 'Imperial' : 'Metric'}</Row>
            <Row term="Last changed">{formatWhen(p.updatedAt)}</Row>
          </dl>
        </Card>
        <MembersCard productionId={p.id} />
      </div>
    </div>
  );
}

function Row({ term, children }: { term: string; children: ReactNode }) {
  return (
    <>
      <dt className="font-semibold text-ink-700">{term}</dt>
      <dd className="text-ink-900">{children}</dd>
    </>
  );
}

function formatWhen(iso: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : date.toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short' });
}
