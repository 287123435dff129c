import { useGear } from '../api/gear.ts';
import { useHangingPoints, useLoads } from '../api/loads.ts';
import { useLiftingSettings } from '../api/settings.ts';
import type { PlanEditorContext } from './plan-editor.tsx';

/** Everything the plan form needs for its preview: loads, gear, settings and hanging points. */
export function useEditorContext(productionId: string): { ctx: PlanEditorContext | null; pending: boolean; error: unknown } {
  const loads = useLoads(productionId);
  const gear = useGear(productionId);
  const settings = useLiftingSettings(productionId);
  const points = useHangingPoints(productionId);
  const all = [loads, gear, settings, points];
  const error = all.find((q) => q.isError)?.error ?? null;
  if (loads.data && gear.data && settings.data && points.data) {
    return { ctx: { loads: loads.data, gear: gear.data, settings: settings.data, hangingPoints: points.data }, pending: false, error };
  }
  return { ctx: null, pending: !error, error };
}
