import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, resetCsrfToken } from '../../../lib/api.ts';
import { replaceSession } from '../../../lib/session.ts';

/** `POST /api/auth/sign-out` → 204. */
export async function signOut(): Promise<void> {
  await api.post<void>('/auth/sign-out');
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSettled: () => {
      // Even if the request failed, forget everything on this device.
      resetCsrfToken();
      replaceSession(queryClient, null);
    },
  });
}
