/**
 * Who may do what. One pure module: the server refuses with it, the client hides with it.
 *
 * Roles are held per production (planner, rigger, venue); admin is company-wide and covers
 * people and access, not the engineering data of productions the admin is not a member of.
 */

export const PRODUCTION_ROLES = ['planner', 'rigger', 'venue'] as const;
export type ProductionRole = (typeof PRODUCTION_ROLES)[number];

export interface Membership {
  productionId: string;
  role: ProductionRole;
  /** For the venue role: the venues whose engagements this person may see and work. */
  venueIds: string[];
}

export interface Actor {
  userId: string;
  isAdmin: boolean;
  memberships: Membership[];
}

/** Every action the product knows. Routes name exactly one each. */
export const ACTIONS = [
  // production-wide reading
  'production.read',
  'production.settings.edit',
  // machine breakdown (issue: breakdown and mass)
  'machine.read',
  'machine.edit',
  // lifting
  'gear.read',
  'gear.edit',
  'liftplan.read',
  'liftplan.edit',
  'liftplan.review',
  // crates and packing
  'crate.read',
  'crate.edit',
  // tour and venues
  'tour.read',
  'tour.edit',
  'venue.read',
  'venue.edit',
  'engagement.read',
  'engagement.checkin',
  'engagement.send',
  // company-wide
  'people.manage',
  'mail.read',
  /** Export a whole production as one archive file, and restore one into this instance. */
  'production.archive',
] as const;
export type Action = (typeof ACTIONS)[number];

/** What each production role may do, before scoping to venues. */
const ROLE_ACTIONS: Record<ProductionRole, ReadonlySet<Action>> = {
  planner: new Set<Action>([
    'production.read',
    'production.settings.edit',
    'machine.read',
    'machine.edit',
    'gear.read',
    'liftplan.read',
    'liftplan.edit',
    'crate.read',
    'crate.edit',
    'tour.read',
    'tour.edit',
    'venue.read',
    'venue.edit',
    'engagement.read',
    'engagement.checkin',
    'engagement.send',
  ]),
  rigger: new Set<Action>([
    'production.read',
    'machine.read',
    'gear.read',
    'gear.edit',
    'liftplan.read',
    'liftplan.edit',
    'liftplan.review',
    'crate.read',
    'tour.read',
    'venue.read',
    'engagement.read',
    'engagement.checkin',
  ]),
  // Venue staff see only what concerns their own venues.
  venue: new Set<Action>(['production.read', 'venue.read', 'venue.edit', 'engagement.read', 'engagement.checkin', 'liftplan.read']),
};

/** Actions that need no production: company-wide rights of admins. */
const ADMIN_ACTIONS: ReadonlySet<Action> = new Set<Action>(['people.manage', 'mail.read', 'production.archive']);

/** Company-wide actions are decided by the admin flag alone, whatever production they name. */
export function isCompanyAction(action: Action): boolean {
  return ADMIN_ACTIONS.has(action);
}

/** Actions whose subject is one venue, so a venue user is limited to their own venues. */
const VENUE_SCOPED: ReadonlySet<Action> = new Set<Action>(['venue.read', 'venue.edit', 'engagement.read', 'engagement.checkin', 'liftplan.read']);

export interface Subject {
  /** The production the thing belongs to. Absent only for company-wide actions. */
  productionId?: string;
  /** The venue the thing concerns, for venue-scoped actions. */
  venueId?: string | null;
  /** The author of the thing, where the rule forbids reviewing one's own work. */
  authorId?: string | null;
}

export interface Decision {
  allowed: boolean;
  reason: string;
}

export function membershipFor(actor: Actor, productionId: string): Membership | undefined {
  return actor.memberships.find((m) => m.productionId === productionId);
}

/** Decides, with a reason a person can read. */
export function decide(actor: Actor, action: Action, subject: Subject = {}): Decision {
  if (ADMIN_ACTIONS.has(action)) {
    return actor.isAdmin ? ok : no('Only an administrator may do this.');
  }
  if (!subject.productionId) return no('No production given.');
  const m = membershipFor(actor, subject.productionId);
  if (!m) return no('You are not a member of this production.');
  if (!ROLE_ACTIONS[m.role].has(action)) return no(`The ${m.role} role may not ${describe(action)}.`);
  if (m.role === 'venue' && VENUE_SCOPED.has(action)) {
    // A venue user works only on their own venues; a thing with no venue is not theirs.
    if (!subject.venueId || !m.venueIds.includes(subject.venueId)) return no('This belongs to another venue.');
  }
  if (action === 'liftplan.review' && subject.authorId && subject.authorId === actor.userId) {
    return no('A lift plan must be reviewed by a rigger who is not its author.');
  }
  return ok;
}

export function can(actor: Actor, action: Action, subject: Subject = {}): boolean {
  return decide(actor, action, subject).allowed;
}

/**
 * Whether the role could ever do the action in a production (ignoring venue scope and
 * authorship): for navigation and for hiding buttons.
 */
export function roleMay(role: ProductionRole | null, isAdmin: boolean, action: Action): boolean {
  if (ADMIN_ACTIONS.has(action)) return isAdmin;
  return role ? ROLE_ACTIONS[role].has(action) : false;
}

const ok: Decision = { allowed: true, reason: 'allowed' };
function no(reason: string): Decision {
  return { allowed: false, reason };
}
function describe(action: Action): string {
  const [thing, verb] = action.split('.');
  return `${verb ?? 'use'} ${thing}`;
}
