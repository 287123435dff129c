import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { crateView, packingRunView, vehicleView, type CreatePackingRunBody, type PackingRunView, type PlacementView } from '@domain/contracts/crate-loads.ts';
import { vehicle } from '@domain/contracts/vehicles.ts';
import { api } from '../../../lib/api.ts';
import { parseResponse } from '../../../lib/parse.ts';

export const loadKeys = {
  all: (productionId: string) => ['loads', productionId] as const,
  vehicles: (productionId: string) => ['loads', productionId, 'vehicles'] as const,
  catalogue: (productionId: string) => ['loads', productionId, 'catalogue'] as const,
  runs: (productionId: string) => ['loads', productionId, 'runs'] as const,
  run: (productionId: string, runId: string) => ['loads', productionId, 'run', runId] as const,
  crates: (productionId: string) => ['loads', productionId, 'crates'] as const,
};

export function loadsPath(productionId: string, path = ''): string {
  return `/productions/${encodeURIComponent(productionId)}/loads${path}`;
}

export function useVehicles(productionId: string) {
  return useQuery({
    queryKey: loadKeys.vehicles(productionId),
    queryFn: async () => parseResponse(z.object({ vehicles: z.array(vehicleView) }), await api.get(loadsPath(productionId, '/vehicles')), 'the vehicles').vehicles,
  });
}

export function useVehicleCatalogue(productionId: string) {
  return useQuery({
    queryKey: loadKeys.catalogue(productionId),
    queryFn: async () => parseResponse(z.object({ vehicles: z.array(vehicle) }), await api.get(loadsPath(productionId, '/vehicle-catalogue')), 'the vehicle catalogue').vehicles,
    staleTime: Infinity,
  });
}

export function useAddVehicle(productionId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: { code: string; catalogueId: string }) => api.post(loadsPath(productionId, '/vehicles'), body),
    onSuccess: () => qc.invalidateQueries({ queryKey: loadKeys.vehicles(productionId) }),
  });
}

/** The crates to choose from for a run (code, mass known or not). */
export function useCrateChoices(productionId: string) {
  return useQuery({
    queryKey: loadKeys.crates(productionId),
    queryFn: async () => parseResponse(z.object({ crates: z.array(crateView) }), await api.get(`/productions/${encodeURIComponent(productionId)}/crates`), 'the crates').crates,
  });
}

export function useRuns(productionId: string) {
  return useQuery({
    queryKey: loadKeys.runs(productionId),
    queryFn: async () => parseResponse(z.object({ runs: z.array(packingRunView) }), await api.get(loadsPath(productionId, '/runs')), 'the packing runs').runs,
  });
}

const isActive = (r: PackingRunView | undefined) => r?.status === 'queued' || r?.status === 'running';

/** One run; polled twice a second while it is queued or packing, so its progress shows. */
export function useRun(productionId: string, runId: string) {
  return useQuery({
    queryKey: loadKeys.run(productionId, runId),
    queryFn: async () => parseResponse(z.object({ run: packingRunView }), await api.get(loadsPath(productionId, `/runs/${encodeURIComponent(runId)}`)), 'the packing run').run,
    refetchInterval: (q) => (isActive(q.state.data) ? 500 : false),
  });
}

export function useStartRun(productionId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (body: CreatePackingRunBody) => parseResponse(z.object({ run: packingRunView }), await api.post(loadsPath(productionId, '/runs'), body), 'the new run').run,
    onSuccess: () => qc.invalidateQueries({ queryKey: loadKeys.runs(productionId) }),
  });
}

export function useSavePlacements(productionId: string, runId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (body: { version: number; vehicleId: string; placements: Omit<PlacementView, 'vehicleId'>[] }) =>
      parseResponse(z.object({ run: packingRunView }), await api.patch(loadsPath(productionId, `/runs/${encodeURIComponent(runId)}/placements`), body), 'the packing run').run,
    onSuccess: (run) => qc.setQueryData(loadKeys.run(productionId, runId), run),
  });
}
