import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api.ts';

/** `POST /api/auth/password-reset/request` → 202, whether or not the address is known. */
export async function requestPasswordReset(body: { email: string }): Promise<void> {
  await api.post<void>('/auth/password-reset/request', body);
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}
