import { z } from 'zod';
import { newPassword } from '@domain/contracts/auth.ts';
import { TextField } from '../../../components/ui/index.ts';
import type { FieldErrors } from '../../../lib/form-errors.ts';

/** A new password typed twice; the contract's rules plus a check that both match. */
export const newPasswordPair = z
  .object({ password: newPassword, confirm: z.string() })
  .refine((v) => v.password === v.confirm, { path: ['confirm'], message: 'The two passwords are not the same.' });

interface Props {
  password: string;
  confirm: string;
  onPassword: (value: string) => void;
  onConfirm: (value: string) => void;
  errors: FieldErrors;
}

export function NewPasswordFields({ password, confirm, onPassword, onConfirm, errors }: Props) {
  return (
    <>
      <TextField
        label="New password"
        type="password"
        name="new-password"
        autoComplete="new-password"
        hint="At least 10 characters. A few words in a row make a strong password."
        value={password}
        onChange={(e) => onPassword(e.target.value)}
        error={errors.password}
      />
      <TextField
        label="New password again"
        type="password"
        name="confirm-password"
        autoComplete="new-password"
        value={confirm}
        onChange={(e) => onConfirm(e.target.value)}
        error={errors.confirm}
      />
    </>
  );
}
