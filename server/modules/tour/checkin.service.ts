import type { Knex } from 'knex';
import type { CheckStatusView, CheckSummary, ExpectedCrateView, ScanBody, ScanView } from '../../../src/domain/contracts/tour.ts';
import { AppError, invalid, notFound } from '../../http/errors.ts';
import { parseCrateQr } from './crate-qr.ts';
import { engagementsQuery, loadCrates, loadLegs, toEngagementView, type EngagementRow } from './tour.repository.ts';

/**
 * Check-in and check-out. A scan names its crate by id (ticked in a list) or by the text of the label's QR
 * code; a code from another production is refused with a message saying so. Each scan carries a key made
 * up by the client: the same key again is the same scan (stored once, answered with the first one).
 */
interface ScanRow {
  id: string;
  production_id: string;
  engagement_id: string;
  crate_id: string;
  crate_code?: string;
  direction: 'in' | 'out';
  state: 'arrived' | 'damaged' | 'missing';
  method: 'qr' | 'list';
  note: string;
  idempotency_key: string;
  scanned_by: string | null;
  scanned_by_name?: string | null;
  scanned_at: Date;
  received_at: Date;
}

function toScanView(r: ScanRow, photos: { id: string; filename: string; size_bytes: number }[]): ScanView {
  return {
    id: r.id,
    engagementId: r.engagement_id,
    crateId: r.crate_id,
    crateCode: r.crate_code ?? '',
    direction: r.direction,
    state: r.state,
    method: r.method,
    note: r.note,
    scannedBy: r.scanned_by,
    scannedByName: r.scanned_by_name ?? null,
    scannedAt: new Date(r.scanned_at).toISOString(),
    receivedAt: new Date(r.received_at).toISOString(),
    photos: photos.map((p) => ({ id: p.id, filename: p.filename, sizeBytes: p.size_bytes })),
  };
}

