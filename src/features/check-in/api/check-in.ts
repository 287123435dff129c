import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CheckStatusView, ScanBody, ScanView } from '@domain/contracts/tour.ts';
import { api, ApiError, seg } from '../../../lib/api.ts';

export type { CheckStatusView, ScanView };

const base = (productionId: string) => `/productions/${seg(productionId)}/tour`;

/** `GET …/tour/check-status` → every engagement this person may check in at, with its counts. */
export function checkStatusesQueryOptions(productionId: string) {
  return queryOptions({
    queryKey: ['check-in', productionId] as const,
    queryFn: async () => (await api.get<{ statuses: CheckStatusView[] }>(`${base(productionId)}/check-status`)).statuses,
  });
}
export const useCheckStatuses = (productionId: string) => useQuery(checkStatusesQueryOptions(productionId));

/** `GET …/tour/engagements/:engagementId/check` → the expected crates with their latest scans. */
export function checkQueryOptions(productionId: string, engagementId: string) {
  return queryOptions({
    queryKey: ['check-in', productionId, engagementId] as const,
    queryFn: async () => (await api.get<{ status: CheckStatusView }>(`${base(productionId)}/engagements/${seg(engagementId)}/check`)).status,
  });
}
export const useCheck = (productionId: string, engagementId: string) => useQuery({ ...checkQueryOptions(productionId, engagementId), refetchInterval: 30_000 });

/** `POST …/tour/engagements/:engagementId/scans`: 201 new, 200 when the key was seen before (same scan). */
export async function postScan(productionId: string, engagementId: string, body: ScanBody): Promise<{ scan: ScanView; created: boolean; expected: boolean }> {
  return api.post(`${base(productionId)}/engagements/${seg(engagementId)}/scans`, body);
}

/**
 * `POST …/scans/:scanId/photos` (multipart, field "photo"). The JSON client does not send forms, so this
 * fetches the session's CSRF token and posts the form itself; failures become ApiErrors like the rest.
 */
export async function postScanPhoto(productionId: string, engagementId: string, scanId: string, photo: Blob, filename: string): Promise<void> {
  let token: string;
  let res: Response;
  try {
    token = ((await (await fetch('/api/auth/csrf', { credentials: 'same-origin' })).json()) as { csrfToken: string }).csrfToken;
    const form = new FormData();
    form.append('photo', photo, filename);
    res = await fetch(`/api${base(productionId)}/engagements/${seg(engagementId)}/scans/${seg(scanId)}/photos`, {
      method: 'POST',
      body: form,
      credentials: 'same-origin',
      headers: { 'x-csrf-token': token, accept: 'application/json' },
    });
  } catch {
    throw new ApiError(0, 'network', 'Ballast cannot be reached. The photo is kept and sent when the connection returns.');
  }
  if (!res.ok) {
    const body = (await res.json().catch(() => ({}))) as { error?: { code?: string; message?: string } };
    throw new ApiError(res.status, body.error?.code ?? `http_${res.status}`, body.error?.message ?? `The photo was refused (HTTP ${res.status}).`);
  }
}
