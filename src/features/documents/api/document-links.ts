import { seg } from '../../../lib/api.ts';

/**
 * Addresses of the printable documents (`/api/productions/:productionId/documents/…`). They are plain
 * GET downloads carried by the session cookie, so the screens link to them; the server checks the role
 * and, for manifests, the venue.
 */
const root = (productionId: string) => `/api/productions/${seg(productionId)}/documents`;

export const documentLinks = {
  packingList: (productionId: string, crateId: string) => `${root(productionId)}/crates/${seg(crateId)}/packing-list.pdf`,
  /** Labels of some crates (every crate when `crateIds` is empty), one or two to a page. */
  labels: (productionId: string, crateIds: readonly string[] = [], perPage: 1 | 2 = 1) => {
    const q = new URLSearchParams();
    if (crateIds.length) q.set('ids', crateIds.join(','));
    if (perPage !== 1) q.set('perPage', String(perPage));
    const s = q.toString();
    return `${root(productionId)}/crates/labels.pdf${s ? `?${s}` : ''}`;
  },
  manifest: (productionId: string, engagementId: string) => `${root(productionId)}/engagements/${seg(engagementId)}/manifest.pdf`,
  customsList: (productionId: string, format: 'csv' | 'xlsx') => `${root(productionId)}/customs-list.${format}`,
};
