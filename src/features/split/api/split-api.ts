import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { AdoptSplitBody, SplitInputView, SplitLimitsQuery, SplitLimitsView, SplitRunView } from '@domain/contracts/split.ts';
import { api } from '../../../lib/api.ts';
import { parseResponse } from '../../../lib/parse.ts';

export const splitKeys = {
  all: (productionId: string) => ['split', productionId] as const,
  input: (productionId: string) => ['split', productionId, 'input'] as const,
  limits: (productionId: string, q: Partial<SplitLimitsQuery>) => ['split', productionId, 'limits', q] as const,
  run: (productionId: string, runId: string) => ['split', productionId, 'run', runId] as const,
};

export function splitPath(productionId: string, path = ''): string {
  return `/productions/${encodeURIComponent(productionId)}/split${path}`;
}

// The answers are checked for their outer shape; their inside is the server's typed view.
const inputAnswer = z.object({ input: z.object({ stamp: z.string(), machineVersion: z.number(), assemblies: z.array(z.unknown()), parts: z.array(z.unknown()) }).passthrough() });
const limitsAnswer = z.object({ limits: z.object({ mass: z.object({}).passthrough(), size: z.object({}).passthrough() }).passthrough() });
const runAnswer = z.object({ run: z.object({ id: z.string(), status: z.enum(['queued', 'running', 'done', 'failed']), progress: z.number() }).passthrough() });

export function useSplitInput(productionId: string) {
  return useQuery({
    queryKey: splitKeys.input(productionId),
    queryFn: async () => parseResponse(inputAnswer, await api.get(splitPath(productionId, '/input')), 'the breakdown for the advisor').input as unknown as SplitInputView,
  });
}

function limitsSearch(q: Partial<SplitLimitsQuery>): string {
  const p = new URLSearchParams();
  for (const [k, v] of Object.entries(q)) if (v !== undefined && v !== null && v !== '') p.set(k, String(v));
  const s = p.toString();
  return s ? `?${s}` : '';
}

export function useSplitLimits(productionId: string, q: Partial<SplitLimitsQuery>) {
  return useQuery({
    queryKey: splitKeys.limits(productionId, q),
    queryFn: async () => parseResponse(limitsAnswer, await api.get(splitPath(productionId, `/limits${limitsSearch(q)}`)), 'the advisor limits').limits as unknown as SplitLimitsView,
  });
}

export function useStartSplitRun(productionId: string) {
  return useMutation({
    mutationFn: async (body: Partial<SplitLimitsQuery> & { seed?: number; timeLimitMs?: number }) =>
      parseResponse(runAnswer, await api.post(splitPath(productionId, '/runs'), body), 'the advisor run').run as unknown as SplitRunView,
  });
}

/** Polls a run until it is done or failed. */
export function useSplitRun(productionId: string, runId: string | null) {
  return useQuery({
    queryKey: splitKeys.run(productionId, runId ?? ''),
    enabled: Boolean(runId),
    queryFn: async () => parseResponse(runAnswer, await api.get(splitPath(productionId, `/runs/${runId}`)), 'the advisor run').run as unknown as SplitRunView,
    refetchInterval: (q) => (q.state.data && (q.state.data.status === 'done' || q.state.data.status === 'failed') ? false : 400),
  });
}

export function useAdoptSplit(productionId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: AdoptSplitBody) => api.post(splitPath(productionId, '/adopt'), body) as Promise<{ adopted: { machineVersion: number; sections: { id: string; code: string; created: boolean }[]; emptied: string[] } }>,
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: splitKeys.all(productionId) });
      void qc.invalidateQueries({ queryKey: ['machine', productionId] });
    },
  });
}
