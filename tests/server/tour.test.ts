import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { createTestApp, type Agent, type TestApp } from './helpers.ts';
import { caughtMail, insertCrate, tourTestProduction } from './tour-helpers.ts';
import { crateQrText } from '../../server/modules/tour/crate-qr.ts';

let t: TestApp;
let planner: Agent;
let venue: Agent;
let rigger: Agent;
let ids: Awaited<ReturnType<typeof tourTestProduction>>;
let crates: Record<string, string>;
let ownEngagement: { id: string; version: number };
let otherEngagement: { id: string; version: number };
const tour = () => `/api/productions/${ids.productionId}/tour`;
const key = () => `scan-${randomUUID()}`;

beforeAll(async () => {
  t = await createTestApp();
  ids = await tourTestProduction(t.db, 'Tour test');
  planner = await t.signIn('planner');
  venue = await t.signIn('venue');
  rigger = await t.signIn('rigger');
  crates = {
    BQ1: await insertCrate(t.db, ids.productionId, { code: 'BQ1', lengthMm: 1300, widthMm: 900, heightMm: 700, tareKg: 35, contentsKg: 95, mayTilt: true }),
    DC: await insertCrate(t.db, ids.productionId, { code: 'DC', lengthMm: 1200, widthMm: 1120, heightMm: 1050, tareKg: 260, contentsKg: 440 }),
    PC: await insertCrate(t.db, ids.productionId, { code: 'PC', lengthMm: 600, widthMm: 400, heightMm: 400, tareKg: 6, contentsKg: null, mayTilt: true }),
  };
  await t.db('venues')
    .where({ id: ids.ownVenueId })
    .update({
      access: JSON.stringify({ doors: [{ name: 'corridor door B2', widthMm: 1100, heightMm: 2000 }], floorRatingKnPerM2: 10, stageFloorRatingKnPerM2: 10 }),
      contacts: JSON.stringify([{ name: 'Dock manager', role: 'production', email: 'dock@own-hall.example', phone: '', receivesManifest: true }]),
    });
});
afterAll(async () => t.close());

