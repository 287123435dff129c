import { useState, type FormEvent } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { Alert, Button, buttonClasses } from '../../../components/ui/index.ts';
import { isApiError } from '../../../lib/api.ts';
import { apiFieldErrors, formLevelError, validate, type FieldErrors } from '../../../lib/form-errors.ts';
import { useCompletePasswordReset } from '../api/complete-password-reset.ts';
import { AuthFrame, linkClasses } from './auth-frame.tsx';
import { NewPasswordFields, newPasswordPair } from './password-fields.tsx';

export function ResetPasswordPage() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const [password, setPassword] = useState('');
  const [confirm, setConfirm] = useState('');
  const [errors, setErrors] = useState<FieldErrors>({});
  const complete = useCompletePasswordReset();
  const problem = formLevelError(complete.error, ['password']);

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const checked = validate(newPasswordPair, { password, confirm });
    if (!checked.ok) return setErrors(checked.errors);
    setErrors({});
    complete.mutate({ token, password: checked.data.password }, { onError: (e) => setErrors(apiFieldErrors(e)) });
  }

  const footer = (
    <Link to="/sign-in" className={linkClasses}>
      Back to sign-in
    </Link>
  );

  if (!token) {
    return (
      <AuthFrame title="Set a new password" footer={footer}>
        <Alert tone="caution" title="This link is incomplete">
          Open the link from the e-mail again, or <Link to="/forgot-password" className={linkClasses}>ask for a new one</Link>.
        </Alert>
      </AuthFrame>
    );
  }

  if (complete.isSuccess) {
    return (
      <AuthFrame title="Password changed">
        <Alert tone="ok">Your new password is set. Sign in with it now.</Alert>
        <Link to="/sign-in" className={buttonClasses({ block: true }) + ' mt-4'}>
          Sign in
        </Link>
      </AuthFrame>
    );
  }

  return (
    <AuthFrame title="Set a new password" footer={footer}>
      <form noValidate onSubmit={submit} className="flex flex-col gap-4">
        {isApiError(complete.error, 'invalid_token') ? (
          <Alert tone="danger" title="This link has expired or was already used">
            <Link to="/forgot-password" className={linkClasses}>
              Ask for a new link
            </Link>
            .
          </Alert>
        ) : (
          problem && (
            <Alert tone="danger" title="Could not set the password">
              {problem}
            </Alert>
          )
        )}
        <NewPasswordFields password={password} confirm={confirm} onPassword={setPassword} onConfirm={setConfirm} errors={errors} />
        <Button type="submit" block loading={complete.isPending}>
          Set password
        </Button>
      </form>
    </AuthFrame>
  );
}
