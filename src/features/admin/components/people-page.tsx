import { useState } from 'react';
import { Badge, Button, Card, EmptyState, ErrorState, PageHeader, PageLoading } from '../../../components/ui/index.ts';
import { ROLE_LABEL } from '../../../lib/roles.ts';
import { useAllProductions, type ProductionSummary } from '../api/get-productions.ts';
import { useUsers, type AdminUser } from '../api/get-users.ts';
import { AccessEditor } from './access-editor.tsx';
import { InviteCard } from './invite-card.tsx';

export function PeoplePage() {
  const users = useUsers();
  const productions = useAllProductions();

  return (
    <div className="flex flex-col gap-5">
      <PageHeader eyebrow="Company" title="People" description="Invite people and choose what they may do on each production." />
      {productions.isError ? (
        <ErrorState title="The productions could not be loaded" error={productions.error} onRetry={() => productions.refetch()} retrying={productions.isFetching} />
      ) : productions.isPending ? (
        <PageLoading />
      ) : (
        <InviteCard productions={productions.data} />
      )}
      <Card title="Everyone">
        {users.isPending ? (
          <PageLoading label="Loading people…" />
        ) : users.isError ? (
          <ErrorState title="The people could not be loaded" error={users.error} onRetry={() => users.refetch()} retrying={users.isFetching} />
        ) : users.data.length === 0 ? (
          <EmptyState title="Nobody here yet">Invite the first person above.</EmptyState>
        ) : (
          <ul className="divide-y divide-ink-100" aria-label="People">
            {users.data.map((u) => (
              <PersonRow key={u.id} user={u} productions={productions.data ?? []} />
            ))}
          </ul>
        )}
      </Card>
    </div>
  );
}

function PersonRow({ user, productions }: { user: AdminUser; productions: ProductionSummary[] }) {
  const [open, setOpen] = useState(false);
  const panelId = `access-${user.id}`;
  return (
    <li className="py-3">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div className="min-w-0">
          <p className="flex flex-wrap items-center gap-2 font-semibold text-ink-900">
            {user.name}
            {user.isAdmin && <Badge tone="accent">Administrator</Badge>}
            {!user.active && <Badge tone="caution">Invited</Badge>}
          </p>
          <p className="truncate text-sm text-ink-600">{user.email}</p>
          <p className="mt-1 text-sm text-ink-700">
            {user.memberships.length === 0
              ? 'No productions'
              : user.memberships.map((m) => `${m.productionName} (${ROLE_LABEL[m.role]})`).join(' · ')}
          </p>
        </div>
        <Button variant="secondary" size="sm" aria-expanded={open} aria-controls={panelId} onClick={() => setOpen((o) => !o)}>
          {open ? 'Close' : 'Edit access'}
          <span className="sr-only"> for {user.name}</span>
        </Button>
      </div>
      {open && (
        <div id={panelId} className="mt-3">
          <AccessEditor user={user} productions={productions} />
        </div>
      )}
    </li>
  );
}
