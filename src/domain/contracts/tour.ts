import { z } from 'zod';
import { type accessFinding, venueAccess } from './access.ts';
import { unitSystem, versioned } from './common.ts';

/**
 * Tour, venues, manifests and check-in (issue 6): request bodies shared by the client forms and the
 * server, and the shapes of the answers. Lengths mm, masses kg, floor ratings kN/m², dates YYYY-MM-DD.
 */

export const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date as YYYY-MM-DD.');
const uuid = z.string().uuid();
const text = (max: number) => z.string().trim().max(max);
const optionalEmail = z
  .string()
  .trim()
  .toLowerCase()
  .max(254)
  .refine((v) => v === '' || z.email().safeParse(v).success, 'Enter a valid e-mail address.');

// ------------------------------------------------------------------------------------------- venues

/**
 * A venue's access as its staff record it: the access core's `venueAccess` (doors and route points in
 * order, each named, so the tightest point is named; dock or street level; freight lift; the route's
 * floor rating in `floorRatingKnPerM2`; handling equipment on site; ramps) plus the stage's floor rating.
 * The check uses the lower of the route's and the stage's rating; if either is unknown the floor check is
 * unknown.
 */
export const venueAccessData = venueAccess.extend({
  stageFloorRatingKnPerM2: z.number().positive().max(1000).nullable().optional(),
});
export type VenueAccessData = z.infer<typeof venueAccessData>;

export const venueContact = z.object({
  name: text(120).min(1, 'Enter a name.'),
  role: text(120).default(''),
  email: optionalEmail.default(''),
  phone: text(60).default(''),
  /** Gets the manifest when it is sent to "the venue's contacts". */
  receivesManifest: z.boolean().default(true),
});
export type VenueContact = z.infer<typeof venueContact>;

const venueFields = {
  name: text(120).min(1, 'Enter the venue name.'),
  city: text(120).default(''),
  country: text(60).default(''),
  address: text(500).default(''),
  notes: text(4000).default(''),
  paperworkUnits: unitSystem.nullable().default(null),
  access: venueAccessData.default({ doors: [] }),
  contacts: z.array(venueContact).max(30).default([]),
};

export const createVenueBody = z.object(venueFields);
export type CreateVenueBody = z.infer<typeof createVenueBody>;

export const updateVenueBody = z
  .object({
    name: venueFields.name.optional(),
    city: text(120).optional(),
    country: text(60).optional(),
    address: text(500).optional(),
    notes: text(4000).optional(),
    paperworkUnits: unitSystem.nullable().optional(),
    access: venueAccessData.optional(),
    contacts: z.array(venueContact).max(30).optional(),
  })
  .extend(versioned.shape);
export type UpdateVenueBody = z.infer<typeof updateVenueBody>;

export interface VenueView {
  id: string;
  name: string;
  city: string;
  country: string;
  address: string;
  notes: string;
  paperworkUnits: 'metric' | 'imperial' | null;
  access: VenueAccessData;
  contacts: VenueContact[];
  version: number;
  updatedAt: string;
}

/** A venue's hanging point as the manifest lists it (kept by the lifting module). */
export interface HangingPointView {
  id: string;
  label: string;
  /** Rating, kg; null while the venue has not given it (no plan may count on it). */
  ratingKg: number | null;
  notes: string;
}

// --------------------------------------------------------------------------------------------- tour

const engagementFields = {
  venueId: uuid,
  loadInOn: isoDate,
  showFirstOn: isoDate,
  showLastOn: isoDate,
  loadOutOn: isoDate,
  notes: text(4000).default(''),
};

