import { Badge, Card, PageHeader, PageLoading } from '../../../components/ui/index.ts';
import { ROLE_LABEL } from '../../../lib/roles.ts';
import { useSessionUser } from '../../../lib/session.ts';
import { PasswordCard } from './password-card.tsx';
import { UnitsCard } from './units-card.tsx';

export function AccountPage() {
  const user = useSessionUser();
  if (!user) return <PageLoading />;
  return (
    <div className="flex flex-col gap-5">
      <PageHeader title="Your account" description={`${user.name} · ${user.email}`} actions={user.isAdmin && <Badge tone="accent">Administrator</Badge>} />
      <UnitsCard />
      <PasswordCard />
      <Card title="Your productions">
        {user.memberships.length === 0 ? (
          <p className="text-ink-700">You are not on any production yet.</p>
        ) : (
          <ul className="divide-y divide-ink-100">
            {user.memberships.map((m) => (
              <li key={m.productionId} className="flex flex-wrap items-center justify-between gap-2 py-2">
                <span className="font-medium">{m.productionName}</span>
                <Badge>{ROLE_LABEL[m.role]}</Badge>
              </li>
            ))}
          </ul>
        )}
      </Card>
    </div>
  );
}
