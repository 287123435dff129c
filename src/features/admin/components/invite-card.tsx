import { useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { invitationBody } from '@domain/contracts/auth.ts';
import { Alert, Button, Card, CheckboxField, SelectField, TextField } from '../../../components/ui/index.ts';
import { apiFieldErrors, fieldError, formLevelError, validate, type FieldErrors } from '../../../lib/form-errors.ts';
import { PRODUCTION_ROLES, ROLE_LABEL, ROLE_SUMMARY, type ProductionRole } from '../../../lib/roles.ts';
import { useCreateInvitation } from '../api/create-invitation.ts';
import type { ProductionSummary } from '../api/get-productions.ts';
import { VenuePicker } from './venue-picker.tsx';

const EMPTY = { email: '', name: '', isAdmin: false, productionId: '', role: 'planner' as ProductionRole, venueIds: [] as string[] };
const FIELDS = ['email', 'name', 'isAdmin', 'membership.productionId', 'membership.role', 'membership.venueIds'];

/** Invite a person by e-mail, optionally straight onto one production with a role. */
export function InviteCard({ productions }: { productions: ProductionSummary[] }) {
  const [values, setValues] = useState(EMPTY);
  const [errors, setErrors] = useState<FieldErrors>({});
  const invite = useCreateInvitation();
  const set = <K extends keyof typeof EMPTY>(key: K, value: (typeof EMPTY)[K]) => setValues((v) => ({ ...v, [key]: value }));

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const body = {
      email: values.email,
      name: values.name,
      isAdmin: values.isAdmin,
      membership: values.productionId
        ? { productionId: values.productionId, role: values.role, venueIds: values.role === 'venue' ? values.venueIds : [] }
        : undefined,
    };
    const checked = validate(invitationBody, body);
    if (!checked.ok) return setErrors(checked.errors);
    setErrors({});
    invite.mutate(checked.data, {
      onSuccess: () => setValues(EMPTY),
      onError: (error) => setErrors(apiFieldErrors(error)),
    });
  }

  const problem = formLevelError(invite.error, FIELDS);

  return (
    <Card title="Invite a person" description="They get an e-mail with a link to choose a password.">
      <form noValidate onSubmit={submit} className="flex flex-col gap-4">
        {invite.isSuccess && invite.data.delivered === false && (
          <Alert tone="caution" title={`The invitation for ${invite.data.email} is saved, but the e-mail could not be sent`}>
            Check the mail settings, then invite again or send the person the link another way.
          </Alert>
        )}
        {invite.isSuccess && invite.data.delivered !== false && (
          <Alert tone="ok" title={`Invitation sent to ${invite.data.email}`}>
            The link works until {new Date(invite.data.expiresAt).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short' })}.
            In development the e-mail lands in{' '}
            <Link to="/admin/mail" className="font-semibold underline">
              caught mail
            </Link>
            .
          </Alert>
        )}
        {problem && (
          <Alert tone="danger" title="Could not send the invitation">
            {problem}
          </Alert>
        )}
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField label="E-mail" type="email" autoComplete="off" value={values.email} onChange={(e) => set('email', e.target.value)} error={errors.email} />
          <TextField label="Name" autoComplete="off" value={values.name} onChange={(e) => set('name', e.target.value)} error={errors.name} />
        </div>
        <div className="grid gap-4 sm:grid-cols-2">
          <SelectField
            label="Production"
            value={values.productionId}
            onChange={(e) => setValues((v) => ({ ...v, productionId: e.target.value, venueIds: [] }))}
            error={fieldError(errors, 'membership.productionId')}
            hint="Access can be added or changed later."
          >
            <option value="">No production yet</option>
            {productions.map((p) => (
              <option key={p.id} value={p.id}>
                {p.name}
              </option>
            ))}
          </SelectField>
          {values.productionId && (
            <SelectField
              label="Role"
              value={values.role}
              onChange={(e) => set('role', e.target.value as ProductionRole)}
              error={fieldError(errors, 'membership.role')}
              hint={ROLE_SUMMARY[values.role]}
            >
              {PRODUCTION_ROLES.map((r) => (
                <option key={r} value={r}>
                  {ROLE_LABEL[r]}
                </option>
              ))}
            </SelectField>
          )}
        </div>
        {values.productionId && values.role === 'venue' && (
          <VenuePicker
            venues={productions.find((p) => p.id === values.productionId)?.venues ?? []}
            value={values.venueIds}
            onChange={(ids) => set('venueIds', ids)}
            error={fieldError(errors, 'membership.venueIds')}
          />
        )}
        <CheckboxField
          label="Administrator"
          hint="May invite people and change anyone's access."
          checked={values.isAdmin}
          onChange={(e) => set('isAdmin', e.target.checked)}
        />
        <div>
          <Button type="submit" loading={invite.isPending}>
            Send invitation
          </Button>
        </div>
      </form>
    </Card>
  );
}