export function checkInService(db: Knex) {
  const scansQuery = () =>
    db('crate_scans as s')
      .join('crates as c', 'c.id', 's.crate_id')
      .leftJoin('users as u', 'u.id', 's.scanned_by')
      .select('s.*', 'c.code as crate_code', 'u.name as scanned_by_name');

  async function scanViews(rows: ScanRow[]): Promise<ScanView[]> {
    const ids = rows.map((r) => r.id);
    const photos = ids.length ? await db('crate_scan_photos').whereIn('scan_id', ids).orderBy('created_at').select('id', 'scan_id', 'filename', 'size_bytes') : [];
    return rows.map((r) => toScanView(r, photos.filter((p) => p.scan_id === r.id)));
  }

  /** The crate a scan names, checked to belong to this production. */
  async function crateOf(productionId: string, body: ScanBody): Promise<{ id: string; method: 'qr' | 'list' }> {
    let crateId = body.crateId;
    let method: 'qr' | 'list' = 'list';
    if (body.code !== undefined) {
      const parsed = parseCrateQr(body.code);
      if (!parsed) throw invalid('This QR code is not a Ballast crate label.', [{ path: 'code', message: `"${body.code.slice(0, 80)}" does not name a crate.` }], 'not_a_crate_label');
      if (parsed.productionId !== productionId) {
        throw invalid('This crate label belongs to another production: it cannot be checked in here. Set the crate aside and tell the planner.', [{ path: 'code', message: 'Label of another production.' }], 'other_production');
      }
      crateId = parsed.crateId;
      method = 'qr';
    }
    const crate = await db('crates').where({ id: crateId, production_id: productionId }).first('id');
    if (!crate) throw invalid('No crate with that id in this production.', [{ path: body.code !== undefined ? 'code' : 'crateId', message: `Unknown crate ${crateId}.` }], 'unknown_crate');
    return { id: crateId!, method };
  }

  return {
    /** Records a scan once per idempotency key; `created` is false when the key was seen before. */
    async record(productionId: string, engagementId: string, body: ScanBody, userId: string): Promise<{ scan: ScanView; created: boolean; expected: boolean }> {
      const crate = await crateOf(productionId, body);
      const inserted = await db('crate_scans')
        .insert({
          production_id: productionId,
          engagement_id: engagementId,
          crate_id: crate.id,
          direction: body.direction,
          state: body.state,
          method: crate.method,
          note: body.note,
          idempotency_key: body.idempotencyKey,
          scanned_by: userId,
          scanned_at: body.scannedAt ?? db.fn.now(),
        })
        .onConflict(['production_id', 'idempotency_key'])
        .ignore()
        .returning('id');
      const created = inserted.length > 0;
      const row = (await scansQuery().where({ 's.production_id': productionId, 's.idempotency_key': body.idempotencyKey }).first()) as ScanRow;
      if (!created && (row.engagement_id !== engagementId || row.crate_id !== crate.id || row.direction !== body.direction || row.state !== body.state)) {
        throw new AppError('conflict', 'This scan key was used already for a different scan. The app makes a new key for each scan; scan again.', { code: 'key_reused' });
      }
      const legs = await loadLegs(db, productionId);
      const expected = Boolean(legs.find((l) => l.toEngagementId === engagementId)?.crates.some((c) => c.crateId === crate.id));
      return { scan: (await scanViews([row]))[0], created, expected };
    },

    async list(productionId: string, engagementId: string): Promise<ScanView[]> {
      const rows = (await scansQuery().where({ 's.production_id': productionId, 's.engagement_id': engagementId }).orderBy('s.scanned_at', 'desc').limit(1000)) as ScanRow[];
      return scanViews(rows);
    },

    async findScan(productionId: string, engagementId: string, scanId: string): Promise<ScanRow> {
      const row = (await db('crate_scans').where({ id: scanId, production_id: productionId, engagement_id: engagementId }).first()) as ScanRow | undefined;
      if (!row) throw notFound('The scan');
      return row;
    },

    /** Expected, here, missing and damaged at one engagement, and the crates to chase before the next leg. */
    async status(productionId: string, engagementId: string): Promise<CheckStatusView> {
      const engagements = ((await engagementsQuery(db, productionId)) as EngagementRow[]).map(toEngagementView);
      const engagement = engagements.find((e) => e.id === engagementId);
      if (!engagement) throw notFound('The engagement');
      const [legs, crates, latest] = await Promise.all([
        loadLegs(db, productionId),
        loadCrates(db, productionId),
        db('crate_scans as s')
          .leftJoin('users as u', 'u.id', 's.scanned_by')
          .where({ 's.production_id': productionId, 's.engagement_id': engagementId })
          .distinctOn(['s.crate_id', 's.direction'])
          .orderBy([{ column: 's.crate_id' }, { column: 's.direction' }, { column: 's.scanned_at', order: 'desc' }, { column: 's.received_at', order: 'desc' }])
          .select('s.id', 's.crate_id', 's.direction', 's.state', 's.scanned_at', 'u.name as by', db.raw('(select count(*)::int from crate_scan_photos p where p.scan_id = s.id) as photo_count')),
      ]);
      const inLeg = legs.find((l) => l.toEngagementId === engagementId);
      const index = engagements.findIndex((e) => e.id === engagementId);
      const nextLeg = legs.find((l) => l.fromEngagementId === engagementId) ?? (index >= 0 && engagements[index + 1] ? legs.find((l) => l.toEngagementId === engagements[index + 1].id) : undefined);
      const nextCrates = new Set(nextLeg?.crates.map((c) => c.crateId) ?? []);
      const expectedIds = inLeg?.crates.map((c) => c.crateId) ?? [];
      const seen = new Set(latest.map((s) => s.crate_id as string));
      const ids = [...expectedIds, ...[...seen].filter((id) => !expectedIds.includes(id))];
      const byId = new Map(crates.map((c) => [c.id, c]));
      const scanOf = (crateId: string, direction: 'in' | 'out') => {
        const s = latest.find((x) => x.crate_id === crateId && x.direction === direction);
        return s ? { scanId: s.id, state: s.state, scannedAt: new Date(s.scanned_at).toISOString(), by: s.by ?? null, photoCount: Number(s.photo_count) } : null;
      };
      const rows: ExpectedCrateView[] = ids
        .filter((id) => byId.has(id))
        .map((id) => {
          const c = byId.get(id)!;
          return { crateId: id, code: c.code, name: c.name, grossKg: c.grossKg, in: scanOf(id, 'in'), out: scanOf(id, 'out'), expected: expectedIds.includes(id), onNextLeg: nextCrates.has(id) };
        });
      const expectedRows = rows.filter((r) => expectedIds.includes(r.crateId));
      const summarise = (dir: 'in' | 'out', list: ExpectedCrateView[]): CheckSummary => ({
        expected: list.length,
        here: rows.filter((r) => r[dir] && r[dir]!.state !== 'missing').length,
        damaged: rows.filter((r) => r[dir]?.state === 'damaged').length,
        missing: list.filter((r) => r[dir]?.state === 'missing').length,
        notSeen: list.filter((r) => !r[dir]).length,
        checkedOut: rows.filter((r) => r.out && r.out.state !== 'missing').length,
      });
      const nextVenue = nextLeg ? engagements.find((e) => e.id === nextLeg.toEngagementId) : undefined;
      const leaving = nextLeg ? `the leg to ${nextVenue?.venueName ?? 'the next venue'}${nextLeg.departsOn ? ` leaving ${nextLeg.departsOn}` : ''}` : '';
      const flags: CheckStatusView['flags'] = [];
      // "Not checked in" means something only once check-in has begun here (a scan exists) or the
      // load-in day has come; before that, every crate is simply still on its way.
      const today = new Date().toISOString().slice(0, 10);
      const checkInBegun = latest.length > 0 || (!!engagement.loadInOn && engagement.loadInOn <= today);
      for (const r of rows) {
        const isExpected = expectedIds.includes(r.crateId);
        if (!isExpected && r.in) flags.push({ crateId: r.crateId, code: r.code, message: `${r.code} was checked in at ${engagement.venueName} but is not on the leg to it.` });
        if (!isExpected || !r.onNextLeg) continue;
        if ((!r.in && checkInBegun) || r.in?.state === 'missing') {
          flags.push({ crateId: r.crateId, code: r.code, message: `${r.code} ${r.in ? 'is marked missing' : 'has not been checked in'} at ${engagement.venueName} and is due on ${leaving}.` });
        } else if (r.out?.state === 'missing') {
          flags.push({ crateId: r.crateId, code: r.code, message: `${r.code} was marked missing at load-out from ${engagement.venueName} and is due on ${leaving}.` });
        }
      }
      // Expected here but not on the next leg and never checked in: it may be lost, and nothing follows it.
      for (const r of expectedRows) if (!r.onNextLeg && nextLeg && ((!r.in && checkInBegun) || r.in?.state === 'missing')) flags.push({ crateId: r.crateId, code: r.code, message: `${r.code} missed ${engagement.venueName} and is not on the next leg: find out where it is.` });
      return {
        engagement,
        nextLeg: nextLeg ? { id: nextLeg.id, departsOn: nextLeg.departsOn, toVenueName: nextVenue?.venueName ?? '' } : null,
        crates: rows,
        summary: { in: summarise('in', expectedRows), out: summarise('out', expectedRows) },
        flags,
      };
    },
  };
}
