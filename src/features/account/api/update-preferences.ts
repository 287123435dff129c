import { useMutation, useQueryClient } from '@tanstack/react-query';
import { sessionUser } from '@domain/contracts/auth.ts';
import type { UnitSystem } from '@domain/units.ts';
import { api } from '../../../lib/api.ts';
import { parseResponse } from '../../../lib/parse.ts';
import { sessionQueryOptions, type SessionUser } from '../../../lib/session.ts';

/** `PATCH /api/auth/me/preferences` {units} → the user with the new preference. */
export async function updatePreferences(body: { units: UnitSystem }): Promise<SessionUser> {
  const res = await api.patch<{ user: unknown }>('/auth/me/preferences', body);
  return parseResponse(sessionUser, res?.user, 'saving preferences');
}

export function useUpdatePreferences() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updatePreferences,
    // Every screen reads units from the session, so writing it there re-renders them all.
    onSuccess: (user) => queryClient.setQueryData(sessionQueryOptions().queryKey, user),
  });
}
