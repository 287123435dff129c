import type { Request } from 'express';
import { scanBody, type ScanBody } from '../../../src/domain/contracts/tour.ts';
import { can, route, uuidParam, type RouteDef } from '../../http/routes.ts';
import { AppError, notFound } from '../../http/errors.ts';
import type { AppDeps } from '../../app.ts';
import { formatBytes, requireFile, singleUpload, type UploadRule } from '../machine/upload.ts';
import { engagementsQuery, findEngagement, productionOf, requireVenueScope, venueScopeOf, type EngagementRow } from './tour.repository.ts';
import { checkInService } from './checkin.service.ts';

/** Photos of damage: phone pictures, at most 8 MB each and 6 per scan. */
export const PHOTO_RULE: UploadRule = { field: 'photo', maxBytes: 8 * 1024 * 1024, extensions: ['.jpg', '.jpeg', '.png', '.webp', '.heic', '.heif'], label: 'a photo (JPEG, PNG, WebP or HEIC)' };
const PHOTO_TYPES = ['image/jpeg', 'image/png', 'image/webp', 'image/heic', 'image/heif'];
export const MAX_PHOTOS_PER_SCAN = 6;

/**
 * Check-in and check-out at an engagement: scans (by QR code or ticked in a list), photos of damage, and
 * the status the planner watches. Venue staff work only at their own venues' engagements.
 */
export function checkInRoutes(deps: AppDeps): RouteDef[] {
  const { db } = deps;
  const service = checkInService(db);

  async function engagementInScope(req: Request, action: 'engagement.read' | 'engagement.checkin') {
    const productionId = productionOf(req);
    const engagementId = uuidParam(req, 'engagementId');
    const engagement = await findEngagement(db, productionId, engagementId);
    requireVenueScope(req, action, productionId, engagement.venue_id);
    return { productionId, engagement };
  }

  return [
    route({
      method: 'get',
      path: '/check-status',
      access: can('engagement.read'),
      async handler(req) {
        const productionId = productionOf(req);
        const scope = venueScopeOf(req, productionId);
        const engagements = ((await engagementsQuery(db, productionId)) as EngagementRow[]).filter((e) => !scope || scope.includes(e.venue_id));
        return { statuses: await Promise.all(engagements.map((e) => service.status(productionId, e.id))) };
      },
    }),
    route({
      method: 'get',
      path: '/engagements/:engagementId/check',
      access: can('engagement.read'),
      async handler(req) {
        const { productionId, engagement } = await engagementInScope(req, 'engagement.read');
        return { status: await service.status(productionId, engagement.id) };
      },
    }),
    route({
      method: 'get',
      path: '/engagements/:engagementId/scans',
      access: can('engagement.read'),
      async handler(req) {
        const { productionId, engagement } = await engagementInScope(req, 'engagement.read');
        return { scans: await service.list(productionId, engagement.id) };
      },
    }),
    route({
      method: 'post',
      path: '/engagements/:engagementId/scans',
      access: can('engagement.checkin'),
      body: scanBody,
      async handler(req, res) {
        const { productionId, engagement } = await engagementInScope(req, 'engagement.checkin');
        const result = await service.record(productionId, engagement.id, req.body as ScanBody, req.actor!.userId);
        res.status(result.created ? 201 : 200).json(result);
      },
    }),
    route({
      method: 'post',
      path: '/engagements/:engagementId/scans/:scanId/photos',
      access: can('engagement.checkin'),
      // Scope is checked in the handler; the upload is held in memory within its limit until then.
      before: [singleUpload(PHOTO_RULE)],
      async handler(req, res) {
        const { productionId, engagement } = await engagementInScope(req, 'engagement.checkin');
        const scan = await service.findScan(productionId, engagement.id, uuidParam(req, 'scanId'));
        const file = requireFile(req.file, PHOTO_RULE);
        if (!PHOTO_TYPES.includes(file.mimetype)) {
          throw new AppError('unsupported_type', `"${file.originalname}" is sent as ${file.mimetype}; only ${PHOTO_TYPES.join(', ')} photos up to ${formatBytes(PHOTO_RULE.maxBytes)} are accepted.`);
        }
        const count = await db('crate_scan_photos').where({ scan_id: scan.id }).count<{ count: number }[]>('* as count');
        if (Number(count[0].count) >= MAX_PHOTOS_PER_SCAN) throw new AppError('invalid', `A scan keeps at most ${MAX_PHOTOS_PER_SCAN} photos; this one has ${count[0].count}.`);
        const [row] = await db('crate_scan_photos')
          .insert({ production_id: productionId, scan_id: scan.id, filename: file.originalname.slice(0, 200), content_type: file.mimetype, size_bytes: file.size, content: file.buffer, uploaded_by: req.actor!.userId })
          .returning(['id', 'filename', 'size_bytes']);
        res.status(201).json({ photo: { id: row.id, filename: row.filename, sizeBytes: row.size_bytes } });
      },
    }),
    route({
      method: 'get',
      path: '/engagements/:engagementId/scans/:scanId/photos/:photoId',
      access: can('engagement.read'),
      async handler(req, res) {
        const { productionId, engagement } = await engagementInScope(req, 'engagement.read');
        const scan = await service.findScan(productionId, engagement.id, uuidParam(req, 'scanId'));
        const photo = await db('crate_scan_photos').where({ id: uuidParam(req, 'photoId'), scan_id: scan.id }).first();
        if (!photo) throw notFound('The photo');
        res.setHeader('Content-Type', photo.content_type);
        res.setHeader('Content-Disposition', `inline; filename="${String(photo.filename).replace(/[^\w.-]+/g, '_')}"`);
        res.setHeader('Cache-Control', 'private, max-age=3600');
        res.send(photo.content);
      },
    }),
  ];
}
