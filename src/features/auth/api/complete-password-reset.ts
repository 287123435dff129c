import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api.ts';

/** `POST /api/auth/password-reset/complete` → 204; 400 `invalid_token` when expired or used. */
export async function completePasswordReset(body: { token: string; password: string }): Promise<void> {
  await api.post<void>('/auth/password-reset/complete', body);
}

export function useCompletePasswordReset() {
  return useMutation({ mutationFn: completePasswordReset });
}
