import { useState, type FormEvent } from 'react';
import { z } from 'zod';
import { changePasswordBody } from '@domain/contracts/auth.ts';
import { Alert, Button, Card, TextField } from '../../../components/ui/index.ts';
import { apiFieldErrors, formLevelError, validate, type FieldErrors } from '../../../lib/form-errors.ts';
import { useChangePassword } from '../api/change-password.ts';

const passwordForm = changePasswordBody
  .extend({ currentPassword: z.string().min(1, 'Enter your current password.').max(200), confirm: z.string() })
  .refine((v) => v.newPassword === v.confirm, { path: ['confirm'], message: 'The two passwords are not the same.' });

const EMPTY = { currentPassword: '', newPassword: '', confirm: '' };
const FIELDS = ['currentPassword', 'newPassword', 'confirm'];

export function PasswordCard() {
  const [values, setValues] = useState(EMPTY);
  const [errors, setErrors] = useState<FieldErrors>({});
  const change = useChangePassword();
  const set = (key: keyof typeof EMPTY) => (e: { target: { value: string } }) => setValues((v) => ({ ...v, [key]: e.target.value }));

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const checked = validate(passwordForm, values);
    if (!checked.ok) return setErrors(checked.errors);
    setErrors({});
    change.mutate(
      { currentPassword: checked.data.currentPassword, newPassword: checked.data.newPassword },
      {
        onSuccess: () => setValues(EMPTY),
        // A wrong current password comes back as a 400 naming `currentPassword`.
        onError: (error) => setErrors(apiFieldErrors(error)),
      },
    );
  }

  const problem = formLevelError(change.error, FIELDS);

  return (
    <Card title="Password">
      <form noValidate onSubmit={submit} className="flex max-w-md flex-col gap-4">
        {change.isSuccess && <Alert tone="ok">Your password is changed.</Alert>}
        {problem && (
          <Alert tone="danger" title="Could not change the password">
            {problem}
          </Alert>
        )}
        <TextField
          label="Current password"
          type="password"
          autoComplete="current-password"
          value={values.currentPassword}
          onChange={set('currentPassword')}
          error={errors.currentPassword}
        />
        <TextField
          label="New password"
          type="password"
          autoComplete="new-password"
          hint="At least 10 characters."
          value={values.newPassword}
          onChange={set('newPassword')}
          error={errors.newPassword}
        />
        <TextField
          label="New password again"
          type="password"
          autoComplete="new-password"
          value={values.confirm}
          onChange={set('confirm')}
          error={errors.confirm}
        />
        <div>
          <Button type="submit" loading={change.isPending}>
            Change password
          </Button>
        </div>
      </form>
    </Card>
  );
}
