import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { CheckStatusView, InviteVenueStaffBody, MailingView, ManifestData, ScanView, SendManifestBody } from '@domain/contracts/tour.ts';
import { api, seg } from '../../../lib/api.ts';

export type { MailingView };

/** The manifest data the server computes (the shape is the shared contract's). */
export type ManifestView = ManifestData;

const base = (productionId: string) => `/productions/${seg(productionId)}/tour`;

/** `GET …/tour/engagements/:engagementId/manifest`. */
export function manifestQueryOptions(productionId: string, engagementId: string) {
  return queryOptions({
    queryKey: ['tour', productionId, 'manifest', engagementId] as const,
    queryFn: async () => (await api.get<{ manifest: ManifestView }>(`${base(productionId)}/engagements/${seg(engagementId)}/manifest`)).manifest,
  });
}
export const useManifest = (productionId: string, engagementId: string) => useQuery(manifestQueryOptions(productionId, engagementId));

/** The address of the manifest as a spreadsheet (CSV), for a download link. */
export const manifestCsvHref = (productionId: string, engagementId: string) => `/api${base(productionId)}/engagements/${seg(engagementId)}/manifest/csv`;

/** The printed manifest (PDF, rendered by the documents module), for a download link. */
export const manifestPdfHref = (productionId: string, engagementId: string) => `/api/productions/${seg(productionId)}/documents/engagements/${seg(engagementId)}/manifest.pdf`;

/** `GET …/tour/engagements/:engagementId/check` → expected, here, missing, damaged and flags. */
export function engagementCheckQueryOptions(productionId: string, engagementId: string) {
  return queryOptions({
    queryKey: ['tour', productionId, 'check', engagementId] as const,
    queryFn: async () => (await api.get<{ status: CheckStatusView }>(`${base(productionId)}/engagements/${seg(engagementId)}/check`)).status,
  });
}
export const useEngagementCheck = (productionId: string, engagementId: string, enabled = true) => useQuery({ ...engagementCheckQueryOptions(productionId, engagementId), enabled });

/** `GET …/tour/engagements/:engagementId/mailings` → the delivery log, newest first. */
export function mailingsQueryOptions(productionId: string, engagementId: string) {
  return queryOptions({
    queryKey: ['tour', productionId, 'mailings', engagementId] as const,
    queryFn: async () => (await api.get<{ mailings: MailingView[] }>(`${base(productionId)}/engagements/${seg(engagementId)}/mailings`)).mailings,
  });
}
export const useMailings = (productionId: string, engagementId: string, enabled = true) => useQuery({ ...mailingsQueryOptions(productionId, engagementId), enabled });

/** `GET …/tour/mailings?status=failed` → undeliverable mail across the tour. */
export function failedMailingsQueryOptions(productionId: string) {
  return queryOptions({
    queryKey: ['tour', productionId, 'mailings', 'failed'] as const,
    queryFn: async () => (await api.get<{ mailings: MailingView[] }>(`${base(productionId)}/mailings?status=failed`)).mailings,
  });
}
export const useFailedMailings = (productionId: string, enabled = true) => useQuery({ ...failedMailingsQueryOptions(productionId), enabled });

/** Send the manifest, invite venue staff, and retry a failed message; each refreshes the delivery logs. */
export function useMailMutations(productionId: string, engagementId: string) {
  const qc = useQueryClient();
  const refresh = () => void qc.invalidateQueries({ queryKey: ['tour', productionId, 'mailings'] });
  return {
    send: useMutation({
      mutationFn: async (body: Partial<SendManifestBody>) => (await api.post<{ mailings: MailingView[] }>(`${base(productionId)}/engagements/${seg(engagementId)}/manifest/send`, body)).mailings,
      onSuccess: refresh,
    }),
    invite: useMutation({
      mutationFn: async (body: InviteVenueStaffBody) => (await api.post<{ mailing: MailingView }>(`${base(productionId)}/engagements/${seg(engagementId)}/invitations`, body)).mailing,
      onSuccess: refresh,
    }),
    retry: useMutation({
      mutationFn: async (mailingId: string) => (await api.post<{ mailing: MailingView }>(`${base(productionId)}/mailings/${seg(mailingId)}/retry`)).mailing,
      onSuccess: refresh,
    }),
  };
}

/** `GET …/tour/engagements/:engagementId/scans` → every scan, newest first, with its photos. */
export function scansQueryOptions(productionId: string, engagementId: string) {
  return queryOptions({
    queryKey: ['tour', productionId, 'scans', engagementId] as const,
    queryFn: async () => (await api.get<{ scans: ScanView[] }>(`${base(productionId)}/engagements/${seg(engagementId)}/scans`)).scans,
  });
}
export const useScans = (productionId: string, engagementId: string) => useQuery(scansQueryOptions(productionId, engagementId));

/** The address of a scan's photo, for an image. */
export const scanPhotoSrc = (productionId: string, engagementId: string, scanId: string, photoId: string) =>
  `/api${base(productionId)}/engagements/${seg(engagementId)}/scans/${seg(scanId)}/photos/${seg(photoId)}`;
