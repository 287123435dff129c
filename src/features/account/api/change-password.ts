import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api.ts';

/** `POST /api/auth/me/password` {currentPassword, newPassword} → 204. */
export async function changePassword(body: { currentPassword: string; newPassword: string }): Promise<void> {
  await api.post<void>('/auth/me/password', body);
}

export function useChangePassword() {
  return useMutation({ mutationFn: changePassword });
}
