import type { Knex } from 'knex';
import { hashPassword } from '../server/security/passwords.ts';
import { seedDemoMachine } from '../server/modules/machine/demo-machine.ts';
import { seedDemoLifting } from '../server/modules/lifting/demo-lifting.ts';
import { seedDemoCrates } from '../server/modules/crates/demo-crates.ts';
import { seedDemoTour } from '../server/modules/tour/demo-tour.ts';

/**
 * The demo scenario (an invented touring mechanical orrery and eight invented venues). It is
 * written only into an empty database, so running it again never duplicates anything. Later
 * features add their demo rows here, in the same transaction.
 */
export const DEMO_USERS = [
  { email: 'admin@ballast.example', name: 'Ines Marlow', password: 'demo-admin-2027', isAdmin: true, role: null },
  { email: 'planner@ballast.example', name: 'Tobiah Renn', password: 'demo-planner-2027', isAdmin: false, role: 'planner' },
  { email: 'rigger@ballast.example', name: 'Saskia Oduya', password: 'demo-rigger-2027', isAdmin: false, role: 'rigger' },
  { email: 'venue@ballast.example', name: 'Dale Whitcombe', password: 'demo-venue-2027', isAdmin: false, role: 'venue' },
] as const;

export const DEMO_VENUES = [
  { name: 'Kelderwerf Hall', city: 'Rotterdam', country: 'NL' },
  { name: 'Sala Ventolina', city: 'Barcelona', country: 'ES' },
  { name: 'Havsljus Scen', city: 'Gothenburg', country: 'SE' },
  { name: 'Teatr Bursztynowy', city: 'Gdańsk', country: 'PL' },
  { name: 'Loomworks Hall', city: 'Manchester', country: 'GB' },
  { name: 'Forum Aurelian', city: 'Lyon', country: 'FR' },
  { name: 'Assay House', city: 'Toronto', country: 'CA' },
  { name: 'Verrière Pavilion', city: 'Montréal', country: 'CA' },
] as const;

export async function seed(knex: Knex): Promise<void> {
  await knex.transaction(async (trx) => {
    // Serialise concurrent seeders (two app servers starting at once) on one advisory lock.
    await trx.raw('select pg_advisory_xact_lock(727274)');
    const { count } = (await trx('productions').count<{ count: number }[]>('* as count'))[0];
    if (Number(count) > 0) return;

    const [tour] = await trx('productions')
      .insert({ name: 'Orrery Seven — European and Canadian tour', machine_name: 'Orrery Seven', paper_size: 'A4', default_units: 'metric' })
      .returning('id');
    const [residency] = await trx('productions')
      .insert({ name: 'Orrery Seven — workshop rebuild', machine_name: 'Orrery Seven', paper_size: 'Letter', default_units: 'metric' })
      .returning('id');

    const venues = await trx('venues')
      .insert(DEMO_VENUES.map((v) => ({ ...v, production_id: tour.id })))
      .returning(['id', 'name']);
    const loomworks = venues.find((v) => v.name === 'Loomworks Hall')!;

    for (const u of DEMO_USERS) {
      const [user] = await trx('users')
        .insert({ email: u.email, name: u.name, is_admin: u.isAdmin, password_hash: await hashPassword(u.password) })
        .returning('id');
      if (u.role) {
        await trx('memberships').insert({ production_id: tour.id, user_id: user.id, role: u.role, venue_ids: u.role === 'venue' ? [loomworks.id] : [] });
      }
      if (u.role === 'planner' || u.role === 'rigger') {
        await trx('memberships').insert({ production_id: residency.id, user_id: user.id, role: u.role });
      }
    }

    // The tour's machine breakdown (the workshop rebuild starts empty, to show the empty screens).
    await seedDemoMachine(trx, tour.id, 'Orrery Seven');

    // Rigging gear, hanging points and the drive core's lift plan, submitted by the planner.
    const plannerRow = await trx('users').where({ email: 'planner@ballast.example' }).first('id');
    await seedDemoLifting(trx, tour.id, { plannerId: plannerRow.id, venueIds: new Map(venues.map((v) => [v.name as string, v.id as string])) });
    // Its crates, vehicles and a first packed leg.
    await seedDemoCrates(trx, tour.id);
    // The tour: venue access data and contacts, eight engagements with their legs, Kelderwerf's check-in.
    await seedDemoTour(trx, tour.id);
  });
}
