import { useMutation, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import type { ImpactDraft, ImpactView } from '@domain/contracts/split.ts';
import { api } from '../../../lib/api.ts';
import { parseResponse } from '../../../lib/parse.ts';

const impactAnswer = z.object({ impact: z.object({ rows: z.array(z.unknown()), counts: z.object({}).passthrough() }).passthrough() });

export function impactPath(productionId: string, path: string): string {
  return `/productions/${encodeURIComponent(productionId)}/impact${path}`;
}

/** Evaluates a draft: nothing is saved. */
export function useEvaluateDraft(productionId: string) {
  return useMutation({
    mutationFn: async (draft: ImpactDraft) => parseResponse(impactAnswer, await api.post(impactPath(productionId, '/evaluate'), { draft }), 'the impact').impact as unknown as ImpactView,
  });
}

export function useApplyDraft(productionId: string) {
  return useMutation({
    mutationFn: async (draft: ImpactDraft) => parseResponse(impactAnswer, await api.post(impactPath(productionId, '/apply'), { draft }), 'the applied draft').impact as unknown as ImpactView,
  });
}

const optionsAnswer = z.object({
  lines: z.array(z.object({ id: z.string(), partNumber: z.string(), name: z.string(), unitMassKg: z.number().nullable(), version: z.number() }).passthrough()),
});

/** Part lines to pick from (first page, searchable by number or name). */
export function usePartLines(productionId: string, q: string) {
  return useQuery({
    queryKey: ['impact', productionId, 'lines', q],
    queryFn: async () =>
      parseResponse(optionsAnswer, await api.get(`/productions/${encodeURIComponent(productionId)}/machine/breakdown?limit=50&sort=partNumber${q ? `&q=${encodeURIComponent(q)}` : ''}`), 'the part lines').lines,
  });
}

export function useVenues(productionId: string) {
  return useQuery({
    queryKey: ['impact', productionId, 'venues'],
    queryFn: async () => (await api.get<{ venues: { id: string; name: string; access?: { doors?: { name?: string; widthMm?: number | null; heightMm?: number | null }[] } }[] }>(`/productions/${encodeURIComponent(productionId)}/venues`)).venues,
  });
}

export function usePlansAndHoists(productionId: string) {
  return useQuery({
    queryKey: ['impact', productionId, 'plans'],
    queryFn: async () => {
      const pid = encodeURIComponent(productionId);
      const [plans, gear] = await Promise.all([
        api.get<{ plans: { id: string; title: string; status: string }[] }>(`/productions/${pid}/lifting/plans`),
        api.get<{ gear: { id: string; kind: string; identifier: string; ratedLoadKg?: number }[] }>(`/productions/${pid}/lifting/gear`),
      ]);
      return { plans: plans.plans, hoists: gear.gear.filter((g) => g.kind === 'hoist') };
    },
  });
}
