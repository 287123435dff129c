import { z } from 'zod';
import { invitationBody, productionRole } from '../../../src/domain/contracts/auth.ts';
import { can, route, uuidParam, type RouteDef } from '../../http/routes.ts';
import { invalid, notFound } from '../../http/errors.ts';
import type { AppDeps } from '../../app.ts';
import { invitationsService } from '../invitations/invitations.service.ts';

const memberBody = z.object({ role: productionRole, venueIds: z.array(z.string().uuid()).default([]) });

/** Company-wide administration: people, their access to productions, and caught mail. */
export function adminRoutes(deps: AppDeps): RouteDef[] {
  const { db } = deps;
  const invitations = invitationsService({ db, mailer: deps.mailer, appUrl: deps.config.APP_URL, log: deps.log });
  return [
    route({
      method: 'get',
      path: '/users',
      access: can('people.manage'),
      async handler() {
        const users = await db('users').orderBy('name').select('id', 'email', 'name', 'is_admin', 'active');
        const memberships = await db('memberships as m')
          .join('productions as p', 'p.id', 'm.production_id')
          .select('m.user_id', 'm.production_id as productionId', 'p.name as productionName', 'm.role', 'm.venue_ids as venueIds');
        return {
          users: users.map((u) => ({
            id: u.id,
            email: u.email,
            name: u.name,
            isAdmin: u.is_admin,
            active: u.active,
            memberships: memberships.filter((m) => m.user_id === u.id).map(({ user_id: _u, ...m }) => m),
          })),
        };
      },
    }),
    route({
      method: 'get',
      path: '/productions',
      access: can('people.manage'),
      async handler() {
        const productions = await db('productions').orderBy('name').select('id', 'name');
        const venues = await db('venues').orderBy('name').select('id', 'name', 'production_id');
        return { productions: productions.map((p) => ({ ...p, venues: venues.filter((v) => v.production_id === p.id).map((v) => ({ id: v.id, name: v.name })) })) };
      },
    }),
    route({
      method: 'post',
      path: '/invitations',
      access: can('people.manage'),
      body: invitationBody,
      async handler(req, res) {
        res.status(201).json(await invitations.invite(req.body, req.actor!.userId));
      },
    }),
    route({
      method: 'put',
      path: '/productions/:productionId/members/:userId',
      access: can('people.manage'),
      body: memberBody,
      async handler(req) {
        const productionId = uuidParam(req, 'productionId');
        const userId = uuidParam(req, 'userId');
        const { role, venueIds } = req.body as z.infer<typeof memberBody>;
        if (role === 'venue' && venueIds.length === 0) throw invalid('A venue user needs at least one venue.', [{ path: 'venueIds', message: 'Pick at least one venue.' }]);
        if (!(await db('productions').where({ id: productionId }).first())) throw notFound('The production');
        if (!(await db('users').where({ id: userId }).first())) throw notFound('The person');
        await invitations.venuesBelong(db, productionId, venueIds);
        const [member] = await db('memberships')
          .insert({ production_id: productionId, user_id: userId, role, venue_ids: venueIds })
          .onConflict(['production_id', 'user_id'])
          .merge({ role, venue_ids: venueIds, updated_at: db.fn.now(), version: db.raw('memberships.version + 1') })
          .returning(['production_id as productionId', 'user_id as userId', 'role', 'venue_ids as venueIds']);
        return { member };
      },
    }),
    route({
      method: 'delete',
      path: '/productions/:productionId/members/:userId',
      access: can('people.manage'),
      async handler(req) {
        const n = await db('memberships').where({ production_id: uuidParam(req, 'productionId'), user_id: uuidParam(req, 'userId') }).del();
        if (!n) throw notFound('That membership');
      },
    }),
    route({
      method: 'get',
      path: '/mail',
      access: can('mail.read'),
      async handler() {
        const rows = await db('caught_mail').orderBy('received_at', 'desc').limit(200);
        return {
          enabled: deps.mailer.catching,
          messages: rows.map((r) => ({
            id: r.id,
            from: r.mail_from,
            to: (r.rcpt_to as string[]).join(', '),
            subject: r.subject,
            text: r.text_body,
            attachments: r.attachments,
            receivedAt: new Date(r.received_at).toISOString(),
          })),
        };
      },
    }),
  ];
}
