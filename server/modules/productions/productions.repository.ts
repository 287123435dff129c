import type { Knex } from 'knex';
import type { ProductionView } from '../../../src/domain/contracts/productions.ts';

export interface ProductionRow {
  id: string;
  name: string;
  machine_name: string;
  paper_size: 'A4' | 'Letter';
  default_units: 'metric' | 'imperial';
  version: number;
  updated_at: Date;
}

export function toProductionView(r: ProductionRow): ProductionView {
  return {
    id: r.id,
    name: r.name,
    machineName: r.machine_name,
    paperSize: r.paper_size,
    defaultUnits: r.default_units,
    version: r.version,
    updatedAt: new Date(r.updated_at).toISOString(),
  };
}

export function productionsRepository(db: Knex) {
  return {
    find: (id: string) => db<ProductionRow>('productions').where({ id }).first(),
    list: () => db<ProductionRow>('productions').orderBy('name').select('id', 'name'),
    members: (productionId: string) =>
      db('memberships as m')
        .join('users as u', 'u.id', 'm.user_id')
        .where('m.production_id', productionId)
        .orderBy('u.name')
        .select('u.id as userId', 'u.name', 'u.email', 'm.role', 'm.venue_ids as venueIds'),
  };
}
