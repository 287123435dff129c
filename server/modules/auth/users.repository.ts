import type { Knex } from 'knex';
import type { Actor, ProductionRole } from '../../../src/domain/policy/index.ts';
import type { SessionUser } from '../../../src/domain/contracts/auth.ts';

export interface UserRow {
  id: string;
  email: string;
  name: string;
  password_hash: string | null;
  is_admin: boolean;
  active: boolean;
  units: 'metric' | 'imperial';
  version: number;
}

export interface MembershipRow {
  production_id: string;
  production_name: string;
  paper_size: 'A4' | 'Letter';
  role: ProductionRole;
  venue_ids: string[];
}

export function usersRepository(db: Knex) {
  return {
    findByEmail(email: string, trx: Knex = db): Promise<UserRow | undefined> {
      return trx<UserRow>('users').whereRaw('lower(email) = lower(?)', [email]).first();
    },
    findById(id: string, trx: Knex = db): Promise<UserRow | undefined> {
      return trx<UserRow>('users').where({ id }).first();
    },
    memberships(userId: string, trx: Knex = db): Promise<MembershipRow[]> {
      return trx('memberships as m')
        .join('productions as p', 'p.id', 'm.production_id')
        .where('m.user_id', userId)
        .orderBy('p.name')
        .select('m.production_id', 'p.name as production_name', 'p.paper_size', 'm.role', 'm.venue_ids');
    },
    /**
     * The person and their memberships in one round trip (every signed-in request loads them, so that a
     * role change applies at once): the same rows as findById and memberships.
     */
    async findWithMemberships(id: string): Promise<{ user: UserRow; memberships: MembershipRow[] } | undefined> {
      const { rows } = (await db.raw(
        `select u.*, coalesce((select json_agg(json_build_object('production_id', m.production_id, 'production_name', p.name, 'paper_size', p.paper_size,
                                                            'role', m.role, 'venue_ids', m.venue_ids) order by p.name)
                                 from memberships m join productions p on p.id = m.production_id
                                where m.user_id = u.id), '[]'::json) as memberships_json
           from users u where u.id = ?`,
        [id],
      )) as { rows: (UserRow & { memberships_json: MembershipRow[] })[] };
      if (!rows[0]) return undefined;
      const { memberships_json: memberships, ...user } = rows[0];
      return { user, memberships };
    },
    async setUnits(id: string, units: 'metric' | 'imperial'): Promise<void> {
      await db('users').where({ id }).update({ units, updated_at: db.fn.now(), version: db.raw('version + 1') });
    },
    async setPasswordHash(id: string, hash: string, trx: Knex = db): Promise<void> {
      await trx('users').where({ id }).update({ password_hash: hash, updated_at: trx.fn.now(), version: trx.raw('version + 1') });
    },
  };
}
export type UsersRepository = ReturnType<typeof usersRepository>;

export function toActor(user: UserRow, memberships: MembershipRow[]): Actor {
  return {
    userId: user.id,
    isAdmin: user.is_admin,
    memberships: memberships.map((m) => ({ productionId: m.production_id, role: m.role, venueIds: m.venue_ids ?? [] })),
  };
}

export function toSessionUser(user: UserRow, memberships: MembershipRow[]): SessionUser {
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    isAdmin: user.is_admin,
    units: user.units,
    memberships: memberships.map((m) => ({
      productionId: m.production_id,
      productionName: m.production_name,
      role: m.role,
      venueIds: m.venue_ids ?? [],
      paperSize: m.paper_size,
    })),
  };
}
