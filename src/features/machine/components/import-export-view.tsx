import { useEffect, useState, type FormEvent } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { defaultHeader } from '@domain/breakdown/index.ts';
import { BREAKDOWN_FIELDS, type BreakdownField } from '@domain/contracts/breakdown.ts';
import { formatNumber } from '@domain/units.ts';
import { Alert, Badge, Button, buttonClasses, Card, CheckboxField, Field, SelectField, controlClasses } from '../../../components/ui/index.ts';
import { errorMessage } from '../../../lib/api.ts';
import { useUnits } from '../../../lib/use-units.ts';
import { machineKeys } from '../api/keys.ts';
import {
  commitImport,
  exportUrl,
  getImportStatus,
  previewImport,
  uploadPartsList,
  type BreakdownImportOptions,
  type ImportPreview,
  type ImportStatus,
  type ImportUnits,
  type StagedImport,
} from '../api/import-parts.ts';
import { uploadedShare } from '../../../lib/upload.ts';

type Step = 'upload' | 'map' | 'preview' | 'done';
const PROBLEMS_SHOWN = 300;

/** Import of a parts list (upload → map columns → preview problems and diff → apply, with progress) and export. */
export function ImportExportView({ productionId, mayEdit }: { productionId: string; mayEdit: boolean }) {
  const u = useUnits();
  const [exportUnits, setExportUnits] = useState<ImportUnits>(u.system === 'imperial' ? { length: 'in', mass: 'lb' } : { length: 'mm', mass: 'kg' });
  return (
    <div className="flex flex-col gap-5">
      {mayEdit && <ImportWizard productionId={productionId} />}
      <Card title="Export the breakdown" description="Every part line with its mass, source, material, customs data, CoG and box. Text that a spreadsheet would run as a formula is neutralised; numbers stay numbers.">
        <div className="flex flex-wrap items-end gap-3">
          <UnitPickers units={exportUnits} onChange={setExportUnits} />
          <a className={buttonClasses({ variant: 'secondary' })} href={exportUrl(productionId, 'csv', exportUnits)} download>
            Download CSV
          </a>
          <a className={buttonClasses({ variant: 'secondary' })} href={exportUrl(productionId, 'xlsx', exportUnits)} download>
            Download XLSX
          </a>
        </div>
      </Card>
    </div>
  );
}

function UnitPickers({ units, onChange }: { units: ImportUnits; onChange: (u: ImportUnits) => void }) {
  return (
    <>
      <SelectField label="Lengths in" value={units.length} onChange={(e) => onChange({ ...units, length: e.target.value as ImportUnits['length'] })}>
        {(['mm', 'cm', 'm', 'in'] as const).map((x) => (
          <option key={x} value={x}>
            {x}
          </option>
        ))}
      </SelectField>
      <SelectField label="Masses in" value={units.mass} onChange={(e) => onChange({ ...units, mass: e.target.value as ImportUnits['mass'] })}>
        {(['kg', 'g', 'lb'] as const).map((x) => (
          <option key={x} value={x}>
            {x}
          </option>
        ))}
      </SelectField>
    </>
  );
}

