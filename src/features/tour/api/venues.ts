import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { AccessMatrixView, CreateVenueBody, HangingPointView, UpdateVenueBody, VenueView } from '@domain/contracts/tour.ts';
import { api, seg, staleCurrent } from '../../../lib/api.ts';

export type { VenueView, HangingPointView };

const base = (productionId: string) => `/productions/${seg(productionId)}/venues`;

/** `GET …/venues` → the venues (venue staff: their own). */
export function venuesQueryOptions(productionId: string) {
  return queryOptions({
    queryKey: ['venues', productionId] as const,
    queryFn: async () => (await api.get<{ venues: VenueView[] }>(base(productionId))).venues,
  });
}
export const useVenues = (productionId: string) => useQuery(venuesQueryOptions(productionId));

/** `GET …/venues/:venueId` → one venue with its access data and contacts. */
export function venueQueryOptions(productionId: string, venueId: string) {
  return queryOptions({
    queryKey: ['venues', productionId, venueId] as const,
    queryFn: async () => (await api.get<{ venue: VenueView }>(`${base(productionId)}/${seg(venueId)}`)).venue,
  });
}
export const useVenue = (productionId: string, venueId: string) => useQuery(venueQueryOptions(productionId, venueId));

/** `GET …/venues/:venueId/access-check` → every crate and section checked against this venue. */
export function venueCheckQueryOptions(productionId: string, venueId: string) {
  return queryOptions({
    queryKey: ['venues', productionId, venueId, 'check'] as const,
    queryFn: async () => (await api.get<{ check: AccessMatrixView }>(`${base(productionId)}/${seg(venueId)}/access-check`)).check,
  });
}
export const useVenueCheck = (productionId: string, venueId: string) => useQuery(venueCheckQueryOptions(productionId, venueId));

/** `GET …/lifting/hanging-points` (kept by the lifting module), this venue's only. */
export function hangingPointsQueryOptions(productionId: string, venueId: string) {
  return queryOptions({
    queryKey: ['venues', productionId, venueId, 'hanging-points'] as const,
    queryFn: async () =>
      (await api.get<{ hangingPoints: (HangingPointView & { venueId: string })[] }>(`/productions/${seg(productionId)}/lifting/hanging-points`)).hangingPoints.filter((p) => p.venueId === venueId),
  });
}
export const useHangingPoints = (productionId: string, venueId: string) => useQuery(hangingPointsQueryOptions(productionId, venueId));

/** The venue as it is now on the server, when a save was refused as stale; else null. */
export function venueConflict(error: unknown): VenueView | null {
  return staleCurrent<VenueView>(error);
}

/** `PATCH …/venues/:venueId` {version, …changes}; 409 carries the current venue. */
export function useUpdateVenue(productionId: string, venueId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (body: UpdateVenueBody) => (await api.patch<{ venue: VenueView }>(`${base(productionId)}/${seg(venueId)}`, body)).venue,
    onSuccess: (venue) => {
      qc.setQueryData(venueQueryOptions(productionId, venueId).queryKey, venue);
      void qc.invalidateQueries({ queryKey: ['venues', productionId] });
      void qc.invalidateQueries({ queryKey: ['tour', productionId] });
    },
  });
}

/** `POST …/venues` (planners). */
export function useCreateVenue(productionId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (body: Partial<CreateVenueBody> & { name: string }) => (await api.post<{ venue: VenueView }>(base(productionId), body)).venue,
    onSuccess: () => void qc.invalidateQueries({ queryKey: ['venues', productionId] }),
  });
}

/** Hanging points through the lifting module's API: add and remove. */
export function useHangingPointMutations(productionId: string, venueId: string) {
  const qc = useQueryClient();
  const url = `/productions/${seg(productionId)}/lifting/hanging-points`;
  const refresh = () => void qc.invalidateQueries({ queryKey: hangingPointsQueryOptions(productionId, venueId).queryKey });
  return {
    add: useMutation({ mutationFn: (body: { label: string; ratingKg: number | null; notes?: string }) => api.post(url, { venueId, notes: '', ...body }), onSuccess: refresh }),
    remove: useMutation({ mutationFn: (id: string) => api.delete(`${url}/${seg(id)}`), onSuccess: refresh }),
  };
}