describe('engagements and legs', () => {
  it('creates engagements in date order and refuses dates out of order, naming the field', async () => {
    const bad = await planner
      .post(`${tour()}/engagements`)
      .set('x-csrf-token', planner.csrf)
      .send({ venueId: ids.ownVenueId, loadInOn: '2027-03-10', showFirstOn: '2027-03-09', showLastOn: '2027-03-12', loadOutOn: '2027-03-12' })
      .expect(400);
    expect(bad.body.error.issues[0].path).toBe('showFirstOn');
    const a = await planner
      .post(`${tour()}/engagements`)
      .set('x-csrf-token', planner.csrf)
      .send({ venueId: ids.ownVenueId, loadInOn: '2027-03-10', showFirstOn: '2027-03-11', showLastOn: '2027-03-13', loadOutOn: '2027-03-14' })
      .expect(201);
    ownEngagement = a.body.engagement;
    expect(a.body.engagement).toMatchObject({ venueName: 'Own Hall', loadInOn: '2027-03-10', loadOutOn: '2027-03-14' });
    const b = await planner
      .post(`${tour()}/engagements`)
      .set('x-csrf-token', planner.csrf)
      .send({ venueId: ids.otherVenueId, loadInOn: '2027-03-17', showFirstOn: '2027-03-18', showLastOn: '2027-03-20', loadOutOn: '2027-03-21' })
      .expect(201);
    otherEngagement = b.body.engagement;
  });

  it('saves with the version and answers 409 on a stale one', async () => {
    const ok = await planner.patch(`${tour()}/engagements/${ownEngagement.id}`).set('x-csrf-token', planner.csrf).send({ version: 1, notes: 'Dock closes at 18:00' }).expect(200);
    expect(ok.body.engagement.version).toBe(2);
    const stale = await planner.patch(`${tour()}/engagements/${ownEngagement.id}`).set('x-csrf-token', planner.csrf).send({ version: 1, notes: 'other' }).expect(409);
    expect(stale.body.error.current.notes).toBe('Dock closes at 18:00');
    const order = await planner.patch(`${tour()}/engagements/${ownEngagement.id}`).set('x-csrf-token', planner.csrf).send({ version: 2, loadOutOn: '2027-03-01' }).expect(400);
    expect(order.body.error.issues[0].path).toBe('loadOutOn');
    ownEngagement.version = 2;
  });

  it('legs carry every crate by default, or the ones named; a venue user sees only their engagements', async () => {
    const first = await planner.post(`${tour()}/legs`).set('x-csrf-token', planner.csrf).send({ toEngagementId: ownEngagement.id, departsOn: '2027-03-08' }).expect(201);
    expect(first.body.leg.crates.map((c: { code: string }) => c.code).sort()).toEqual(['BQ1', 'DC', 'PC']);
    // DC stays behind at Own Hall.
    const second = await planner
      .post(`${tour()}/legs`)
      .set('x-csrf-token', planner.csrf)
      .send({ fromEngagementId: ownEngagement.id, toEngagementId: otherEngagement.id, departsOn: '2027-03-15', crateIds: [crates.BQ1, crates.PC] })
      .expect(201);
    expect(second.body.leg.crates).toHaveLength(2);
    await planner.post(`${tour()}/legs`).set('x-csrf-token', planner.csrf).send({ toEngagementId: otherEngagement.id }).expect(409);
    const stale = await planner.patch(`${tour()}/legs/${second.body.leg.id}`).set('x-csrf-token', planner.csrf).send({ version: 7, notes: 'x' }).expect(409);
    expect(stale.body.error.code).toBe('conflict');
    const unknownCrate = await planner
      .patch(`${tour()}/legs/${second.body.leg.id}`)
      .set('x-csrf-token', planner.csrf)
      .send({ version: 1, crates: [{ crateId: randomUUID() }] })
      .expect(400);
    expect(unknownCrate.body.error.issues[0].path).toBe('crates.0');

    const seen = (await venue.get(tour()).expect(200)).body.tour;
    expect(seen.engagements.map((e: { id: string }) => e.id)).toEqual([ownEngagement.id]);
    expect(seen.crates).toEqual([]);
    expect((await planner.get(tour()).expect(200)).body.tour.engagements).toHaveLength(2);
  });

  it('the access matrix checks every crate at every engagement; unknowns are never passes', async () => {
    await venue.get(`${tour()}/access-matrix`).expect(403);
    const m = (await rigger.get(`${tour()}/access-matrix`).expect(200)).body.matrix;
    expect(m.columns.map((c: { engagementId: string }) => c.engagementId)).toEqual([ownEngagement.id, otherEngagement.id]);
    expect(m.cells).toHaveLength(m.rows.length * 2);
    const cell = (code: string, e: string) => m.cells.find((c: { rowId: string; engagementId: string }) => c.rowId === crates[code] && c.engagementId === e);
    expect(cell('DC', ownEngagement.id)).toMatchObject({ verdict: 'fail', tightestText: 'corridor door B2: -20 mm' });
    // BQ1 may tilt: it passes the door on its side, and the floor.
    expect(cell('BQ1', ownEngagement.id).verdict).toBe('pass');
    // PC's contents have no mass: its floor check is not a pass.
    const pcFloor = cell('PC', ownEngagement.id).findings.find((f: { check: string }) => f.check === 'floor');
    expect(pcFloor.verdict).toBe('unknown');
    // Other Hall has no data: nothing passes there.
    for (const code of ['BQ1', 'DC', 'PC']) expect(cell(code, otherEngagement.id).verdict).toBe('unknown');
    expect(m.counts.pass + m.counts.fail + m.counts.unknown).toBe(m.cells.length);
  });
});

