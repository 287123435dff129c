import { Badge, Card, EmptyState, ErrorState, PageLoading } from '../../../components/ui/index.ts';
import { ROLE_LABEL } from '../../../lib/roles.ts';
import { useMembers } from '../api/get-members.ts';

export function MembersCard({ productionId }: { productionId: string }) {
  const members = useMembers(productionId);
  return (
    <Card title="People on this production">
      {members.isPending ? (
        <PageLoading label="Loading people…" />
      ) : members.isError ? (
        <ErrorState title="The people could not be loaded" error={members.error} onRetry={() => members.refetch()} retrying={members.isFetching} />
      ) : members.data.length === 0 ? (
        <EmptyState title="Nobody is on this production yet">An administrator adds people from the People page.</EmptyState>
      ) : (
        <ul className="divide-y divide-ink-100" aria-label="Members">
          {members.data.map((m) => (
            <li key={m.userId} className="flex flex-wrap items-center justify-between gap-x-4 gap-y-1 py-3">
              <div className="min-w-0">
                <p className="font-semibold text-ink-900">{m.name}</p>
                <p className="truncate text-sm text-ink-600">{m.email}</p>
              </div>
              <div className="flex items-center gap-2">
                {m.role === 'venue' && <span className="text-sm text-ink-600">{m.venueIds.length} venue{m.venueIds.length === 1 ? '' : 's'}</span>}
                <Badge tone={m.role === 'planner' ? 'accent' : m.role === 'rigger' ? 'caution' : 'neutral'}>{ROLE_LABEL[m.role]}</Badge>
              </div>
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}
