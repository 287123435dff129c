import { PRODUCTION_ROLES, type ProductionRole } from '@domain/policy/index.ts';

export { PRODUCTION_ROLES, type ProductionRole };

/** How each production role is named on screen. */
export const ROLE_LABEL: Record<ProductionRole, string> = { planner: 'Planner', rigger: 'Rigger', venue: 'Venue' };

/** One line on what each role does, for pickers and overviews. */
export const ROLE_SUMMARY: Record<ProductionRole, string> = {
  planner: 'Edits the machine, sections, crates and tour.',
  rigger: 'Owns gear and signs off lifts; reads the rest.',
  venue: 'Sees and checks in only the engagements of their venues.',
};