describe('check-in and check-out', () => {
  const scans = () => `${tour()}/engagements/${ownEngagement.id}/scans`;

  it('a scan sent twice with the same key counts once', async () => {
    const body = { idempotencyKey: key(), crateId: crates.BQ1, direction: 'in', state: 'arrived' };
    const first = await venue.post(scans()).set('x-csrf-token', venue.csrf).send(body).expect(201);
    const again = await venue.post(scans()).set('x-csrf-token', venue.csrf).send(body).expect(200);
    expect(again.body.created).toBe(false);
    expect(again.body.scan.id).toBe(first.body.scan.id);
    const rows = await t.db('crate_scans').where({ idempotency_key: body.idempotencyKey });
    expect(rows).toHaveLength(1);
    expect(first.body.scan).toMatchObject({ crateCode: 'BQ1', state: 'arrived', method: 'list', scannedByName: expect.any(String) });
    // The same key for a different scan is refused, not merged.
    const clash = await venue.post(scans()).set('x-csrf-token', venue.csrf).send({ ...body, state: 'damaged' }).expect(409);
    expect(clash.body.error.code).toBe('key_reused');
  });

  it('reads a label QR code; a code of another production is refused with a clear message', async () => {
    const qr = crateQrText('https://ballast.example', ids.productionId, crates.DC);
    const ok = await venue.post(scans()).set('x-csrf-token', venue.csrf).send({ idempotencyKey: key(), code: qr, direction: 'in', state: 'damaged', note: 'corner split' }).expect(201);
    expect(ok.body.scan).toMatchObject({ crateCode: 'DC', method: 'qr', state: 'damaged' });
    const foreign = crateQrText('https://ballast.example', randomUUID(), crates.DC);
    const refused = await venue.post(scans()).set('x-csrf-token', venue.csrf).send({ idempotencyKey: key(), code: foreign, direction: 'in', state: 'arrived' }).expect(400);
    expect(refused.body.error.code).toBe('other_production');
    expect(refused.body.error.message).toMatch(/another production/);
    const junk = await venue.post(scans()).set('x-csrf-token', venue.csrf).send({ idempotencyKey: key(), code: 'hello world', direction: 'in', state: 'arrived' }).expect(400);
    expect(junk.body.error.code).toBe('not_a_crate_label');
  });

  it('a venue user cannot scan or read at another venue', async () => {
    await venue
      .post(`${tour()}/engagements/${otherEngagement.id}/scans`)
      .set('x-csrf-token', venue.csrf)
      .send({ idempotencyKey: key(), crateId: crates.BQ1, direction: 'in', state: 'arrived' })
      .expect(403);
    await venue.get(`${tour()}/engagements/${otherEngagement.id}/check`).expect(403);
    await venue.get(`${tour()}/engagements/${otherEngagement.id}/manifest`).expect(403);
  });

  it('takes a photo of damage within the limits and names them when refused', async () => {
    const scan = await t.db('crate_scans').where({ engagement_id: ownEngagement.id, state: 'damaged' }).first();
    const url = `${scans()}/${scan.id}/photos`;
    const jpeg = Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0]), Buffer.alloc(2048, 1)]);
    const ok = await venue.post(url).set('x-csrf-token', venue.csrf).attach('photo', jpeg, { filename: 'corner.jpg', contentType: 'image/jpeg' }).expect(201);
    const photo = await venue.get(`${url}/${ok.body.photo.id}`).expect(200);
    expect(photo.headers['content-type']).toBe('image/jpeg');
    expect(Buffer.compare(photo.body as Buffer, jpeg)).toBe(0);

    const big = await venue.post(url).set('x-csrf-token', venue.csrf).attach('photo', Buffer.alloc(8 * 1024 * 1024 + 1), { filename: 'huge.jpg', contentType: 'image/jpeg' }).expect(413);
    expect(big.body.error.message).toMatch(/8 MB/);
    const pdf = await venue.post(url).set('x-csrf-token', venue.csrf).attach('photo', Buffer.from('%PDF-1.7'), { filename: 'report.pdf', contentType: 'application/pdf' }).expect(415);
    expect(pdf.body.error.message).toMatch(/\.jpg/);
    const disguised = await venue.post(url).set('x-csrf-token', venue.csrf).attach('photo', Buffer.from('<svg/>'), { filename: 'x.png', contentType: 'image/svg+xml' }).expect(415);
    expect(disguised.body.error.message).toMatch(/image\/svg\+xml/);
    const none = await venue.post(url).set('x-csrf-token', venue.csrf).field('note', 'no file').expect(400);
    expect(none.body.error.issues[0].path).toBe('photo');
  });

  it('the planner sees expected, here, damaged and missing, and a crate that missed the venue is flagged before the next leg', async () => {
    await venue.post(scans()).set('x-csrf-token', venue.csrf).send({ idempotencyKey: key(), crateId: crates.PC, direction: 'in', state: 'missing' }).expect(201);
    const status = (await planner.get(`${tour()}/engagements/${ownEngagement.id}/check`).expect(200)).body.status;
    expect(status.summary.in).toMatchObject({ expected: 3, here: 2, damaged: 1, missing: 1, notSeen: 0 });
    expect(status.nextLeg).toMatchObject({ departsOn: '2027-03-15', toVenueName: 'Other Hall' });
    expect(status.flags).toHaveLength(1);
    expect(status.flags[0]).toMatchObject({ code: 'PC' });
    expect(status.flags[0].message).toMatch(/marked missing at Own Hall and is due on the leg to Other Hall leaving 2027-03-15/);
    // Found after all: the latest scan counts.
    await venue.post(scans()).set('x-csrf-token', venue.csrf).send({ idempotencyKey: key(), crateId: crates.PC, direction: 'in', state: 'arrived' }).expect(201);
    const after = (await venue.get(`${tour()}/engagements/${ownEngagement.id}/check`).expect(200)).body.status;
    expect(after.summary.in).toMatchObject({ here: 3, missing: 0 });
    expect(after.flags).toEqual([]);
    const all = (await planner.get(`${tour()}/check-status`).expect(200)).body.statuses;
    expect(all).toHaveLength(2);
    const other = all.find((s: { engagement: { id: string } }) => s.engagement.id === otherEngagement.id);
    expect(other.summary.in).toMatchObject({ expected: 2, notSeen: 2 });
    expect((await venue.get(`${tour()}/check-status`).expect(200)).body.statuses).toHaveLength(1);
  });
});

