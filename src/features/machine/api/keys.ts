/** Query keys of the machine feature: everything under ['machine', productionId] so one invalidation refreshes it all. */
export const machineKeys = {
  all: (productionId: string) => ['machine', productionId] as const,
  summary: (productionId: string) => ['machine', productionId, 'summary'] as const,
  mass: (productionId: string) => ['machine', productionId, 'mass'] as const,
  massInput: (productionId: string) => ['machine', productionId, 'mass-input'] as const,
  breakdown: (productionId: string, filters: object) => ['machine', productionId, 'breakdown', filters] as const,
  weighings: (productionId: string, sectionId: string) => ['machine', productionId, 'weighings', sectionId] as const,
  scene: (productionId: string, sectionId: string) => ['machine', productionId, 'scene', sectionId] as const,
};

export function machinePath(productionId: string, path = ''): string {
  return `/productions/${encodeURIComponent(productionId)}/machine${path}`;
}
