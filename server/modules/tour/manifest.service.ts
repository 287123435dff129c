import type { Knex } from 'knex';
import Papa from 'papaparse';
import type { ManifestCrate, ManifestData } from '../../../src/domain/contracts/tour.ts';
import { matrixInputs, runMatrix } from './access.service.ts';
import { cacheFor, revisionFingerprint, type FingerprintCache } from '../../db/revision-cache.ts';
import { findEngagement, loadCrates, loadLegs, toEngagementView, type EngagementRow, type VenueRow } from './tour.repository.ts';

export type { ManifestCrate, ManifestData };

const manifestCaches = new WeakMap<Knex, FingerprintCache<Omit<ManifestData, 'generatedAt'>>>();

/**
 * `found`: the engagement's row when the caller has already read it (the route checks its venue scope first).
 * A manifest is kept per engagement while the production's tour data is unchanged (server/db/revision-cache.ts):
 * reading it took a dozen queries and the access check of every crate, 12–14 ms of CPU per request in the
 * load benchmark, while venue staff, planners and riggers read the same one again and again.
 */
export async function buildManifest(db: Knex, productionId: string, engagementId: string, found?: EngagementRow): Promise<ManifestData> {
  const fingerprint = await revisionFingerprint(db, productionId, 'tour');
  const data = await cacheFor(manifestCaches, db, 64).get(`${productionId} ${engagementId}`, fingerprint, () => computeManifest(db, productionId, engagementId, found));
  return { generatedAt: new Date().toISOString(), ...data };
}

/** The legs and crates read here are handed to the access check rather than read a second time. */
async function computeManifest(db: Knex, productionId: string, engagementId: string, found?: EngagementRow): Promise<Omit<ManifestData, 'generatedAt'>> {
  const engagementRow = found && found.id === engagementId ? found : await findEngagement(db, productionId, engagementId);
  const engagement = toEngagementView(engagementRow);
  const [production, venue, legs, crates, hangingRows] = await Promise.all([
    db('productions').where({ id: productionId }).first(),
    db<VenueRow>('venues').where({ id: engagement.venueId }).first() as Promise<VenueRow>,
    loadLegs(db, productionId),
    loadCrates(db, productionId),
    db('hanging_points').where({ venue_id: engagement.venueId }).orderBy('label'),
  ]);
  const inputs = await matrixInputs(db, productionId, { sections: false, engagementIds: [engagementId], crates, legs });
  const leg = legs.find((l) => l.toEngagementId === engagementId) ?? null;
  const notes: string[] = [];
  if (!leg) notes.push('No leg delivers to this engagement yet: no crates are listed.');
  const onLeg = new Map((leg?.crates ?? []).map((c, i) => [c.crateId, { order: i + 1, vehicleId: c.vehicleId }]));
  const legCrates = crates.filter((c) => onLeg.has(c.id)).sort((a, b) => onLeg.get(a.id)!.order - onLeg.get(b.id)!.order);
  const view = runMatrix({ rows: inputs.rows.filter((r) => onLeg.has(r.id)), columns: inputs.columns });
  const cellOf = new Map(view.cells.map((c) => [c.rowId, c]));
  let fromVenueName: string | null = null;
  if (leg?.fromEngagementId) {
    const from = await db('engagements as e').join('venues as v', 'v.id', 'e.venue_id').where('e.id', leg.fromEngagementId).first('v.name');
    fromVenueName = from?.name ?? null;
  }

  const manifestCrates: ManifestCrate[] = legCrates.map((c) => {
    const cell = cellOf.get(c.id);
    const vehicleId = onLeg.get(c.id)!.vehicleId;
    return {
      loadOrder: onLeg.get(c.id)!.order,
      crateId: c.id,
      code: c.code,
      name: c.name,
      lengthMm: c.lengthMm,
      widthMm: c.widthMm,
      heightMm: c.heightMm,
      tareKg: c.tareKg,
      netKg: c.grossKg === null ? null : c.grossKg - c.tareKg,
      grossKg: c.grossKg,
      mayTilt: c.mayTilt,
      vehicleName: (vehicleId && leg?.vehicles.find((v) => v.id === vehicleId)?.name) || null,
      access: { verdict: cell?.verdict ?? 'unknown', tightestText: cell?.tightestText ?? null, findings: cell?.findings ?? [] },
    };
  });
  const known = manifestCrates.filter((c) => c.grossKg !== null);
  const knownGrossKg = known.reduce((s, c) => s + (c.grossKg ?? 0), 0);
  return {
    production: { id: production.id, name: production.name, machineName: production.machine_name, paperSize: production.paper_size },
    units: venue.paperwork_units ?? production.default_units,
    engagement,
    venue: { id: venue.id, name: venue.name, city: venue.city, country: venue.country, address: venue.address, contacts: venue.contacts ?? [] },
    leg: leg ? { id: leg.id, departsOn: leg.departsOn, fromVenueName, vehicles: leg.vehicles } : null,
    crates: manifestCrates,
    totals: {
      crateCount: manifestCrates.length,
      grossKg: known.length === manifestCrates.length ? knownGrossKg : null,
      knownGrossKg,
      unknownMassCount: manifestCrates.length - known.length,
      tareKg: manifestCrates.reduce((s, c) => s + c.tareKg, 0),
      volumeM3: manifestCrates.reduce((s, c) => s + (c.lengthMm * c.widthMm * c.heightMm) / 1e9, 0),
    },
    access: {
      verdict: view.cells.length ? view.verdict : 'unknown',
      pass: view.counts.pass,
      fail: view.counts.fail,
      unknown: view.counts.unknown,
    },
    hangingPoints: hangingRows.map((r: { id: string; label: string; rating_kg: number | null; notes: string }) => ({
      id: r.id,
      label: r.label,
      ratingKg: r.rating_kg === null ? null : Number(r.rating_kg),
      notes: r.notes,
    })),
    liftPlans: [],
    notes,
  };
}

