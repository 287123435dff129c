import { useState, type FormEvent } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { z } from 'zod';
import { acceptInvitationBody } from '@domain/contracts/auth.ts';
import { Alert, Button, ErrorState, PageLoading, TextField } from '../../../components/ui/index.ts';
import { isApiError } from '../../../lib/api.ts';
import { apiFieldErrors, formLevelError, validate, type FieldErrors } from '../../../lib/form-errors.ts';
import { useAcceptInvitation } from '../api/accept-invitation.ts';
import { useInvitation, type InvitationView } from '../api/get-invitation.ts';
import { AuthFrame, linkClasses } from './auth-frame.tsx';
import { NewPasswordFields } from './password-fields.tsx';

const acceptForm = acceptInvitationBody
  .extend({ confirm: z.string() })
  .refine((v) => v.password === v.confirm, { path: ['confirm'], message: 'The two passwords are not the same.' });

export function AcceptInvitationPage() {
  const { token = '' } = useParams();
  const invitation = useInvitation(token);

  if (invitation.isPending) return <PageLoading />;
  if (invitation.isError) {
    const gone = isApiError(invitation.error) && invitation.error.status === 404;
    return (
      <AuthFrame title="Join Ballast">
        {gone ? (
          <Alert tone="caution" title="This invitation has expired or was already used">
            Ask your administrator to send a new one. If you already set your password,{' '}
            <Link to="/sign-in" className={linkClasses}>
              sign in
            </Link>
            .
          </Alert>
        ) : (
          <ErrorState error={invitation.error} onRetry={() => invitation.refetch()} retrying={invitation.isFetching} />
        )}
      </AuthFrame>
    );
  }
  return <AcceptForm token={token} invitation={invitation.data} />;
}

function AcceptForm({ token, invitation }: { token: string; invitation: InvitationView }) {
  const [name, setName] = useState(invitation.name);
  const [password, setPassword] = useState('');
  const [confirm, setConfirm] = useState('');
  const [errors, setErrors] = useState<FieldErrors>({});
  const accept = useAcceptInvitation(token);
  const navigate = useNavigate();
  const problem = formLevelError(accept.error, ['name', 'password']);

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const checked = validate(acceptForm, { name, password, confirm });
    if (!checked.ok) return setErrors(checked.errors);
    setErrors({});
    accept.mutate(
      { name: checked.data.name, password: checked.data.password },
      { onSuccess: () => navigate('/', { replace: true }), onError: (e) => setErrors(apiFieldErrors(e)) },
    );
  }

  return (
    <AuthFrame title="Join Ballast" intro={`You were invited as ${invitation.email}. Choose your password to start.`}>
      <form noValidate onSubmit={submit} className="flex flex-col gap-4">
        {problem && (
          <Alert tone="danger" title="Could not accept the invitation">
            {problem}
          </Alert>
        )}
        <TextField label="E-mail" type="email" value={invitation.email} readOnly disabled autoComplete="username" />
        <TextField label="Your name" name="name" autoComplete="name" value={name} onChange={(e) => setName(e.target.value)} error={errors.name} />
        <NewPasswordFields password={password} confirm={confirm} onPassword={setPassword} onConfirm={setConfirm} errors={errors} />
        <Button type="submit" block loading={accept.isPending}>
          Set password and sign in
        </Button>
      </form>
    </AuthFrame>
  );
}