function ImportWizard({ productionId }: { productionId: string }) {
  const queryClient = useQueryClient();
  const [step, setStep] = useState<Step>('upload');
  const [file, setFile] = useState<File | null>(null);
  const [uploadShare, setUploadShare] = useState<number | null>(null);
  const [staged, setStaged] = useState<StagedImport | null>(null);
  const [options, setOptions] = useState<BreakdownImportOptions | null>(null);
  const [preview, setPreview] = useState<ImportPreview | null>(null);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<unknown>(null);
  const [status, setStatus] = useState<ImportStatus | null>(null);
  const [result, setResult] = useState<ImportPreview | null>(null);

  // While the commit runs, poll its progress (written by the server outside the import's transaction).
  const committing = busy && step === 'preview' && staged !== null;
  useEffect(() => {
    if (!committing || !staged) return;
    const id = setInterval(() => {
      getImportStatus(productionId, staged.import.id).then(setStatus, () => undefined);
    }, 400);
    return () => clearInterval(id);
  }, [committing, productionId, staged]);

  async function upload(e: FormEvent) {
    e.preventDefault();
    if (!file) return setError(new Error('Choose a CSV or XLSX file first.'));
    setBusy(true);
    setError(null);
    setUploadShare(0);
    try {
      const s = await uploadPartsList(productionId, file, (p) => setUploadShare(uploadedShare(p)));
      setStaged(s);
      setOptions({ mapping: s.suggested.mapping as BreakdownImportOptions['mapping'], units: s.suggested.units, decimalSeparator: s.suggested.decimalSeparator, allowNewAssemblies: s.suggested.allowNewAssemblies });
      setStep('map');
    } catch (err) {
      setError(err);
    } finally {
      setBusy(false);
      setUploadShare(null);
    }
  }

  async function runPreview() {
    if (!staged || !options) return;
    setBusy(true);
    setError(null);
    try {
      setPreview(await previewImport(productionId, staged.import.id, options));
      setStep('preview');
    } catch (err) {
      setError(err);
    } finally {
      setBusy(false);
    }
  }

  async function apply() {
    if (!staged || !options) return;
    setBusy(true);
    setError(null);
    setStatus(null);
    try {
      setResult(await commitImport(productionId, staged.import.id, options));
      setStep('done');
      void queryClient.invalidateQueries({ queryKey: machineKeys.all(productionId) });
    } catch (err) {
      setError(err);
    } finally {
      setBusy(false);
    }
  }

  function restart() {
    setStep('upload');
    setFile(null);
    setStaged(null);
    setPreview(null);
    setResult(null);
    setError(null);
    setStatus(null);
  }

  const setMapping = (f: BreakdownField, header: string) =>
    setOptions((o) => {
      if (!o) return o;
      const mapping = { ...o.mapping } as Record<string, string>;
      if (header) mapping[f] = header;
      else delete mapping[f];
      return { ...o, mapping: mapping as BreakdownImportOptions['mapping'] };
    });

  return (
    <Card
      title="Import a parts list"
      description="CSV or XLSX. Map the columns, check every problem by row and column and what would change, then apply: all of it or nothing."
      actions={step !== 'upload' && <Button size="sm" variant="ghost" onClick={restart}>Start again</Button>}
    >
      <ol className="mb-4 flex flex-wrap gap-2 text-sm" aria-label="Import steps">
        {(['upload', 'map', 'preview', 'done'] as Step[]).map((s, i) => (
          <li key={s}>
            <Badge tone={s === step ? 'accent' : 'neutral'}>
              {i + 1}. {{ upload: 'Upload', map: 'Map columns', preview: 'Check and apply', done: 'Done' }[s]}
            </Badge>
          </li>
        ))}
      </ol>
      {error !== null && (
        <Alert tone="danger" title="That did not work" className="mb-4">
          <p>{errorMessage(error)}</p>
          {error instanceof Error && 'issues' in error && Array.isArray((error as { issues: unknown[] }).issues) && (
            <ul className="mt-1 max-h-48 list-disc overflow-auto pl-5 text-sm">
              {(error as unknown as { issues: { path: string; message: string }[] }).issues.slice(0, 50).map((i, k) => (
                <li key={k}>
                  {i.path}: {i.message}
                </li>
              ))}
            </ul>
          )}
        </Alert>
      )}

      {step === 'upload' && (
        <form onSubmit={upload} className="flex flex-col gap-4">
          <Field label="Parts list" hint="CSV (UTF-8) or XLSX, first row = column headers; up to 20 MB">
            {(control) => <input {...control} type="file" accept=".csv,.xlsx,text/csv,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet" className={controlClasses + ' py-2'} onChange={(e) => setFile(e.target.files?.[0] ?? null)} />}
          </Field>
          {uploadShare !== null && <progress className="w-full" max={1} value={uploadShare} aria-label="Upload progress" />}
          <div>
            <Button type="submit" loading={busy} disabled={!file}>
              Upload and read
            </Button>
          </div>
        </form>
      )}

      {step === 'map' && staged && options && (
        <div className="flex flex-col gap-4">
          <p className="text-ink-700">
            <span className="font-semibold">{staged.import.fileName}</span>: {formatNumber(staged.import.rowCount)} rows, {staged.import.headers.length} columns. Part number and quantity are required.
          </p>
          <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
            {BREAKDOWN_FIELDS.map((f) => (
              <SelectField key={f} label={defaultHeader(f, options.units)} value={options.mapping[f] ?? ''} onChange={(e) => setMapping(f, e.target.value)}>
                <option value="">{f === 'partNumber' || f === 'quantity' ? '— choose a column —' : '— not in the file —'}</option>
                {staged.import.headers.map((h) => (
                  <option key={h} value={h}>
                    {h}
                  </option>
                ))}
              </SelectField>
            ))}
          </div>
          <div className="flex flex-wrap items-end gap-3">
            <UnitPickers units={options.units} onChange={(units) => setOptions({ ...options, units })} />
            <SelectField label="Decimal separator" value={options.decimalSeparator ?? '.'} onChange={(e) => setOptions({ ...options, decimalSeparator: e.target.value as '.' | ',' })}>
              <option value=".">1,234.5</option>
              <option value=",">1.234,5</option>
            </SelectField>
            <CheckboxField label="Create unknown assemblies" hint="Otherwise a row naming an unknown assembly is a problem" checked={options.allowNewAssemblies ?? false} onChange={(e) => setOptions({ ...options, allowNewAssemblies: e.target.checked })} />
          </div>
          {staged.import.sample.length > 0 && (
            <div className="overflow-x-auto rounded-control border border-ink-200">
              <table className="w-full text-left text-sm">
                <caption className="px-2 py-1 text-left text-ink-600">First rows of the file</caption>
                <thead className="bg-ink-50">
                  <tr>
                    {staged.import.headers.map((h) => (
                      <th key={h} className="px-2 py-1 whitespace-nowrap">
                        {h}
                      </th>
                    ))}
                  </tr>
                </thead>
                <tbody>
                  {staged.import.sample.map((r, i) => (
                    <tr key={i} className="border-t border-ink-100">
                      {r.slice(0, staged.import.headers.length).map((c, j) => (
                        <td key={j} className="px-2 py-1 whitespace-nowrap">
                          {c}
                        </td>
                      ))}
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          )}
          <div>
            <Button onClick={runPreview} loading={busy} disabled={!options.mapping.partNumber || !options.mapping.quantity}>
              Check the file
            </Button>
          </div>
        </div>
      )}

      {step === 'preview' && preview && (
        <div className="flex flex-col gap-4">
          {preview.ok ? (
            <Alert tone="ok" title="The file is valid">
              {formatNumber(preview.rowCount)} rows read{preview.skippedBlankRows ? `, ${preview.skippedBlankRows} blank rows skipped` : ''}
              {preview.warningCount ? `; ${preview.warningCount} warnings below` : ''}.
            </Alert>
          ) : (
            <Alert tone="danger" title={`${formatNumber(preview.errorCount)} problems: nothing can be imported until they are fixed`}>
              {preview.diffProblem ?? 'Each is named by its row in the file and its column. Fix the file and upload it again, or change the mapping.'}
            </Alert>
          )}
          {preview.problems.length > 0 && (
            <div className="max-h-72 overflow-auto rounded-control border border-ink-200">
              <table className="w-full text-left text-sm">
                <caption className="sr-only">Problems in the file</caption>
                <thead className="sticky top-0 bg-ink-50">
                  <tr>
                    <th className="px-2 py-1">Row</th>
                    <th className="px-2 py-1">Column</th>
                    <th className="px-2 py-1">Problem</th>
                  </tr>
                </thead>
                <tbody>
                  {preview.problems.slice(0, PROBLEMS_SHOWN).map((p, i) => (
                    <tr key={i} className="border-t border-ink-100 align-top">
                      <td className="px-2 py-1 tabular-nums">{p.rowNumber}</td>
                      <td className="px-2 py-1">{p.column ?? '—'}</td>
                      <td className="px-2 py-1">
                        <Badge tone={p.severity === 'error' ? 'danger' : 'caution'} className="mr-2">
                          {p.severity}
                        </Badge>
                        {p.message}
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
              {preview.problems.length > PROBLEMS_SHOWN && <p className="p-2 text-sm text-ink-600">and {preview.problems.length - PROBLEMS_SHOWN} more</p>}
            </div>
          )}
          {preview.diff && <DiffSummary diff={preview.diff} newAssemblies={preview.newAssemblyNumbers} />}
          {busy && status && status.progressTotal > 0 && (
            <div>
              <progress className="w-full" max={status.progressTotal} value={status.progressDone} aria-label="Import progress" />
              <p className="text-sm text-ink-700">
                Writing {formatNumber(status.progressDone)} of {formatNumber(status.progressTotal)} changes…
              </p>
            </div>
          )}
          <div className="flex gap-2">
            <Button onClick={apply} loading={busy} disabled={!preview.ok || !preview.diff || preview.diff.addedCount + preview.diff.changedCount + preview.diff.removedCount === 0}>
              Apply the import
            </Button>
            <Button variant="ghost" onClick={() => setStep('map')} disabled={busy}>
              Change the mapping
            </Button>
          </div>
        </div>
      )}

      {step === 'done' && result?.diff && (
        <Alert tone="ok" title="Imported">
          {formatNumber(result.diff.addedCount)} lines added, {formatNumber(result.diff.changedCount)} changed, {formatNumber(result.diff.removedCount)} removed, {formatNumber(result.diff.unchangedCount)} unchanged.
        </Alert>
      )}
    </Card>
  );
}

function DiffSummary({ diff, newAssemblies }: { diff: NonNullable<ImportPreview['diff']>; newAssemblies: string[] }) {
  return (
    <div className="flex flex-col gap-3">
      <p className="font-semibold text-ink-900">
        Compared with the breakdown now: {formatNumber(diff.addedCount)} added, {formatNumber(diff.changedCount)} changed, {formatNumber(diff.removedCount)} removed, {formatNumber(diff.unchangedCount)} unchanged.
        {newAssemblies.length > 0 && ` New assemblies: ${newAssemblies.join(', ')}.`}
      </p>
      {diff.placementsDroppedCount > 0 && (
        <Alert tone="caution" title={`${formatNumber(diff.placementsDroppedCount)} placed line${diff.placementsDroppedCount === 1 ? '' : 's'} will lose their placements`}>
          <p className="text-sm">Their units fall back to one CoG (flagged approximate) until they are placed again.</p>
          <ul className="mt-1 max-h-32 overflow-auto text-sm">
            {diff.placementsDropped.map((d) => (
              <li key={`${d.assemblyNumber}/${d.partNumber}`}>
                <span className="font-semibold">{d.partNumber}</span>
                {d.assemblyNumber ? ` in ${d.assemblyNumber}` : ''}: {d.why}
              </li>
            ))}
          </ul>
        </Alert>
      )}
      {diff.changed.length > 0 && (
        <details open>
          <summary className="cursor-pointer font-semibold">Changed lines</summary>
          <ul className="mt-1 max-h-48 overflow-auto text-sm">
            {diff.changed.map((c) => (
              <li key={`${c.assemblyNumber}/${c.partNumber}`}>
                <span className="font-semibold">{c.partNumber}</span>
                {c.assemblyNumber ? ` in ${c.assemblyNumber}` : ''}: {c.fields.map((f) => `${f} ${show(c.before[f])} → ${show(c.after[f])}`).join('; ')}
              </li>
            ))}
          </ul>
        </details>
      )}
      {diff.added.length > 0 && (
        <details>
          <summary className="cursor-pointer font-semibold">Added lines</summary>
          <ul className="mt-1 max-h-48 overflow-auto text-sm">
            {diff.added.map((l) => (
              <li key={`${l.assemblyNumber}/${l.partNumber}`}>
                {l.partNumber} {l.name} × {l.quantity}
              </li>
            ))}
          </ul>
        </details>
      )}
      {diff.removed.length > 0 && (
        <details open>
          <summary className="cursor-pointer font-semibold text-danger-700">Removed lines (not in the file)</summary>
          <ul className="mt-1 max-h-48 overflow-auto text-sm">
            {diff.removed.map((l) => (
              <li key={`${l.assemblyNumber}/${l.partNumber}`}>
                {l.partNumber} {l.name}
              </li>
            ))}
          </ul>
        </details>
      )}
    </div>
  );
}

function show(v: unknown): string {
  if (v === null || v === undefined) return '—';
  if (typeof v === 'number') return String(Math.round(v * 1e6) / 1e6);
  return typeof v === 'string' ? v : JSON.stringify(v);
}