// ---------------------------------------------------------------------------------- changes since

/** What a sent manifest said, kept with the delivery log to tell the next one what changed. */
export interface ManifestSnapshot {
  venueName: string;
  loadInOn: string;
  showFirstOn: string;
  showLastOn: string;
  loadOutOn: string;
  vehicles: string[];
  crates: { code: string; grossKg: number | null; sizeMm: [number, number, number]; verdict: string; loadOrder: number }[];
}

export function snapshotOf(m: ManifestData): ManifestSnapshot {
  return {
    venueName: m.venue.name,
    loadInOn: m.engagement.loadInOn,
    showFirstOn: m.engagement.showFirstOn,
    showLastOn: m.engagement.showLastOn,
    loadOutOn: m.engagement.loadOutOn,
    vehicles: m.leg?.vehicles.map((v) => v.name) ?? [],
    crates: m.crates.map((c) => ({ code: c.code, grossKg: c.grossKg, sizeMm: [c.lengthMm, c.widthMm, c.heightMm], verdict: c.access.verdict, loadOrder: c.loadOrder })),
  };
}

const kg = (v: number | null) => (v === null ? 'unknown' : `${Math.round(v)} kg`);
const size = (s: [number, number, number]) => s.map((v) => Math.round(v)).join(' × ') + ' mm';

/** Lines saying what changed between two manifests, in words for the venue (empty when nothing did). */
export function manifestChanges(before: ManifestSnapshot, after: ManifestSnapshot): string[] {
  const out: string[] = [];
  const dates: [keyof ManifestSnapshot, string][] = [
    ['loadInOn', 'Load-in'],
    ['showFirstOn', 'First show'],
    ['showLastOn', 'Last show'],
    ['loadOutOn', 'Load-out'],
  ];
  for (const [k, label] of dates) if (before[k] !== after[k]) out.push(`${label} moved from ${String(before[k])} to ${String(after[k])}.`);
  if (before.vehicles.join('|') !== after.vehicles.join('|')) out.push(`Vehicles now: ${after.vehicles.join(', ') || 'none'} (were: ${before.vehicles.join(', ') || 'none'}).`);
  const old = new Map(before.crates.map((c) => [c.code, c]));
  const now = new Map(after.crates.map((c) => [c.code, c]));
  for (const c of after.crates) {
    const o = old.get(c.code);
    if (!o) {
      out.push(`Crate ${c.code} added (${size(c.sizeMm)}, ${kg(c.grossKg)}).`);
      continue;
    }
    if (o.grossKg !== c.grossKg && !(o.grossKg !== null && c.grossKg !== null && Math.abs(o.grossKg - c.grossKg) < 0.5)) out.push(`Crate ${c.code}: gross ${kg(o.grossKg)} → ${kg(c.grossKg)}.`);
    if (o.sizeMm.some((v, i) => Math.abs(v - c.sizeMm[i]) >= 0.5)) out.push(`Crate ${c.code}: size ${size(o.sizeMm)} → ${size(c.sizeMm)}.`);
    if (o.verdict !== c.verdict) out.push(`Crate ${c.code}: access check ${o.verdict} → ${c.verdict}.`);
  }
  for (const c of before.crates) if (!now.has(c.code)) out.push(`Crate ${c.code} removed.`);
  const orderBefore = before.crates.filter((c) => now.has(c.code)).map((c) => c.code);
  const orderAfter = after.crates.filter((c) => old.has(c.code)).map((c) => c.code);
  if (orderBefore.join('|') !== orderAfter.join('|')) out.push('The unloading order changed.');
  return out;
}

