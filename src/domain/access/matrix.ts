/**
 * Tour-wide access matrix: every crate against every venue, each cell with its findings and its
 * tightest point, and per venue and per crate the tightest point overall.
 */
import { checkCrateAccess, describeMargin, overallVerdict, tightestFinding } from './check.ts';
import type { AccessCrate, AccessFinding, AccessOptions, AccessResult, AccessVenue, AccessVerdict } from './types.ts';

export interface MatrixVenue {
  id: string;
  name?: string;
  access: AccessVenue;
  options?: AccessOptions;
  /**
   * The vehicle each crate arrives on, by crate id: its dock and tail-lift checks use that vehicle. A crate
   * not listed here is checked against each of `vehicles` when given (it may come on any of them) and the
   * worst result is kept; otherwise against `options.vehicle`.
   */
  crateVehicles?: Readonly<Record<string, NonNullable<AccessOptions['vehicle']>>>;
  vehicles?: readonly NonNullable<AccessOptions['vehicle']>[];
}

/** One crate at one venue, with the vehicle it comes on, or the worst over the vehicles it may come on. */
function checkCell(c: MatrixCrate, v: MatrixVenue): AccessResult {
  const own = v.crateVehicles?.[c.id];
  if (own) return checkCrateAccess(c, v.access, { ...v.options, vehicle: own });
  if (!v.vehicles?.length) return checkCrateAccess(c, v.access, v.options);
  const results = v.vehicles.map((vehicle) => checkCrateAccess(c, v.access, { ...v.options, vehicle }));
  const worst = overallVerdict(results);
  return results.find((r) => r.verdict === worst)!;
}

export interface MatrixCrate extends AccessCrate {
  id: string;
}

export interface MatrixCell {
  crateId: string;
  venueId: string;
  verdict: AccessVerdict;
  findings: AccessFinding[];
  /** The finding with the least room (fail first), e.g. the corridor door. */
  tightest?: AccessFinding;
  /** "corridor door: -50 mm" */
  tightestText?: string;
}

export interface MatrixSummary {
  id: string;
  verdict: AccessVerdict;
  /** The tightest cell of this row or column, and its finding. */
  tightest?: { crateId: string; venueId: string; finding: AccessFinding; text: string };
}

export interface AccessMatrix {
  cells: MatrixCell[];
  venues: MatrixSummary[];
  crates: MatrixSummary[];
  verdict: AccessVerdict;
}

function summarise(id: string, cells: MatrixCell[]): MatrixSummary {
  const withTight = cells.filter((c) => c.tightest);
  const tightest = tightestFinding(withTight.map((c) => c.tightest as AccessFinding));
  const cell = withTight.find((c) => c.tightest === tightest);
  return {
    id,
    verdict: overallVerdict(cells),
    tightest: cell && tightest ? { crateId: cell.crateId, venueId: cell.venueId, finding: tightest, text: describeMargin(tightest) } : undefined,
  };
}

/** Checks every crate against every venue (crates × venues cells, row-major by crate). */
export function accessMatrix(crates: readonly MatrixCrate[], venues: readonly MatrixVenue[]): AccessMatrix {
  const cells: MatrixCell[] = [];
  for (const c of crates) {
    for (const v of venues) {
      const r = checkCell(c, v);
      const t = tightestFinding(r.findings);
      cells.push({ crateId: c.id, venueId: v.id, verdict: r.verdict, findings: r.findings, tightest: t, tightestText: t ? describeMargin(t) : undefined });
    }
  }
  return {
    cells,
    venues: venues.map((v) => summarise(v.id, cells.filter((c) => c.venueId === v.id))),
    crates: crates.map((c) => summarise(c.id, cells.filter((x) => x.crateId === c.id))),
    verdict: overallVerdict(cells),
  };
}