/** Dates in order: load-in ≤ first show ≤ last show ≤ load-out. */
export function engagementDateProblems(d: { loadInOn: string; showFirstOn: string; showLastOn: string; loadOutOn: string }): { path: string; message: string }[] {
  const out: { path: string; message: string }[] = [];
  if (d.showFirstOn < d.loadInOn) out.push({ path: 'showFirstOn', message: `The first show (${d.showFirstOn}) is before the load-in (${d.loadInOn}).` });
  if (d.showLastOn < d.showFirstOn) out.push({ path: 'showLastOn', message: `The last show (${d.showLastOn}) is before the first show (${d.showFirstOn}).` });
  if (d.loadOutOn < d.showLastOn) out.push({ path: 'loadOutOn', message: `The load-out (${d.loadOutOn}) is before the last show (${d.showLastOn}).` });
  return out;
}

export const createEngagementBody = z.object(engagementFields).superRefine((d, ctx) => {
  for (const p of engagementDateProblems(d)) ctx.addIssue({ code: 'custom', path: [p.path], message: p.message });
});
export type CreateEngagementBody = z.infer<typeof createEngagementBody>;

export const updateEngagementBody = z
  .object({
    venueId: uuid.optional(),
    loadInOn: isoDate.optional(),
    showFirstOn: isoDate.optional(),
    showLastOn: isoDate.optional(),
    loadOutOn: isoDate.optional(),
    notes: text(4000).optional(),
    sortOrder: z.number().int().min(0).max(10_000).optional(),
  })
  .extend(versioned.shape);
export type UpdateEngagementBody = z.infer<typeof updateEngagementBody>;

export const createLegBody = z.object({
  /** Null: the leg starts at the workshop. */
  fromEngagementId: uuid.nullable().default(null),
  toEngagementId: uuid,
  departsOn: isoDate.nullable().default(null),
  notes: text(2000).default(''),
  vehicleIds: z.array(uuid).max(20).default([]),
  /** Crates on the leg, in unloading order; omitted: every crate of the production. */
  crateIds: z.array(uuid).max(5000).optional(),
});
export type CreateLegBody = z.infer<typeof createLegBody>;

export const updateLegBody = z
  .object({
    fromEngagementId: uuid.nullable().optional(),
    departsOn: isoDate.nullable().optional(),
    notes: text(2000).optional(),
    vehicleIds: z.array(uuid).max(20).optional(),
    /** Crates on the leg in unloading order, each with the vehicle it rides in (null: not decided). */
    crates: z.array(z.object({ crateId: uuid, vehicleId: uuid.nullable().default(null) })).max(5000).optional(),
  })
  .extend(versioned.shape);
export type UpdateLegBody = z.infer<typeof updateLegBody>;

export interface EngagementView {
  id: string;
  venueId: string;
  venueName: string;
  venueCity: string;
  sortOrder: number;
  loadInOn: string;
  showFirstOn: string;
  showLastOn: string;
  loadOutOn: string;
  notes: string;
  version: number;
}

export interface LegView {
  id: string;
  fromEngagementId: string | null;
  toEngagementId: string;
  departsOn: string | null;
  notes: string;
  vehicles: { id: string; code: string; name: string }[];
  crates: { crateId: string; code: string; vehicleId: string | null; loadOrder: number }[];
  version: number;
}

export interface TourCrateView {
  id: string;
  code: string;
  name: string;
  lengthMm: number;
  widthMm: number;
  heightMm: number;
  tareKg: number;
  /** Tare plus contents; null while any content's mass is unknown. */
  grossKg: number | null;
  mayTilt: boolean;
}

export interface TourView {
  engagements: EngagementView[];
  legs: LegView[];
  /** Empty for venue staff (they see their own engagements only). */
  vehicles: { id: string; code: string; name: string; kind: string }[];
  crates: TourCrateView[];
  venues: { id: string; name: string; city: string }[];
}

// ------------------------------------------------------------------------------------ access matrix

export interface MatrixRowView {
  id: string;
  kind: 'crate' | 'section';
  code: string;
  name: string;
  lengthMm: number | null;
  widthMm: number | null;
  heightMm: number | null;
  grossKg: number | null;
  mayTilt: boolean;
  /** Why a figure is missing or an estimate (e.g. "mass incomplete: 3 gaps"). */
  note?: string;
}