// --------------------------------------------------------------------------------------- exports

/**
 * A text cell a spreadsheet will not run as a formula: cells starting with = + - @ or a control character
 * get a leading apostrophe (OWASP "CSV injection" advice). Numbers are written as numbers.
 */
export function safeCell(v: string | number | null | boolean): string | number {
  if (v === null) return '';
  if (typeof v === 'number') return Number.isFinite(v) ? Math.round(v * 1000) / 1000 : '';
  if (typeof v === 'boolean') return v ? 'yes' : 'no';
  return /^[=+\-@\t\r]/.test(v) ? `'${v}` : v;
}

export function manifestCsv(m: ManifestData): string {
  const rows = m.crates.map((c) => [
    c.loadOrder,
    c.code,
    c.name,
    c.lengthMm,
    c.widthMm,
    c.heightMm,
    c.tareKg,
    c.netKg,
    c.grossKg,
    c.mayTilt,
    c.vehicleName ?? '',
    c.access.verdict,
    c.access.tightestText ?? '',
    c.access.findings.filter((f) => f.verdict !== 'pass').map((f) => f.reason).join(' | '),
  ]);
  return Papa.unparse({
    fields: ['load order', 'crate', 'name', 'length mm', 'width mm', 'height mm', 'tare kg', 'net kg', 'gross kg', 'may tilt', 'vehicle', 'access', 'tightest point', 'failures and unknowns'],
    data: rows.map((r) => r.map((v) => safeCell(v as string | number | null | boolean))),
  });
}

/** The manifest as the plain text of an e-mail. */
export function manifestText(m: ManifestData, opts: { link: string; changes: string[] | null; message: string }): string {
  const lines: string[] = [];
  lines.push(`Manifest for ${m.venue.name}, ${m.venue.city}`);
  lines.push(`${m.production.name}`);
  lines.push('');
  if (opts.message) lines.push(opts.message, '');
  if (opts.changes) {
    lines.push(opts.changes.length ? 'What changed since the last manifest we sent:' : 'Nothing has changed since the last manifest we sent.');
    for (const c of opts.changes) lines.push(`  - ${c}`);
    lines.push('');
  }
  const e = m.engagement;
  lines.push(`Load-in ${e.loadInOn}; shows ${e.showFirstOn} to ${e.showLastOn}; load-out ${e.loadOutOn}.`);
  if (m.leg) lines.push(`Arriving from ${m.leg.fromVenueName ?? 'the workshop'}${m.leg.departsOn ? `, leaving ${m.leg.departsOn}` : ''}; vehicles: ${m.leg.vehicles.map((v) => v.name).join(', ') || 'not decided'}.`);
  lines.push('');
  lines.push(`${m.totals.crateCount} crates, ${m.totals.grossKg === null ? `at least ${Math.round(m.totals.knownGrossKg)} kg (${m.totals.unknownMassCount} not yet weighed)` : `${Math.round(m.totals.grossKg)} kg`} gross, ${m.totals.volumeM3.toFixed(1)} m³.`);
  lines.push(`Access checks at your venue: ${m.access.pass} pass, ${m.access.fail} fail, ${m.access.unknown} not checked (data missing).`);
  lines.push('');
  lines.push('In unloading order:');
  for (const c of m.crates) {
    lines.push(`${String(c.loadOrder).padStart(3)}. ${c.code} ${c.name}: ${Math.round(c.lengthMm)} × ${Math.round(c.widthMm)} × ${Math.round(c.heightMm)} mm, ${kg(c.grossKg)}; access ${c.access.verdict}${c.access.tightestText ? ` (${c.access.tightestText})` : ''}`);
    for (const f of c.access.findings.filter((x) => x.verdict !== 'pass')) lines.push(`       ${f.verdict === 'fail' ? 'FAIL' : 'not checked'}: ${f.reason}`);
  }
  lines.push('');
  lines.push(`The full manifest, always up to date: ${opts.link}`);
  lines.push('The manifest is attached as a PDF, and the crate list as a spreadsheet (CSV).');
  return lines.join('\n');
}
