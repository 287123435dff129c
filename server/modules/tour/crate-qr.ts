/**
 * What a crate label's QR code holds: the crate's address in the app at the production's public address
 * (APP_URL), `<APP_URL>/p/<productionId>/crates/<crateId>`, so a phone camera outside Ballast opens the
 * crate, and the check-in screen can tell the production and the crate from it. The label renderer makes
 * the text with `crateQrText`; check-in reads it with `parseCrateQr`.
 */
export function crateQrText(appUrl: string, productionId: string, crateId: string): string {
  return `${appUrl.replace(/\/+$/, '')}/p/${productionId}/crates/${crateId}`;
}

const UUID = '[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}';
const PATTERN = new RegExp(`/p/(${UUID})/crates/(${UUID})(?:[/?#]|$)`, 'i');

/** The production and crate named by a label's QR text, or null when it is not a Ballast crate label. */
export function parseCrateQr(text: string): { productionId: string; crateId: string } | null {
  const m = PATTERN.exec(text.trim());
  return m ? { productionId: m[1].toLowerCase(), crateId: m[2].toLowerCase() } : null;
}
