import type { Request, Response } from 'express';
import { z } from 'zod';
import { can, route, uuidParam, type RouteDef } from '../../http/routes.ts';
import type { AppDeps } from '../../app.ts';
import { renderCrateLabelsPdf } from '../../pdf/crate-labels.pdf.ts';
import { renderPackingListPdf } from '../../pdf/packing-list.pdf.ts';
import { crateDocuments, parseCrateIds } from './crate-documents.service.ts';
import { customsCsv, customsXlsx, loadCustomsRows } from './customs-list.ts';
import { documentContext, safeFilePart } from './document-context.ts';
import { requireManifestAccess, venueManifestPdf } from './manifest-document.service.ts';

const labelsQuery = z.object({
  /** Comma-separated crate ids; none: every crate of the production. */
  ids: z.string().max(20_000).optional(),
  perPage: z.enum(['1', '2']).optional(),
});

function sendFile(res: Response, body: Buffer | string, type: string, filename: string, disposition: 'inline' | 'attachment' = 'inline'): void {
  res.setHeader('Content-Type', type);
  res.setHeader('Content-Disposition', `${disposition}; filename="${filename}"`);
  res.setHeader('Cache-Control', 'no-store');
  res.send(body);
}

/**
 * Printable documents of a production under `/api/productions/:productionId/documents`: packing lists
 * and labels of crates, venue manifests and the customs list. Crate paperwork needs crate.read; a
 * manifest needs engagement.read, and a venue user gets only their own venue's (checked in the service).
 */
export function documentRoutes(deps: AppDeps): RouteDef[] {
  const { db } = deps;
  const appUrl = deps.config.APP_URL;
  const pid = (req: Request) => uuidParam(req, 'productionId');

  return [
    route({
      method: 'get',
      path: '/crates/labels.pdf',
      access: can('crate.read'),
      query: labelsQuery,
      async handler(req, res) {
        const q = req.query as z.infer<typeof labelsQuery>;
        const ctx = await documentContext(db, pid(req), req.actor!.userId);
        const docs = await crateDocuments(db, ctx, appUrl, parseCrateIds(q.ids));
        const pdf = await renderCrateLabelsPdf(docs, ctx, { perPage: q.perPage === '2' ? 2 : 1 });
        sendFile(res, pdf, 'application/pdf', docs.length === 1 ? `label-${safeFilePart(docs[0].crate.code, 'crate')}.pdf` : 'crate-labels.pdf');
      },
    }),
    route({
      method: 'get',
      path: '/crates/:crateId/packing-list.pdf',
      access: can('crate.read'),
      async handler(req, res) {
        const ctx = await documentContext(db, pid(req), req.actor!.userId);
        const docs = await crateDocuments(db, ctx, appUrl, [uuidParam(req, 'crateId').toLowerCase()]);
        const pdf = await renderPackingListPdf(docs, ctx);
        sendFile(res, pdf, 'application/pdf', `packing-list-${safeFilePart(docs[0].crate.code, 'crate')}.pdf`);
      },
    }),
    route({
      method: 'get',
      path: '/engagements/:engagementId/manifest.pdf',
      access: can('engagement.read'),
      async handler(req, res) {
        const productionId = pid(req);
        const engagementId = uuidParam(req, 'engagementId');
        await requireManifestAccess(db, req.actor!, productionId, engagementId);
        const { pdf, filename } = await venueManifestPdf(db, productionId, engagementId, { userId: req.actor!.userId });
        sendFile(res, pdf, 'application/pdf', filename);
      },
    }),
    route({
      method: 'get',
      path: '/customs-list.csv',
      access: can('crate.read'),
      async handler(req, res) {
        const ctx = await documentContext(db, pid(req), null);
        const rows = await loadCustomsRows(db, ctx.productionId);
        // A byte-order mark so that spreadsheet programs read accented names as UTF-8.
        sendFile(res, `\uFEFF${customsCsv(rows)}`, 'text/csv; charset=utf-8', `customs-list-${safeFilePart(ctx.productionName.toLowerCase(), 'production')}.csv`, 'attachment');
      },
    }),
    route({
      method: 'get',
      path: '/customs-list.xlsx',
      access: can('crate.read'),
      async handler(req, res) {
        const ctx = await documentContext(db, pid(req), null);
        const rows = await loadCustomsRows(db, ctx.productionId);
        const xlsx = await customsXlsx(rows, `Customs list — ${ctx.productionName}`);
        sendFile(res, xlsx, 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet', `customs-list-${safeFilePart(ctx.productionName.toLowerCase(), 'production')}.xlsx`, 'attachment');
      },
    }),
  ];
}
