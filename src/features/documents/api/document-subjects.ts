import { useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api, seg } from '../../../lib/api.ts';
import { parseResponse } from '../../../lib/parse.ts';

/**
 * What the documents panel offers: the production's crates (`GET …/crates`) and the engagements the
 * person may see (`GET …/tour`, already limited to a venue user's own venues). Only the fields the
 * panel shows are read.
 */
const crateList = z.object({ crates: z.array(z.object({ id: z.string(), code: z.string(), name: z.string() })) });
const tourList = z.object({
  tour: z.object({ engagements: z.array(z.object({ id: z.string(), venueName: z.string(), venueCity: z.string(), loadInOn: z.string() })) }),
});

export type DocumentCrate = z.infer<typeof crateList>['crates'][number];
export type DocumentEngagement = z.infer<typeof tourList>['tour']['engagements'][number];

export function useDocumentCrates(productionId: string, enabled: boolean) {
  return useQuery({
    queryKey: ['productions', productionId, 'crates', 'for-documents'] as const,
    enabled,
    queryFn: async (): Promise<DocumentCrate[]> => parseResponse(crateList, await api.get(`/productions/${seg(productionId)}/crates`), 'the crates').crates,
  });
}

export function useDocumentEngagements(productionId: string, enabled: boolean) {
  return useQuery({
    queryKey: ['productions', productionId, 'tour', 'for-documents'] as const,
    enabled,
    queryFn: async (): Promise<DocumentEngagement[]> => parseResponse(tourList, await api.get(`/productions/${seg(productionId)}/tour`), 'the tour').tour.engagements,
  });
}
