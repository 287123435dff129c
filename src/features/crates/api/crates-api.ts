import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { crateView, type CrateView, type CreateCrateBody, type UpdateCrateBody } from '@domain/contracts/crate-loads.ts';
import { stockItem } from '@domain/contracts/crates.ts';
import { api, isApiError } from '../../../lib/api.ts';
import { parseResponse } from '../../../lib/parse.ts';

/** Query keys: everything under ['crates', productionId], so one invalidation refreshes it all. */
export const crateKeys = {
  all: (productionId: string) => ['crates', productionId] as const,
  list: (productionId: string) => ['crates', productionId, 'list'] as const,
  one: (productionId: string, crateId: string) => ['crates', productionId, 'one', crateId] as const,
  stock: (productionId: string) => ['crates', productionId, 'stock'] as const,
  sections: (productionId: string) => ['crates', productionId, 'sections'] as const,
};

export function cratesPath(productionId: string, path = ''): string {
  return `/productions/${encodeURIComponent(productionId)}/crates${path}`;
}

const crateList = z.object({ crates: z.array(crateView) });
const crateOne = z.object({ crate: crateView });
const stockList = z.object({ items: z.array(stockItem) });
const sectionsList = z.object({ sections: z.array(z.object({ id: z.string(), code: z.string(), name: z.string() })) });

export function useCrates(productionId: string) {
  return useQuery({
    queryKey: crateKeys.list(productionId),
    queryFn: async () => parseResponse(crateList, await api.get(cratesPath(productionId)), 'the crates').crates,
  });
}

export function useCrate(productionId: string, crateId: string) {
  return useQuery({
    queryKey: crateKeys.one(productionId, crateId),
    queryFn: async () => parseResponse(crateOne, await api.get(cratesPath(productionId, `/${encodeURIComponent(crateId)}`)), 'the crate').crate,
  });
}

export function useStockCatalogue(productionId: string) {
  return useQuery({
    queryKey: crateKeys.stock(productionId),
    queryFn: async () => parseResponse(stockList, await api.get(cratesPath(productionId, '/stock-catalogue')), 'the stock catalogue').items,
    staleTime: Infinity,
  });
}

/** The machine's sections (code and name), to design a crate around one. */
export function useSections(productionId: string) {
  return useQuery({
    queryKey: crateKeys.sections(productionId),
    queryFn: async () => parseResponse(sectionsList, await api.get(`/productions/${encodeURIComponent(productionId)}/machine`), 'the sections').sections,
    staleTime: 60_000,
  });
}

/** After a save: the crate as the server answered it goes into the cache, and the list is refreshed. */
function useSaved(productionId: string) {
  const qc = useQueryClient();
  return (crate: CrateView) => {
    qc.setQueryData(crateKeys.one(productionId, crate.id), crate);
    void qc.invalidateQueries({ queryKey: crateKeys.list(productionId) });
  };
}

export function useCreateCrate(productionId: string) {
  const saved = useSaved(productionId);
  return useMutation({
    mutationFn: async (body: CreateCrateBody) => parseResponse(crateOne, await api.post(cratesPath(productionId), body), 'the new crate').crate,
    onSuccess: saved,
  });
}

export function useUpdateCrate(productionId: string, crateId: string) {
  const saved = useSaved(productionId);
  return useMutation({
    mutationFn: async (body: UpdateCrateBody) => parseResponse(crateOne, await api.patch(cratesPath(productionId, `/${encodeURIComponent(crateId)}`), body), 'the crate').crate,
    onSuccess: saved,
  });
}

export function useDeleteCrate(productionId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (crateId: string) => api.delete(cratesPath(productionId, `/${encodeURIComponent(crateId)}`)),
    onSuccess: () => qc.invalidateQueries({ queryKey: crateKeys.all(productionId) }),
  });
}

export interface ContentInput {
  description: string;
  quantity: number;
  massKg: number | null;
  cogMm: [number, number, number] | null;
}

export function useAddContent(productionId: string, crateId: string) {
  const saved = useSaved(productionId);
  return useMutation({
    mutationFn: async (body: ContentInput) => parseResponse(crateOne, await api.post(cratesPath(productionId, `/${encodeURIComponent(crateId)}/contents`), body), 'the crate').crate,
    onSuccess: saved,
  });
}

export function useUpdateContent(productionId: string, crateId: string) {
  const saved = useSaved(productionId);
  return useMutation({
    mutationFn: async ({ id, ...body }: Partial<ContentInput> & { id: string; version: number }) =>
      parseResponse(crateOne, await api.patch(cratesPath(productionId, `/${encodeURIComponent(crateId)}/contents/${encodeURIComponent(id)}`), body), 'the crate').crate,
    onSuccess: saved,
  });
}

export function useDeleteContent(productionId: string, crateId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (contentId: string) => api.delete(cratesPath(productionId, `/${encodeURIComponent(crateId)}/contents/${encodeURIComponent(contentId)}`)),
    onSuccess: () => qc.invalidateQueries({ queryKey: crateKeys.all(productionId) }),
  });
}

/** On a 409, the crate as it is now on the server. */
export function conflictCrate(error: unknown): CrateView | null {
  if (!isApiError(error, 'conflict')) return null;
  const parsed = crateView.safeParse(error.current);
  return parsed.success ? parsed.data : null;
}
