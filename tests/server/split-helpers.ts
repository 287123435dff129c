import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import { DEMO_USERS, DEMO_VENUES } from '../../seeds/01_demo.ts';
import { seedDemoMachine } from '../../server/modules/machine/demo-machine.ts';
import { seedDemoLifting } from '../../server/modules/lifting/demo-lifting.ts';
import { seedDemoCrates } from '../../server/modules/crates/demo-crates.ts';
import { seedDemoTour } from '../../server/modules/tour/demo-tour.ts';

/**
 * A full copy of the demo production (machine, gear and lift plan, crates and vehicles, tour) for the split
 * and impact tests, so adopting a split or applying a draft never touches the demo other files read.
 * The venue user is staff of the copy's Loomworks Hall.
 */
export async function demoCopy(db: Knex, label: string): Promise<{ productionId: string; venueIds: Map<string, string> }> {
  return db.transaction(async (trx) => {
    const [p] = await trx('productions').insert({ name: `${label} ${randomUUID()}`, machine_name: 'Orrery Seven' }).returning('id');
    const venues = await trx('venues')
      .insert(DEMO_VENUES.map((v) => ({ ...v, production_id: p.id })))
      .returning(['id', 'name']);
    const venueIds = new Map(venues.map((v) => [v.name as string, v.id as string]));
    for (const u of DEMO_USERS) {
      if (!u.role) continue;
      const user = await trx('users').whereRaw('lower(email) = ?', [u.email]).first('id');
      await trx('memberships').insert({ production_id: p.id, user_id: user.id, role: u.role, venue_ids: u.role === 'venue' ? [venueIds.get('Loomworks Hall')] : [] });
    }
    await seedDemoMachine(trx, p.id, 'Orrery Seven');
    const planner = await trx('users').where({ email: 'planner@ballast.example' }).first('id');
    await seedDemoLifting(trx, p.id, { plannerId: planner.id, venueIds });
    await seedDemoCrates(trx, p.id);
    await seedDemoTour(trx, p.id);
    return { productionId: p.id as string, venueIds };
  });
}
