import { useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { signInBody } from '@domain/contracts/auth.ts';
import { Alert, Button, TextField } from '../../../components/ui/index.ts';
import { errorMessage, isApiError } from '../../../lib/api.ts';
import { apiFieldErrors, formLevelError, validate, type FieldErrors } from '../../../lib/form-errors.ts';
import { useSignIn } from '../api/sign-in.ts';
import { linkClasses } from './auth-frame.tsx';

/** E-mail and password. Checks the fields first, then shows what the server said. */
export function SignInForm({ onSignedIn }: { onSignedIn: () => void }) {
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const [errors, setErrors] = useState<FieldErrors>({});
  const signIn = useSignIn();

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const checked = validate(signInBody, { email, password });
    if (!checked.ok) {
      setErrors(checked.errors);
      return;
    }
    setErrors({});
    signIn.mutate(checked.data, {
      onSuccess: onSignedIn,
      onError: (error) => setErrors(apiFieldErrors(error)),
    });
  }

  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-4">
      {signIn.error && <SignInProblem error={signIn.error} />}
      <TextField
        label="E-mail"
        type="email"
        name="email"
        autoComplete="username"
        inputMode="email"
        value={email}
        onChange={(e) => setEmail(e.target.value)}
        error={errors.email}
      />
      <TextField
        label="Password"
        type="password"
        name="password"
        autoComplete="current-password"
        value={password}
        onChange={(e) => setPassword(e.target.value)}
        error={errors.password}
      />
      <Button type="submit" block loading={signIn.isPending}>
        Sign in
      </Button>
      <p className="text-center">
        <Link to="/forgot-password" className={linkClasses}>
          Forgot your password?
        </Link>
      </p>
    </form>
  );
}

function SignInProblem({ error }: { error: unknown }) {
  if (isApiError(error, 'invalid_credentials')) {
    return (
      <Alert tone="danger" title="E-mail or password is not right">
        Check both and try again. After several misses, sign-in pauses for a while.
      </Alert>
    );
  }
  if (isApiError(error, 'rate_limited')) {
    // The server's message says when to try again.
    return (
      <Alert tone="caution" title="Too many attempts">
        {errorMessage(error)}
      </Alert>
    );
  }
  const problem = formLevelError(error, ['email', 'password']);
  return problem ? (
    <Alert tone="danger" title="Could not sign in">
      {problem}
    </Alert>
  ) : null;
}
