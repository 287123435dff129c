import { useState } from 'react';
import { membershipBody } from '@domain/contracts/auth.ts';
import { Alert, Button, SelectField } from '../../../components/ui/index.ts';
import { errorMessage } from '../../../lib/api.ts';
import { fieldError, validate, type FieldErrors } from '../../../lib/form-errors.ts';
import { PRODUCTION_ROLES, ROLE_LABEL, type ProductionRole } from '../../../lib/roles.ts';
import { useDeleteMember } from '../api/delete-member.ts';
import type { AdminUser } from '../api/get-users.ts';
import type { ProductionSummary } from '../api/get-productions.ts';
import { usePutMember } from '../api/put-member.ts';
import { VenuePicker } from './venue-picker.tsx';

/** One row per production: the person's role there, or no access. */
export function AccessEditor({ user, productions }: { user: AdminUser; productions: ProductionSummary[] }) {
  if (productions.length === 0) return <p className="text-ink-700">There are no productions yet.</p>;
  return (
    <ul className="flex flex-col gap-3" aria-label={`Access of ${user.name}`}>
      {productions.map((p) => (
        <AccessRow key={p.id} user={user} production={p} />
      ))}
    </ul>
  );
}

type Choice = ProductionRole | 'none';

function AccessRow({ user, production }: { user: AdminUser; production: ProductionSummary }) {
  const current = user.memberships.find((m) => m.productionId === production.id);
  const [role, setRole] = useState<Choice>(current?.role ?? 'none');
  const [venueIds, setVenueIds] = useState<string[]>(current?.venueIds ?? []);
  const [errors, setErrors] = useState<FieldErrors>({});
  const put = usePutMember();
  const remove = useDeleteMember();
  const busy = put.isPending || remove.isPending;
  const error = put.error ?? remove.error;

  const unchanged =
    (role === 'none' && !current) ||
    (current && role === current.role && (role !== 'venue' || sameSet(venueIds, current.venueIds)));

  function save() {
    put.reset();
    remove.reset();
    if (role === 'none') {
      if (current) remove.mutate({ productionId: production.id, userId: user.id });
      return;
    }
    const checked = validate(membershipBody, { userId: user.id, role, venueIds: role === 'venue' ? venueIds : [] });
    if (!checked.ok) return setErrors(checked.errors);
    setErrors({});
    put.mutate({ productionId: production.id, userId: user.id, role: checked.data.role, venueIds: checked.data.venueIds });
  }

  return (
    <li className="rounded-control border border-ink-200 p-3">
      <div className="flex flex-wrap items-end gap-3">
        <SelectField
          className="min-w-48 flex-1"
          label={production.name}
          value={role}
          onChange={(e) => setRole(e.target.value as Choice)}
          error={fieldError(errors, 'role')}
        >
          <option value="none">No access</option>
          {PRODUCTION_ROLES.map((r) => (
            <option key={r} value={r}>
              {ROLE_LABEL[r]}
            </option>
          ))}
        </SelectField>
        <Button variant={role === 'none' && current ? 'danger' : 'secondary'} onClick={save} loading={busy} disabled={Boolean(unchanged)}>
          {role === 'none' && current ? 'Remove access' : 'Save'}
        </Button>
      </div>
      {role === 'venue' && (
        <div className="mt-3">
          <VenuePicker venues={production.venues ?? []} value={venueIds} onChange={setVenueIds} error={fieldError(errors, 'venueIds')} />
        </div>
      )}
      {error && (
        <Alert tone="danger" className="mt-3">
          {errorMessage(error)}
        </Alert>
      )}
      {(put.isSuccess || remove.isSuccess) && (
        <p role="status" className="mt-2 text-sm font-medium text-ok-700">
          Saved.
        </p>
      )}
    </li>
  );
}

function sameSet(a: string[], b: string[]): boolean {
  return a.length === b.length && a.every((id) => b.includes(id));
}
