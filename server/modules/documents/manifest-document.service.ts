import type { Knex } from 'knex';
import { LIFTING_CAUTIONS } from '../../../src/domain/lifting/index.ts';
import { decide, type Actor } from '../../../src/domain/policy/index.ts';
import { forbidden } from '../../http/errors.ts';
import { renderVenueManifestPdf } from '../../pdf/venue-manifest.pdf.ts';
import { planEvaluator, refreshPlan } from '../lifting/lift-plans.service.ts';
import type { PlanRow } from '../lifting/lifting.repository.ts';
import { buildManifest, type ManifestData } from '../tour/manifest.service.ts';
import { findEngagement } from '../tour/tour.repository.ts';
import { documentContext, safeFilePart } from './document-context.ts';

/**
 * The venue manifest as a document: the tour module's manifest data (crates in load-in order with their
 * access-check results at this venue, totals, contacts), the lift plans that apply at the venue with
 * today's evaluation by the lifting core (refreshed as the lifting module refreshes them on every read),
 * the venue's hanging points and the cautions.
 */

export interface ManifestLiftPlan {
  id: string;
  title: string;
  status: PlanRow['status'];
  verdict: 'ok' | 'over capacity' | 'no verdict';
  sectionCode: string | null;
  liftDate: string | null;
  staticHookLoadKg: number | null;
  dynamicHookLoadKg: number | null;
  problems: string[];
}

export interface VenueManifestDocument {
  manifest: ManifestData;
  imperial: boolean;
  liftPlans: ManifestLiftPlan[];
  hangingPoints: { label: string; ratingKg: number | null; notes: string }[];
  /** Every caution of the lift plans, and the general lifting cautions, once each. */
  cautions: string[];
}

/**
 * The fine check after the route's role check: a venue user reads only their own venue's manifest. The
 * reason goes back as the policy gives it.
 */
export async function requireManifestAccess(db: Knex, actor: Actor, productionId: string, engagementId: string): Promise<void> {
  const engagement = await findEngagement(db, productionId, engagementId);
  const d = decide(actor, 'engagement.read', { productionId, venueId: engagement.venue_id });
  if (!d.allowed) throw forbidden(d.reason);
}

export async function venueManifestDocument(db: Knex, productionId: string, engagementId: string): Promise<VenueManifestDocument> {
  const manifest = await buildManifest(db, productionId, engagementId);
  const venueId = manifest.venue.id;
  const [planRows, points] = await Promise.all([
    db<PlanRow>('lift_plans').where({ production_id: productionId, venue_id: venueId }).orderBy('title') as Promise<PlanRow[]>,
    db('hanging_points').where({ production_id: productionId, venue_id: venueId }).orderBy('label').select('label', 'rating_kg', 'notes'),
  ]);
  const ev = planEvaluator(db, productionId);
  const liftPlans: ManifestLiftPlan[] = [];
  const cautions = new Set<string>(LIFTING_CAUTIONS);
  for (const row of planRows) {
    const { row: fresh, evaluation } = await refreshPlan(db, ev, row);
    const r = evaluation.result;
    for (const c of r.cautions) cautions.add(c);
    const fields = fresh.inputs as { liftDate?: string } | null;
    liftPlans.push({
      id: fresh.id,
      title: fresh.title,
      status: fresh.status,
      verdict: r.verdict,
      sectionCode: evaluation.load?.code ?? null,
      liftDate: fields?.liftDate ?? null,
      staticHookLoadKg: r.loads?.staticHookLoadKg ?? null,
      dynamicHookLoadKg: r.loads?.dynamicHookLoadKg ?? null,
      problems: r.problems,
    });
  }
  return {
    manifest,
    imperial: manifest.units === 'imperial',
    liftPlans,
    hangingPoints: points.map((p: { label: string; rating_kg: number | null; notes: string | null }) => ({ label: p.label, ratingKg: p.rating_kg === null ? null : Number(p.rating_kg), notes: p.notes ?? '' })),
    cautions: [...cautions],
  };
}

/**
 * The manifest PDF of an engagement, with its file name: for the download route and for the tour
 * module's "send manifest" (which attaches it). No access check here: callers check first.
 */
export async function venueManifestPdf(db: Knex, productionId: string, engagementId: string, opts: { userId: string | null }): Promise<{ pdf: Buffer; filename: string }> {
  const [doc, ctx] = await Promise.all([venueManifestDocument(db, productionId, engagementId), documentContext(db, productionId, opts.userId)]);
  const pdf = await renderVenueManifestPdf(doc, ctx);
  const m = doc.manifest;
  return { pdf, filename: `manifest-${safeFilePart(m.venue.name.toLowerCase(), 'venue')}-${m.engagement.loadInOn}.pdf` };
}
