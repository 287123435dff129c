import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import { DEMO_USERS } from '../../seeds/01_demo.ts';

/**
 * A production of its own for a tour test file: two venues, the demo planner and rigger as members and
 * the demo venue user as staff of the first venue only, so the tests never touch the demo tour.
 */
export async function tourTestProduction(db: Knex, label: string) {
  const [p] = await db('productions').insert({ name: `${label} ${randomUUID()}`, machine_name: 'Test machine' }).returning('id');
  const venues = await db('venues')
    .insert([
      { production_id: p.id, name: 'Own Hall', city: 'Testville', country: 'GB' },
      { production_id: p.id, name: 'Other Hall', city: 'Elsewhere', country: 'FR' },
    ])
    .returning(['id', 'name']);
  const own = venues.find((v) => v.name === 'Own Hall')!.id as string;
  const other = venues.find((v) => v.name === 'Other Hall')!.id as string;
  for (const u of DEMO_USERS) {
    if (!u.role) continue;
    const user = await db('users').whereRaw('lower(email) = ?', [u.email]).first('id');
    await db('memberships').insert({ production_id: p.id, user_id: user.id, role: u.role, venue_ids: u.role === 'venue' ? [own] : [] });
  }
  return { productionId: p.id as string, ownVenueId: own, otherVenueId: other };
}

/** A stock crate with one content line of the given mass (null: unknown). */
export async function insertCrate(
  db: Knex,
  productionId: string,
  c: { code: string; lengthMm: number; widthMm: number; heightMm: number; tareKg: number; contentsKg: number | null; mayTilt?: boolean },
): Promise<string> {
  const [row] = await db('crates')
    .insert({
      production_id: productionId,
      code: c.code,
      name: `Crate ${c.code}`,
      kind: 'stock',
      outer_length_mm: c.lengthMm,
      outer_width_mm: c.widthMm,
      outer_height_mm: c.heightMm,
      tare_kg: c.tareKg,
      may_tilt: c.mayTilt ?? false,
      this_way_up: !(c.mayTilt ?? false),
    })
    .returning('id');
  await db('crate_contents').insert({ production_id: productionId, crate_id: row.id, description: `contents of ${c.code}`, mass_kg: c.contentsKg });
  return row.id;
}

/** Waits until the SMTP catcher has stored a message to `to` (it stores asynchronously). */
export async function caughtMail(db: Knex, to: string, subjectLike = '%', timeoutMs = 5000) {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const rows = await db('caught_mail').whereRaw('? = any(rcpt_to)', [to]).where('subject', 'like', subjectLike).orderBy('received_at', 'desc');
    if (rows.length) return rows;
    if (Date.now() > until) return [];
    await new Promise((r) => setTimeout(r, 100));
  }
}
