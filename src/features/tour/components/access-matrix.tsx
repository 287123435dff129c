import { useMemo, useState } from 'react';
import type { AccessMatrixView, MatrixCellView, MatrixColumnView, MatrixRowView } from '@domain/contracts/tour.ts';
import { Alert, Button, CheckboxField } from '../../../components/ui/index.ts';
import { cx } from '../../../lib/cx.ts';
import { useUnits } from '../../../lib/use-units.ts';
import { formatMargin, VERDICT_LABEL, VerdictBadge } from './verdict.tsx';

const CELL_TONE = {
  pass: 'bg-ok-50 text-ok-800 border-ok-300',
  fail: 'bg-danger-50 text-danger-800 border-danger-300',
  unknown: 'bg-caution-50 text-caution-800 border-caution-300 border-dashed',
} as const;

/**
 * The tour-wide access matrix: crates (and machine sections) down, engagements across. Each cell shows
 * the verdict in words and its tightest point with the margin; every failure is listed under the table
 * with its reason and margin, and every check that could not be made is listed with what is missing.
 */
export function AccessMatrix({ matrix }: { matrix: AccessMatrixView }) {
  const units = useUnits();
  const [onlyProblems, setOnlyProblems] = useState(false);
  const [selected, setSelected] = useState<{ rowId: string; engagementId: string } | null>(null);
  const cellOf = useMemo(() => new Map(matrix.cells.map((c) => [`${c.rowId}|${c.engagementId}`, c])), [matrix.cells]);
  const rows = onlyProblems ? matrix.rows.filter((r) => matrix.cells.some((c) => c.rowId === r.id && c.verdict !== 'pass')) : matrix.rows;
  const rowName = (id: string) => matrix.rows.find((r) => r.id === id)?.code ?? id;
  const colName = (id: string) => matrix.columns.find((c) => c.engagementId === id)?.venueName ?? id;
  const failures = matrix.cells.flatMap((c) => c.findings.filter((f) => f.verdict === 'fail').map((f) => ({ cell: c, f })));
  const unknowns = matrix.cells.flatMap((c) => c.findings.filter((f) => f.verdict === 'unknown').map((f) => ({ cell: c, f })));
  const chosen = selected ? cellOf.get(`${selected.rowId}|${selected.engagementId}`) : undefined;

  if (matrix.rows.length === 0 || matrix.columns.length === 0) {
    return (
      <Alert tone="neutral" title="Nothing to check yet">
        {matrix.rows.length === 0 ? 'There are no crates or sections in this production yet.' : 'The tour has no engagements yet.'}
      </Alert>
    );
  }

  const size = (r: MatrixRowView) =>
    r.lengthMm && r.widthMm && r.heightMm ? `${units.formatLength(r.lengthMm)} × ${units.formatLength(r.widthMm)} × ${units.formatLength(r.heightMm)}` : 'size unknown';

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-center gap-3" aria-label="Summary">
        <VerdictBadge verdict={matrix.verdict} />
        <span className="text-ink-700">
          {matrix.counts.fail} fail · {matrix.counts.unknown} not checked · {matrix.counts.pass} pass
        </span>
        <CheckboxField label="Only crates with problems" checked={onlyProblems} onChange={(e) => setOnlyProblems(e.target.checked)} />
      </div>
      <div className="overflow-x-auto rounded-panel border border-ink-200 bg-white">
        <table className="min-w-full border-collapse text-sm" aria-label="Access matrix: crates by venues">
          <thead>
            <tr>
              <th scope="col" className="sticky left-0 z-10 bg-ink-50 px-3 py-2 text-left font-semibold">
                Crate
              </th>
              {matrix.columns.map((c) => (
                <ColumnHead key={c.engagementId} column={c} />
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((r) => (
              <tr key={r.id} className="border-t border-ink-100">
                <th scope="row" className="sticky left-0 z-10 bg-white px-3 py-2 text-left align-top font-normal">
                  <span className="block font-semibold text-ink-900">
                    {r.code}
                    {r.kind === 'section' && <span className="ml-1 text-xs font-normal text-ink-600">(section)</span>}
                  </span>
                  <span className="block text-xs text-ink-600">
                    {size(r)} · {r.grossKg === null ? 'mass unknown' : units.formatMass(r.grossKg, 0)}
                    {r.mayTilt ? ' · may tilt' : ''}
                  </span>
                  {r.note && <span className="block text-xs text-caution-800">{r.note}</span>}
                </th>
                {matrix.columns.map((c) => {
                  const cell = cellOf.get(`${r.id}|${c.engagementId}`);
                  if (!cell) return <td key={c.engagementId} />;
                  const isSelected = selected?.rowId === r.id && selected.engagementId === c.engagementId;
                  return (
                    <td key={c.engagementId} className="px-1.5 py-1.5 align-top">
                      <button
                        type="button"
                        aria-pressed={isSelected}
                        aria-label={`${r.code} at ${c.venueName}: ${VERDICT_LABEL[cell.verdict]}${cell.tightestText ? ` (${cell.tightestText})` : ''}`}
                        onClick={() => setSelected(isSelected ? null : { rowId: r.id, engagementId: c.engagementId })}
                        className={cx('flex min-h-11 w-full min-w-32 flex-col items-start rounded-control border px-2 py-1 text-left', CELL_TONE[cell.verdict], isSelected && 'outline-3 outline-focus')}
                      >
                        <span className="font-semibold">{VERDICT_LABEL[cell.verdict]}</span>
                        {cell.tightestText && <span className="text-xs">{cell.tightestText}</span>}
                      </button>
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>

      {chosen && <CellDetail cell={chosen} rowCode={rowName(chosen.rowId)} venueName={colName(chosen.engagementId)} onClose={() => setSelected(null)} />}

      <section aria-labelledby="matrix-failures">
        <h2 id="matrix-failures" className="mb-2 text-lg font-semibold text-ink-900">
          Failures ({failures.length})
        </h2>
        {failures.length === 0 ? (
          <p className="text-ink-700">No check fails. Checks that could not be made are listed below.</p>
        ) : (
          <ul className="flex flex-col gap-1.5">
            {failures.map(({ cell, f }, i) => (
              <li key={i} className="rounded-control border border-danger-300 bg-danger-50 px-3 py-2 text-danger-800">
                <span className="font-semibold">
                  {rowName(cell.rowId)} at {colName(cell.engagementId)}
                </span>{' '}
                — {f.check}
                {f.where ? ` (${f.where})` : ''}: {f.reason}
                {formatMargin(f.margin, f.marginUnit) && <span className="font-semibold"> · margin {formatMargin(f.margin, f.marginUnit)}</span>}
              </li>
            ))}
          </ul>
        )}
      </section>

      <section aria-labelledby="matrix-unknowns">
        <h2 id="matrix-unknowns" className="mb-2 text-lg font-semibold text-ink-900">
          Not checked: data missing ({unknowns.length})
        </h2>
        {unknowns.length === 0 ? (
          <p className="text-ink-700">Every check could be made.</p>
        ) : (
          <details>
            <summary className="cursor-pointer text-tide-700">Show what is missing</summary>
            <ul className="mt-2 flex flex-col gap-1">
              {unknowns.map(({ cell, f }, i) => (
                <li key={i} className="rounded-control border border-dashed border-caution-300 bg-caution-50 px-3 py-1.5 text-caution-800">
                  <span className="font-semibold">
                    {rowName(cell.rowId)} at {colName(cell.engagementId)}
                  </span>{' '}
                  — {f.reason}
                </li>
              ))}
            </ul>
          </details>
        )}
      </section>
    </div>
  );
}

function ColumnHead({ column }: { column: MatrixColumnView }) {
  return (
    <th scope="col" className="bg-ink-50 px-2 py-2 text-left align-bottom font-semibold">
      <span className="block text-ink-900">{column.venueName}</span>
      <span className="block text-xs font-normal text-ink-600">
        {column.city}
        {column.loadInOn ? ` · ${column.loadInOn}` : ''}
      </span>
      {column.vehicleName && <span className="block text-xs font-normal text-ink-600">by {column.vehicleName}</span>}
    </th>
  );
}

function CellDetail({ cell, rowCode, venueName, onClose }: { cell: MatrixCellView; rowCode: string; venueName: string; onClose: () => void }) {
  return (
    <section aria-label={`Checks of ${rowCode} at ${venueName}`} className="rounded-panel border border-ink-200 bg-white p-4">
      <div className="mb-2 flex flex-wrap items-center justify-between gap-2">
        <h2 className="text-lg font-semibold text-ink-900">
          {rowCode} at {venueName} <VerdictBadge verdict={cell.verdict} className="ml-2" />
        </h2>
        <Button variant="ghost" size="sm" onClick={onClose}>
          Close
        </Button>
      </div>
      <ul className="flex flex-col gap-1.5">
        {cell.findings.map((f, i) => (
          <li key={i} className="flex flex-wrap items-baseline gap-2">
            <VerdictBadge verdict={f.verdict} />
            <span className="font-semibold">{f.where ?? f.check}</span>
            <span className="text-ink-800">{f.reason}</span>
            {formatMargin(f.margin, f.marginUnit) && <span className="text-ink-600">margin {formatMargin(f.margin, f.marginUnit)}</span>}
          </li>
        ))}
      </ul>
    </section>
  );
}