export interface MatrixColumnView {
  venueId: string;
  engagementId: string;
  venueName: string;
  city: string;
  loadInOn: string;
  /** The vehicle whose bed height and tail lift the dock check uses. */
  vehicleName: string | null;
}

export type AccessFindingView = z.infer<typeof accessFinding>;

export interface MatrixCellView {
  rowId: string;
  engagementId: string;
  verdict: 'pass' | 'fail' | 'unknown';
  findings: AccessFindingView[];
  tightestText?: string;
}

export interface AccessMatrixView {
  rows: MatrixRowView[];
  columns: MatrixColumnView[];
  cells: MatrixCellView[];
  verdict: 'pass' | 'fail' | 'unknown';
  counts: { pass: number; fail: number; unknown: number };
}

// ---------------------------------------------------------------------------------------- mailing

export const sendManifestBody = z.object({
  /** Omitted: the venue's contacts that receive the manifest. */
  recipients: z.array(z.string().trim().toLowerCase().pipe(z.email({ message: 'Enter a valid e-mail address.' }))).max(20).optional(),
  message: text(4000).default(''),
});
export type SendManifestBody = z.infer<typeof sendManifestBody>;

export const inviteVenueStaffBody = z.object({
  email: z.string().trim().toLowerCase().pipe(z.email({ message: 'Enter a valid e-mail address.' })),
  name: text(120).min(1, 'Enter a name.'),
});
export type InviteVenueStaffBody = z.infer<typeof inviteVenueStaffBody>;

export interface MailingView {
  id: string;
  engagementId: string;
  kind: 'manifest' | 'invitation';
  recipient: string;
  recipientName: string;
  subject: string;
  status: 'sent' | 'failed';
  error: string | null;
  attempts: number;
  sentBy: string | null;
  createdAt: string;
  lastAttemptAt: string;
  /** Manifest: what changed since the previous manifest sent for this engagement. */
  changes: string[];
}

// --------------------------------------------------------------------------------------- check-in

export const scanDirection = z.enum(['in', 'out']);
export const scanState = z.enum(['arrived', 'damaged', 'missing']);

export const scanBody = z
  .object({
    /** Made up by the client for each scan; the same key sent again is the same scan. */
    idempotencyKey: z.string().trim().min(8, 'The scan key is too short (at least 8 characters).').max(100),
    /** The crate, ticked in a list... */
    crateId: uuid.optional(),
    /** ...or the text of its label's QR code. */
    code: z.string().trim().min(1).max(500).optional(),
    direction: scanDirection,
    state: scanState,
    note: text(1000).default(''),
    /** When the person scanned (the phone's clock); omitted: when the server receives it. */
    scannedAt: z.iso.datetime({ offset: true }).optional(),
  })
  .refine((b) => Boolean(b.crateId) !== Boolean(b.code), { message: 'Send either the crate id or the QR code text, not both.', path: ['crateId'] });
export type ScanBody = z.infer<typeof scanBody>;

export interface ScanView {
  id: string;
  engagementId: string;
  crateId: string;
  crateCode: string;
  direction: 'in' | 'out';
  state: 'arrived' | 'damaged' | 'missing';
  method: 'qr' | 'list';
  note: string;
  scannedBy: string | null;
  scannedByName: string | null;
  scannedAt: string;
  receivedAt: string;
  photos: { id: string; filename: string; sizeBytes: number }[];
}

export interface ExpectedCrateView {
  crateId: string;
  code: string;
  name: string;
  grossKg: number | null;
  /** The latest scan in each direction, or null. */
  in: { scanId: string; state: 'arrived' | 'damaged' | 'missing'; scannedAt: string; by: string | null; photoCount: number } | null;
  out: { scanId: string; state: 'arrived' | 'damaged' | 'missing'; scannedAt: string; by: string | null; photoCount: number } | null;
  /** On the leg that delivers to this engagement (false: checked in here without being expected). */
  expected: boolean;
  /** On the leg that leaves this engagement next. */
  onNextLeg: boolean;
}

