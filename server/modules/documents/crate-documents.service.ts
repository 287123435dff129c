import type { Knex } from 'knex';
import type { CrateView } from '../../../src/domain/contracts/crate-loads.ts';
import { invalid, notFound } from '../../http/errors.ts';
import type { HandlingMark } from '../../pdf/handling-marks.ts';
import { ensureLoadSettings, loadCrates, toCrateView, toLoadSettingsView } from '../crates/crates.repository.ts';
import { crateQrText } from '../tour/crate-qr.ts';
import { engagementsQuery, loadLegs, toEngagementView, type EngagementRow } from '../tour/tour.repository.ts';
import { handlingMarksFor } from './crate-marks.ts';
import type { DocumentContext } from './document-context.ts';

/**
 * Everything a packing list or a crate label shows, gathered once: the crate with its figures from the
 * cores (crates.repository's toCrateView: masses and CoG by combineMasses, tipping, the handling verdict
 * with its cautions), the handling marks that apply, the crate's next stop on the tour and the text of
 * its QR code. The PDF renderers only lay this out.
 */

export interface NextStop {
  engagementId: string;
  venueName: string;
  city: string;
  country: string;
  loadInOn: string;
  /** The venue prints its paperwork in imperial units. */
  imperial: boolean;
  /** The leg to it starts in another country (ISPM 15 applies to solid wood); null when the start is not known. */
  crossesBorder: boolean | null;
  fromCountry: string | null;
}

export interface CrateDocument {
  crate: CrateView;
  marks: HandlingMark[];
  nextStop: NextStop | null;
  /** Print imperial figures alongside the metric ones. */
  imperial: boolean;
  /** What the label's QR code holds (the crate's address at the production's public address). */
  qrText: string;
}

/** Where the CoG is measured from, in words, for every crate document. */
export const COG_CORNER_TEXT =
  'from corner A: the outer bottom corner (under the skids) at the left end of the front side, x along the length, y across, z up';

interface VenueLite {
  id: string;
  name: string;
  city: string;
  country: string;
  paperwork_units: 'metric' | 'imperial' | null;
}

/**
 * Each crate's next stop: the first engagement, not yet loaded out on `today`, that a leg carrying the
 * crate delivers to (by load-in date). Crates on no such leg have none.
 */
export async function nextStops(db: Knex, productionId: string, today: string): Promise<Map<string, NextStop>> {
  const [legs, engagementRows, venues] = await Promise.all([
    loadLegs(db, productionId),
    engagementsQuery(db, productionId) as Promise<EngagementRow[]>,
    db('venues').where({ production_id: productionId }).select('id', 'name', 'city', 'country', 'paperwork_units') as Promise<VenueLite[]>,
  ]);
  const engagements = new Map(engagementRows.map((r) => [r.id, toEngagementView(r)]));
  const venueById = new Map(venues.map((v) => [v.id, v]));
  const upcoming = legs
    .map((l) => ({ leg: l, to: engagements.get(l.toEngagementId) }))
    .filter((x): x is { leg: (typeof legs)[number]; to: NonNullable<typeof x.to> } => Boolean(x.to) && x.to!.loadOutOn >= today)
    .sort((a, b) => (a.to.loadInOn < b.to.loadInOn ? -1 : a.to.loadInOn > b.to.loadInOn ? 1 : 0));
  const out = new Map<string, NextStop>();
  for (const { leg, to } of upcoming) {
    const venue = venueById.get(to.venueId);
    const fromEngagement = leg.fromEngagementId ? engagements.get(leg.fromEngagementId) : undefined;
    const fromCountry = fromEngagement ? (venueById.get(fromEngagement.venueId)?.country ?? null) : null;
    const toCountry = venue?.country ?? '';
    const stop: NextStop = {
      engagementId: to.id,
      venueName: venue?.name ?? to.venueName,
      city: venue?.city ?? to.venueCity,
      country: toCountry,
      loadInOn: to.loadInOn,
      imperial: venue?.paperwork_units === 'imperial',
      crossesBorder: fromCountry && toCountry ? fromCountry.toUpperCase() !== toCountry.toUpperCase() : null,
      fromCountry,
    };
    for (const c of leg.crates) if (!out.has(c.crateId)) out.set(c.crateId, stop);
  }
  return out;
}

/**
 * The crates' documents, in code order; `ids` picks some (each must be a crate of the production: 404
 * naming the missing ones otherwise).
 */
export async function crateDocuments(db: Knex, ctx: DocumentContext, appUrl: string, ids?: readonly string[]): Promise<CrateDocument[]> {
  const settings = await ensureLoadSettings(db, ctx.productionId);
  const rows = await loadCrates(db, ctx.productionId, ids);
  if (ids) {
    const found = new Set(rows.map((r) => r.crate.id));
    const missing = ids.filter((id) => !found.has(id));
    if (missing.length) throw notFound(`Crate ${missing.slice(0, 3).join(', ')}${missing.length > 3 ? ` and ${missing.length - 3} more` : ''}`);
  }
  const stops = await nextStops(db, ctx.productionId, ctx.printedOn);
  const s = toLoadSettingsView(settings);
  return rows.map(({ crate, contents }) => {
    const view = toCrateView(crate, contents, s);
    const nextStop = stops.get(crate.id) ?? null;
    return {
      crate: view,
      marks: handlingMarksFor(view),
      nextStop,
      imperial: ctx.defaultUnits === 'imperial' || Boolean(nextStop?.imperial),
      qrText: crateQrText(appUrl, ctx.productionId, crate.id),
    };
  });
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Reads `ids=a,b,c` (comma-separated crate ids); undefined means every crate. 400 naming a bad id. */
export function parseCrateIds(raw: string | undefined): string[] | undefined {
  if (raw === undefined || raw.trim() === '') return undefined;
  const ids = [...new Set(raw.split(',').map((s) => s.trim()).filter(Boolean))];
  const bad = ids.findIndex((id) => !UUID.test(id));
  if (bad >= 0) throw invalid('Some query parameters are not valid.', [{ path: 'ids', message: `"${ids[bad].slice(0, 40)}" is not a crate id.` }]);
  if (ids.length > 500) throw invalid('Too many crates at once.', [{ path: 'ids', message: `At most 500 crates per file (got ${ids.length}).` }]);
  return ids.map((id) => id.toLowerCase());
}
