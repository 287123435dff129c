import { useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { machineMassView, machineSummaryView, type MachineMassView, type MachineSummaryView } from '@domain/contracts/machine.ts';
import { massPropertiesInput, type MassPropertiesInput } from '@domain/contracts/mass.ts';
import { api } from '../../../lib/api.ts';
import { parseResponse } from '../../../lib/parse.ts';
import { machineKeys, machinePath } from './keys.ts';

/** `GET …/machine` → the machine, its sections, add-ons, materials and counts. */
export async function getMachine(productionId: string): Promise<MachineSummaryView> {
  return parseResponse(machineSummaryView, await api.get(machinePath(productionId)), 'the machine');
}

/** `GET …/machine/mass-properties` → the server's (authoritative) mass properties of every section and assembly. */
export async function getMachineMass(productionId: string): Promise<MachineMassView> {
  const res = await api.get<{ massProperties: unknown }>(machinePath(productionId, '/mass-properties'));
  return parseResponse(machineMassView, res?.massProperties, 'the mass properties');
}

const massInputResponse = z.object({ input: massPropertiesInput, sectionMargins: z.record(z.string(), z.number().nullable()) });
export type MassInputResponse = { input: MassPropertiesInput; sectionMargins: Record<string, number | null> };

/** `GET …/machine/mass-input` → the whole machine as the mass core takes it, for instant previews in the browser. */
export async function getMassInput(productionId: string): Promise<MassInputResponse> {
  return parseResponse(massInputResponse, await api.get(machinePath(productionId, '/mass-input')), 'the breakdown for preview');
}

export function useMachine(productionId: string) {
  return useQuery({ queryKey: machineKeys.summary(productionId), queryFn: () => getMachine(productionId) });
}
export function useMachineMass(productionId: string) {
  return useQuery({ queryKey: machineKeys.mass(productionId), queryFn: () => getMachineMass(productionId) });
}
export function useMassInput(productionId: string, enabled = true) {
  return useQuery({ queryKey: machineKeys.massInput(productionId), queryFn: () => getMassInput(productionId), enabled, staleTime: 60_000 });
}
