import type { Knex } from 'knex';
import { gearItem, type GearItem } from '../../../src/domain/contracts/lifting.ts';
import type { GearInput, GearView, HangingPointView, LiftingSettingsView, PlanEventView } from '../../../src/domain/contracts/lifting-api.ts';
import { DEFAULT_DYNAMIC_FACTOR, DEFAULT_HOIST_RULE_SET } from '../../../src/domain/lifting/index.ts';

/** Rows of the lifting tables and their mapping to the API's views. Only this file names columns. */

export interface SettingsRow {
  production_id: string;
  handling_method: 'niosh' | 'uk-guideline';
  guideline_column: 'men' | 'women';
  handling_threshold_kg: number;
  max_team_size: number;
  dynamic_factor: number;
  dynamic_factor_source: string;
  hoist_rule_set: string;
  exclusion_margin_mm: number;
  version: number;
  updated_at: Date;
}

export interface GearRow {
  id: string;
  production_id: string;
  kind: GearItem['kind'];
  identifier: string;
  description: string | null;
  next_inspection_date: string;
  spec: Record<string, unknown>;
  version: number;
  updated_at: Date;
}

export interface HangingPointRow {
  id: string;
  production_id: string;
  venue_id: string;
  label: string;
  rating_kg: number | null;
  notes: string;
  version: number;
}

export interface PlanRow {
  id: string;
  production_id: string;
  section_id: string | null;
  venue_id: string | null;
  title: string;
  status: 'draft' | 'submitted' | 'approved' | 'rejected';
  inputs: unknown;
  evaluated_input: unknown;
  result: unknown;
  verdict: 'ok' | 'over capacity' | 'no verdict';
  fingerprint: string;
  author_id: string | null;
  submitted_at: Date | null;
  reviewer_id: string | null;
  reviewed_at: Date | null;
  review_comment: string;
  approved_fingerprint: string | null;
  version: number;
  created_at: Date;
  updated_at: Date;
}

export interface HandlingTaskRow {
  id: string;
  production_id: string;
  item_kind: 'section' | 'loose-part' | 'crate';
  item_id: string;
  task: unknown;
  version: number;
}

export const toSettingsView = (r: SettingsRow): LiftingSettingsView => ({
  handlingMethod: r.handling_method,
  guidelineColumn: r.guideline_column,
  handlingThresholdKg: r.handling_threshold_kg,
  maxTeamSize: r.max_team_size,
  dynamicFactor: r.dynamic_factor,
  dynamicFactorSource: r.dynamic_factor_source,
  hoistRuleSet: r.hoist_rule_set,
  exclusionMarginMm: r.exclusion_margin_mm,
  version: r.version,
  updatedAt: r.updated_at ? new Date(r.updated_at).toISOString() : null,
});

/** The production's lifting settings, created with the defaults on first use. */
export async function ensureSettings(db: Knex, productionId: string): Promise<SettingsRow> {
  const found = await db<SettingsRow>('lifting_settings').where({ production_id: productionId }).first();
  if (found) return found;
  await db('lifting_settings')
    .insert({
      production_id: productionId,
      dynamic_factor: DEFAULT_DYNAMIC_FACTOR.value,
      dynamic_factor_source: DEFAULT_DYNAMIC_FACTOR.source,
      hoist_rule_set: DEFAULT_HOIST_RULE_SET,
    })
    .onConflict('production_id')
    .ignore();
  return (await db<SettingsRow>('lifting_settings').where({ production_id: productionId }).first())!;
}

/** A stored gear row as the core's item. */
export function toGearItem(r: GearRow): GearItem {
  return gearItem.parse({
    ...r.spec,
    id: r.id,
    kind: r.kind,
    identifier: r.identifier,
    ...(r.description ? { description: r.description } : {}),
    nextInspectionDate: r.next_inspection_date,
  });
}

export const toGearView = (r: GearRow): GearView => ({ ...toGearItem(r), version: r.version, updatedAt: new Date(r.updated_at).toISOString() });

/** Columns of a gear row from a typed item. */
export function gearColumns(item: GearInput): Record<string, unknown> {
  const { kind, identifier, description, nextInspectionDate, ...spec } = item;
  return { kind, identifier, description: description ?? null, next_inspection_date: nextInspectionDate, spec: JSON.stringify(spec) };
}

export async function gearItems(db: Knex, productionId: string): Promise<GearItem[]> {
  const rows = await db<GearRow>('lifting_gear').where({ production_id: productionId }).orderBy(['kind', 'identifier']);
  return rows.map(toGearItem);
}

export const toHangingPointView = (r: HangingPointRow & { venue_name: string }): HangingPointView => ({
  id: r.id,
  venueId: r.venue_id,
  venueName: r.venue_name,
  label: r.label,
  ratingKg: r.rating_kg,
  notes: r.notes,
  version: r.version,
});

export function hangingPointsQuery(db: Knex, productionId: string) {
  return db('hanging_points as h')
    .join('venues as v', 'v.id', 'h.venue_id')
    .where('h.production_id', productionId)
    .orderBy([{ column: 'v.name' }, { column: 'h.label' }])
    .select<(HangingPointRow & { venue_name: string })[]>('h.*', 'v.name as venue_name');
}

export async function planEvents(db: Knex, planId: string): Promise<PlanEventView[]> {
  const rows = await db('lift_plan_events as e')
    .leftJoin('users as u', 'u.id', 'e.actor_id')
    .where('e.plan_id', planId)
    .orderBy([{ column: 'e.created_at' }, { column: 'e.id' }])
    .select('e.id', 'e.kind', 'e.comment', 'e.verdict', 'e.created_at', 'u.name as actor_name');
  return rows.map((r) => ({
    id: r.id,
    kind: r.kind,
    actorName: r.actor_name ?? null,
    comment: r.comment,
    verdict: r.verdict ?? null,
    createdAt: new Date(r.created_at).toISOString(),
  }));
}

export async function addEvent(
  db: Knex,
  plan: Pick<PlanRow, 'id' | 'production_id'>,
  kind: PlanEventView['kind'],
  actorId: string | null,
  extra: { comment?: string; verdict?: string | null; fingerprint?: string | null } = {},
): Promise<void> {
  await db('lift_plan_events').insert({
    production_id: plan.production_id,
    plan_id: plan.id,
    kind,
    actor_id: actorId,
    comment: extra.comment ?? '',
    verdict: extra.verdict ?? null,
    fingerprint: extra.fingerprint ?? null,
  });
}

/** Names of users by id, for views. */
export async function userNames(db: Knex, ids: (string | null)[]): Promise<Map<string, string>> {
  const wanted = [...new Set(ids.filter((x): x is string => Boolean(x)))];
  if (wanted.length === 0) return new Map();
  const rows = await db('users').whereIn('id', wanted).select('id', 'name');
  return new Map(rows.map((r) => [r.id as string, r.name as string]));
}
