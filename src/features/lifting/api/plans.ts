import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { LiftPlanFields, LiftPlanSummary, LiftPlanView } from '@domain/contracts/lifting-api.ts';
import { api, ApiError, seg } from '../../../lib/api.ts';
import { liftingBase, liftingKeys } from './keys.ts';

/** `GET …/lifting/plans` → every plan the person may see, with today's verdict. */
export async function getPlans(productionId: string): Promise<LiftPlanSummary[]> {
  const res = await api.get<{ plans: LiftPlanSummary[] }>(`${liftingBase(productionId)}/plans`);
  return res?.plans ?? [];
}

export function plansQuery(productionId: string) {
  return queryOptions({ queryKey: liftingKeys.plans(productionId), queryFn: () => getPlans(productionId) });
}
export const usePlans = (productionId: string) => useQuery(plansQuery(productionId));

/** `GET …/lifting/plans/:planId` → the plan, re-evaluated by the server on today's data. */
export async function getPlan(productionId: string, planId: string): Promise<LiftPlanView> {
  const res = await api.get<{ plan: LiftPlanView }>(`${liftingBase(productionId)}/plans/${seg(planId)}`);
  return res.plan;
}

export function planQuery(productionId: string, planId: string) {
  return queryOptions({ queryKey: liftingKeys.plan(productionId, planId), queryFn: () => getPlan(productionId, planId) });
}
export const usePlan = (productionId: string, planId: string) => useQuery(planQuery(productionId, planId));

export const planPdfUrl = (productionId: string, planId: string) => `/api${liftingBase(productionId)}/plans/${seg(planId)}/pdf`;

/** The plan as it is now on the server, when a save or decision was refused as stale; else null. */
export function planConflict(error: unknown): LiftPlanView | null {
  if (!(error instanceof ApiError) || error.status !== 409) return null;
  const c = error.current as LiftPlanView | undefined;
  return c && typeof c === 'object' && 'id' in c ? c : null;
}

function useSetPlan(productionId: string) {
  const qc = useQueryClient();
  return (plan: LiftPlanView) => {
    qc.setQueryData(liftingKeys.plan(productionId, plan.id), plan);
    void qc.invalidateQueries({ queryKey: liftingKeys.plans(productionId) });
  };
}

/** Creates (no id) or saves a plan's inputs; the server evaluates and answers with the plan. */
export function useSavePlan(productionId: string) {
  const setPlan = useSetPlan(productionId);
  return useMutation({
    mutationFn: async (v: { id?: string; version?: number; inputs: LiftPlanFields }) => {
      const res = v.id
        ? await api.patch<{ plan: LiftPlanView }>(`${liftingBase(productionId)}/plans/${seg(v.id)}`, { version: v.version, inputs: v.inputs })
        : await api.post<{ plan: LiftPlanView }>(`${liftingBase(productionId)}/plans`, { inputs: v.inputs });
      return res.plan;
    },
    onSuccess: setPlan,
  });
}

export type PlanAction = 'submit' | 'approve' | 'reject';

/** Submit, approve or reject (with a comment); 409 when the plan or its figures moved. */
export function usePlanAction(productionId: string, planId: string) {
  const setPlan = useSetPlan(productionId);
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (v: { action: PlanAction; version: number; comment?: string }) =>
      (await api.post<{ plan: LiftPlanView }>(`${liftingBase(productionId)}/plans/${seg(planId)}/${v.action}`, { version: v.version, comment: v.comment })).plan,
    onSuccess: setPlan,
    onError: (error) => {
      const current = planConflict(error);
      if (current) void qc.invalidateQueries({ queryKey: liftingKeys.plan(productionId, planId) });
    },
  });
}

export function useDeletePlan(productionId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (planId: string) => api.delete(`${liftingBase(productionId)}/plans/${seg(planId)}`),
    onSettled: () => qc.invalidateQueries({ queryKey: liftingKeys.plans(productionId) }),
  });
}