export interface CheckSummary {
  expected: number;
  here: number;
  damaged: number;
  missing: number;
  notSeen: number;
  checkedOut: number;
}

export interface CheckStatusView {
  engagement: EngagementView;
  nextLeg: { id: string; departsOn: string | null; toVenueName: string } | null;
  crates: ExpectedCrateView[];
  summary: { in: CheckSummary; out: CheckSummary };
  /** Crates that missed this venue (or were not loaded out) and are due on the next leg. */
  flags: { crateId: string; code: string; message: string }[];
}

// ------------------------------------------------------------------------------------- crate labels

/**
 * What a crate label's QR code holds: the crate's address in the app at the production's public address
 * (APP_URL), `<APP_URL>/p/<productionId>/crates/<crateId>`, so a phone camera outside Ballast opens the
 * crate, and check-in can tell the production and the crate from it. Labels make the text with
 * `crateQrText`; check-in reads it with `parseCrateQr` (the server decides; the phone uses it to answer at
 * once, offline too).
 */
export function crateQrText(appUrl: string, productionId: string, crateId: string): string {
  return `${appUrl.replace(/\/+$/, '')}/p/${productionId}/crates/${crateId}`;
}

const UUID_RE = '[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}';
const CRATE_QR_RE = new RegExp(`/p/(${UUID_RE})/crates/(${UUID_RE})(?:[/?#]|$)`, 'i');

/** The production and crate named by a label's QR text, or null when it is not a Ballast crate label. */
export function parseCrateQr(text: string): { productionId: string; crateId: string } | null {
  const m = CRATE_QR_RE.exec(text.trim());
  return m ? { productionId: m[1].toLowerCase(), crateId: m[2].toLowerCase() } : null;
}

/**
 * A venue manifest as data: everything a PDF renderer, the CSV export, the e-mail and the manifest screen
 * show, computed once on the server (server/modules/tour/manifest.service.ts). Crates come in load-in
 * (unloading) order of the leg that delivers to the engagement; each carries its access-check result at
 * this venue (from the access core, with the truck the leg puts it on for the dock check).
 */
export interface ManifestCrate extends Omit<TourCrateView, 'id'> {
  loadOrder: number;
  crateId: string;
  /** Null while any content's mass is unknown. */
  netKg: number | null;
  vehicleName: string | null;
  access: { verdict: 'pass' | 'fail' | 'unknown'; tightestText: string | null; findings: AccessFindingView[] };
}

export interface ManifestData {
  generatedAt: string;
  production: { id: string; name: string; machineName: string; paperSize: 'A4' | 'Letter' };
  /** Units the paperwork of this venue is printed in. */
  units: 'metric' | 'imperial';
  engagement: EngagementView;
  venue: { id: string; name: string; city: string; country: string; address: string; contacts: VenueContact[] };
  leg: { id: string; departsOn: string | null; fromVenueName: string | null; vehicles: { id: string; code: string; name: string }[] } | null;
  crates: ManifestCrate[];
  totals: {
    crateCount: number;
    /** Sum of gross masses; null while any crate's gross is unknown (see knownGrossKg). */
    grossKg: number | null;
    knownGrossKg: number;
    unknownMassCount: number;
    tareKg: number;
    volumeM3: number;
  };
  access: { verdict: 'pass' | 'fail' | 'unknown'; pass: number; fail: number; unknown: number };
  hangingPoints: HangingPointView[];
  /** Lift plans that apply at this venue; filled once the lifting module publishes them. */
  liftPlans: { id: string; title: string; verdict: string }[];
  notes: string[];
}
