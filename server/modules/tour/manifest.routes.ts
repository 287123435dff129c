import type { Request } from 'express';
import { z } from 'zod';
import { inviteVenueStaffBody, sendManifestBody, type InviteVenueStaffBody, type SendManifestBody } from '../../../src/domain/contracts/tour.ts';
import { can, route, uuidParam, type RouteDef } from '../../http/routes.ts';
import type { AppDeps } from '../../app.ts';
import { findEngagement, productionOf, requireVenueScope } from './tour.repository.ts';
import { buildManifest, manifestCsv } from './manifest.service.ts';
import { mailingsService } from './mailings.service.ts';

const mailingsQuery = z.object({ status: z.enum(['sent', 'failed']).optional() });

/**
 * Manifests (data for the screen, the CSV and a PDF renderer) and their e-mail with its delivery log.
 * Venue staff read the manifest of their own venue's engagements only.
 */
export function manifestRoutes(deps: AppDeps): RouteDef[] {
  const { db } = deps;
  const mailings = mailingsService({ db, mailer: deps.mailer, appUrl: deps.config.APP_URL, log: deps.log });

  async function engagementInScope(req: Request, action: 'engagement.read' | 'engagement.send' | 'tour.read') {
    const productionId = productionOf(req);
    const engagement = await findEngagement(db, productionId, uuidParam(req, 'engagementId'));
    if (action === 'engagement.read') requireVenueScope(req, action, productionId, engagement.venue_id);
    return { productionId, engagement };
  }

  return [
    route({
      method: 'get',
      path: '/engagements/:engagementId/manifest',
      access: can('engagement.read'),
      async handler(req) {
        const { productionId, engagement } = await engagementInScope(req, 'engagement.read');
        return { manifest: await buildManifest(db, productionId, engagement.id, engagement) };
      },
    }),
    route({
      method: 'get',
      path: '/engagements/:engagementId/manifest/csv',
      access: can('engagement.read'),
      async handler(req, res) {
        const { productionId, engagement } = await engagementInScope(req, 'engagement.read');
        const manifest = await buildManifest(db, productionId, engagement.id, engagement);
        const name = `manifest-${manifest.venue.name.toLowerCase().replace(/[^a-z0-9]+/g, '-')}-${manifest.engagement.loadInOn}.csv`;
        res.setHeader('Content-Type', 'text/csv; charset=utf-8');
        res.setHeader('Content-Disposition', `attachment; filename="${name}"`);
        // A byte-order mark so that spreadsheet programs read the accented venue names as UTF-8.
        res.send(`\uFEFF${manifestCsv(manifest)}`);
      },
    }),
    route({
      method: 'post',
      path: '/engagements/:engagementId/manifest/send',
      access: can('engagement.send'),
      body: sendManifestBody,
      async handler(req, res) {
        const { productionId, engagement } = await engagementInScope(req, 'engagement.send');
        const sent = await mailings.sendManifest(productionId, engagement.id, req.body as SendManifestBody, req.actor!.userId);
        res.status(201).json({ mailings: sent });
      },
    }),
    route({
      method: 'post',
      path: '/engagements/:engagementId/invitations',
      access: can('engagement.send'),
      body: inviteVenueStaffBody,
      async handler(req, res) {
        const { productionId, engagement } = await engagementInScope(req, 'engagement.send');
        const mailing = await mailings.invite(productionId, engagement.id, engagement.venue_id, req.body as InviteVenueStaffBody, req.actor!.userId);
        res.status(201).json({ mailing });
      },
    }),
    route({
      method: 'get',
      path: '/engagements/:engagementId/mailings',
      access: can('tour.read'),
      async handler(req) {
        const { productionId, engagement } = await engagementInScope(req, 'tour.read');
        return { mailings: await mailings.list(productionId, { engagementId: engagement.id }) };
      },
    }),
    route({
      method: 'get',
      path: '/mailings',
      access: can('tour.read'),
      query: mailingsQuery,
      async handler(req) {
        const q = req.query as z.infer<typeof mailingsQuery>;
        return { mailings: await mailings.list(productionOf(req), { status: q.status }) };
      },
    }),
    route({
      method: 'post',
      path: '/mailings/:mailingId/retry',
      access: can('engagement.send'),
      async handler(req) {
        return { mailing: await mailings.retry(productionOf(req), uuidParam(req, 'mailingId'), req.actor!.userId) };
      },
    }),
  ];
}
