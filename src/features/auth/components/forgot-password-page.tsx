import { useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { resetRequestBody } from '@domain/contracts/auth.ts';
import { Alert, Button, TextField } from '../../../components/ui/index.ts';
import { errorMessage } from '../../../lib/api.ts';
import { validate, type FieldErrors } from '../../../lib/form-errors.ts';
import { useRequestPasswordReset } from '../api/request-password-reset.ts';
import { AuthFrame, linkClasses } from './auth-frame.tsx';

export function ForgotPasswordPage() {
  const [email, setEmail] = useState('');
  const [errors, setErrors] = useState<FieldErrors>({});
  const request = useRequestPasswordReset();

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const checked = validate(resetRequestBody, { email });
    if (!checked.ok) return setErrors(checked.errors);
    setErrors({});
    request.mutate(checked.data);
  }

  return (
    <AuthFrame
      title="Forgot your password?"
      intro="We send a link to set a new one."
      footer={
        <Link to="/sign-in" className={linkClasses}>
          Back to sign-in
        </Link>
      }
    >
      {request.isSuccess ? (
        <Alert tone="ok" title="Check your e-mail">
          If an account exists for {request.variables?.email}, a link to set a new password is on its way. The link
          works for a limited time.
        </Alert>
      ) : (
        <form noValidate onSubmit={submit} className="flex flex-col gap-4">
          {request.error && (
            <Alert tone="danger" title="Could not send the link">
              {errorMessage(request.error)}
            </Alert>
          )}
          <TextField
            label="E-mail"
            type="email"
            name="email"
            autoComplete="email"
            inputMode="email"
            value={email}
            onChange={(e) => setEmail(e.target.value)}
            error={errors.email}
          />
          <Button type="submit" block loading={request.isPending}>
            Send the link
          </Button>
        </form>
      )}
    </AuthFrame>
  );
}