describe('manifest and e-mail', () => {
  it('the manifest lists the crates in unloading order with totals and access results; CSV is spreadsheet-safe', async () => {
    await t.db('hanging_points').insert({ production_id: ids.productionId, venue_id: ids.ownVenueId, label: 'upstage beam', rating_kg: 500 });
    const m = (await venue.get(`${tour()}/engagements/${ownEngagement.id}/manifest`).expect(200)).body.manifest;
    expect(m.hangingPoints).toEqual([expect.objectContaining({ label: 'upstage beam', ratingKg: 500 })]);
    expect(m.crates.map((c: { code: string }) => c.code)).toEqual(['BQ1', 'DC', 'PC']);
    expect(m.totals).toMatchObject({ crateCount: 3, grossKg: null, knownGrossKg: 830, unknownMassCount: 1 });
    expect(m.crates[1].access.verdict).toBe('fail');
    const csv = await venue.get(`${tour()}/engagements/${ownEngagement.id}/manifest/csv`).expect(200);
    expect(csv.headers['content-type']).toMatch(/text\/csv/);
    expect(csv.text).toMatch(/load order,crate,name/);
    expect(csv.text.split('\n')).toHaveLength(4);
  });

  it('sends the manifest, logs the delivery, and a resend says what changed', async () => {
    const sent = await planner.post(`${tour()}/engagements/${ownEngagement.id}/manifest/send`).set('x-csrf-token', planner.csrf).send({}).expect(201);
    expect(sent.body.mailings[0]).toMatchObject({ recipient: 'dock@own-hall.example', status: 'sent', kind: 'manifest', error: null });
    const [mail] = await caughtMail(t.db, 'dock@own-hall.example', 'Manifest:%');
    expect(mail.text_body).toMatch(/corridor door B2/);
    expect(mail.attachments.map((a: { filename: string }) => a.filename)).toEqual(['manifest-own-hall-2027-03-10.pdf', 'manifest-own-hall-2027-03-10.csv']);
    expect(mail.attachments[0].contentType).toBe('application/pdf');
    expect(mail.attachments[0].size).toBeGreaterThan(1000);

    const e = (await planner.get(tour()).expect(200)).body.tour.engagements.find((x: { id: string }) => x.id === ownEngagement.id);
    await planner.patch(`${tour()}/engagements/${ownEngagement.id}`).set('x-csrf-token', planner.csrf).send({ version: e.version, loadInOn: '2027-03-09' }).expect(200);
    const again = await planner.post(`${tour()}/engagements/${ownEngagement.id}/manifest/send`).set('x-csrf-token', planner.csrf).send({ message: 'Earlier load-in.' }).expect(201);
    expect(again.body.mailings[0].changes).toEqual(['Load-in moved from 2027-03-10 to 2027-03-09.']);
    const [updated] = await caughtMail(t.db, 'dock@own-hall.example', 'Updated manifest:%');
    expect(updated.text_body).toMatch(/What changed since the last manifest we sent:\s+- Load-in moved from 2027-03-10 to 2027-03-09\./);
    const log = (await planner.get(`${tour()}/engagements/${ownEngagement.id}/mailings`).expect(200)).body.mailings;
    expect(log).toHaveLength(2);
    expect(log[0]).toMatchObject({ sentBy: expect.any(String), status: 'sent' });
  });

  it('with no recipient the send is refused, naming the venue', async () => {
    const res = await planner.post(`${tour()}/engagements/${otherEngagement.id}/manifest/send`).set('x-csrf-token', planner.csrf).send({}).expect(400);
    expect(res.body.error.message).toMatch(/Other Hall/);
  });

  it('mail the server will not take is logged as failed with its error, listed, and delivered on retry', async () => {
    // A second app whose SMTP server is not there (nothing listens on port 1).
    const down = await createTestApp({ SMTP_URL: 'smtp://127.0.0.1:1' });
    try {
      const p = await down.signIn('planner');
      const to = `failing-${randomUUID().slice(0, 8)}@venue.example`;
      const res = await p.post(`${tour()}/engagements/${ownEngagement.id}/manifest/send`).set('x-csrf-token', p.csrf).send({ recipients: [to] }).expect(201);
      const failed = res.body.mailings[0];
      expect(failed).toMatchObject({ status: 'failed', recipient: to });
      expect(failed.error).toMatch(/ECONNREFUSED/);
      const invite = await p.post(`${tour()}/engagements/${ownEngagement.id}/invitations`).set('x-csrf-token', p.csrf).send({ email: `new-${to}`, name: 'Stage Door' }).expect(201);
      expect(invite.body.mailing).toMatchObject({ kind: 'invitation', status: 'failed' });
      expect(invite.body.mailing.error).toMatch(/ECONNREFUSED/);

      const listed = (await planner.get(`${tour()}/mailings?status=failed`).expect(200)).body.mailings.map((m: { id: string }) => m.id);
      expect(listed).toEqual(expect.arrayContaining([failed.id, invite.body.mailing.id]));

      // The mail server is back (the main test app delivers to its catcher).
      const retried = await planner.post(`${tour()}/mailings/${failed.id}/retry`).set('x-csrf-token', planner.csrf).send({}).expect(200);
      expect(retried.body.mailing).toMatchObject({ status: 'sent', attempts: 2, error: null });
      const [mail] = await caughtMail(t.db, to);
      // The same message as first tried: the PDF and the CSV.
      expect(mail.attachments).toHaveLength(2);
      await planner.post(`${tour()}/mailings/${failed.id}/retry`).set('x-csrf-token', planner.csrf).send({}).expect(409);

      const before = await t.db('invitations').whereRaw('lower(email) = ?', [`new-${to}`]);
      expect(before).toHaveLength(1);
      const inviteRetry = await planner.post(`${tour()}/mailings/${invite.body.mailing.id}/retry`).set('x-csrf-token', planner.csrf).send({}).expect(200);
      expect(inviteRetry.body.mailing.status).toBe('sent');
      // The undelivered link was replaced by a fresh one, for this venue only.
      const after = await t.db('invitations').whereRaw('lower(email) = ?', [`new-${to}`]);
      expect(after).toHaveLength(1);
      expect(after[0].id).not.toBe(before[0].id);
      expect(after[0]).toMatchObject({ role: 'venue', venue_ids: [ids.ownVenueId], production_id: ids.productionId });
      expect(await caughtMail(t.db, `new-${to}`, 'You are invited%')).toHaveLength(1);
    } finally {
      await down.close();
    }
  });

  it('only planners send; riggers and venue staff may not', async () => {
    await rigger.post(`${tour()}/engagements/${ownEngagement.id}/manifest/send`).set('x-csrf-token', rigger.csrf).send({}).expect(403);
    await venue.post(`${tour()}/engagements/${ownEngagement.id}/invitations`).set('x-csrf-token', venue.csrf).send({ email: 'x@y.example', name: 'X' }).expect(403);
  });
});
