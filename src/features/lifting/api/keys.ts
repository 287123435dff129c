/** Query keys of the lifting feature, in one place so no key is written twice. */
export const liftingKeys = {
  all: (productionId: string) => ['lifting', productionId] as const,
  settings: (productionId: string) => ['lifting', productionId, 'settings'] as const,
  gear: (productionId: string) => ['lifting', productionId, 'gear'] as const,
  loads: (productionId: string) => ['lifting', productionId, 'loads'] as const,
  hangingPoints: (productionId: string) => ['lifting', productionId, 'hanging-points'] as const,
  handling: (productionId: string) => ['lifting', productionId, 'handling'] as const,
  plans: (productionId: string) => ['lifting', productionId, 'plans'] as const,
  plan: (productionId: string, planId: string) => ['lifting', productionId, 'plans', planId] as const,
};

export const liftingBase = (productionId: string) => `/productions/${encodeURIComponent(productionId)}/lifting`;
