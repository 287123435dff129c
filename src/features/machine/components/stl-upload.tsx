import { useState, type FormEvent } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { meshView, partLineView, stlUnit, type MaterialView, type MeshView, type PartLineView } from '@domain/contracts/machine.ts';
import { formatNumber } from '@domain/units.ts';
import { Alert, Button, ChoiceGroup, Field, SelectField, controlClasses } from '../../../components/ui/index.ts';
import { errorMessage } from '../../../lib/api.ts';
import { useUnits } from '../../../lib/use-units.ts';
import { machineKeys, machinePath } from '../api/keys.ts';
import { uploadedShare, uploadFile } from '../../../lib/upload.ts';
import type { z } from 'zod';

type StlUnit = z.infer<typeof stlUnit>;

/**
 * Uploads an STL for a made part. STL has no unit, so the person says which one the file was drawn in. The
 * server refuses an open mesh with the reason, and turns an inside-out one right side out.
 */
export function StlUpload({ productionId, line, materials, onUploaded }: { productionId: string; line: PartLineView; materials: MaterialView[]; onUploaded: (line: PartLineView) => void }) {
  const u = useUnits();
  const queryClient = useQueryClient();
  const [file, setFile] = useState<File | null>(null);
  const [unit, setUnit] = useState<StlUnit>('mm');
  const [material, setMaterial] = useState(line.material ?? '');
  const [progress, setProgress] = useState<number | null>(null);
  const [error, setError] = useState<unknown>(null);
  const [result, setResult] = useState<{ mesh: MeshView; notes: string[] } | null>(null);

  async function submit(e: FormEvent) {
    e.preventDefault();
    if (!file) return setError(new Error('Choose an STL file first.'));
    setError(null);
    setResult(null);
    setProgress(0);
    try {
      const res = await uploadFile<{ mesh: unknown; line: unknown; notes: string[] }>(
        machinePath(productionId, `/lines/${encodeURIComponent(line.id)}/mesh`),
        file,
        file.name,
        { unit, ...(material ? { material } : {}) },
        (p) => setProgress(uploadedShare(p)),
      );
      setResult({ mesh: meshView.parse(res.mesh), notes: res.notes });
      onUploaded(partLineView.parse(res.line));
      void queryClient.invalidateQueries({ queryKey: machineKeys.all(productionId) });
    } catch (err) {
      setError(err);
    } finally {
      setProgress(null);
    }
  }

  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-3" aria-label="Upload a mesh">
      <h3 className="font-semibold text-ink-900">Mesh (STL)</h3>
      <Field label="STL file" hint="Binary or ASCII; up to 64 MB">
        {(control) => <input {...control} type="file" accept=".stl,model/stl" className={controlClasses + ' py-2'} onChange={(e) => setFile(e.target.files?.[0] ?? null)} />}
      </Field>
      <ChoiceGroup
        legend="The file is drawn in"
        name={`stl-unit-${line.id}`}
        value={unit}
        onChange={setUnit}
        choices={stlUnit.options.map((v) => ({ value: v, label: v }))}
      />
      <SelectField label="Material (for the mass)" value={material} onChange={(e) => setMaterial(e.target.value)}>
        <option value="">none: geometry only</option>
        {materials.map((m) => (
          <option key={m.id} value={m.code}>
            {m.name} ({formatNumber(m.densityKgPerM3)} kg/m³)
          </option>
        ))}
      </SelectField>
      {progress !== null && (
        <progress className="w-full accent-tide-600" max={1} value={progress} aria-label="Upload progress">
          {Math.round(progress * 100)} %
        </progress>
      )}
      {error !== null && <Alert tone="danger" title="The mesh was not taken">{errorMessage(error)}</Alert>}
      {result && (
        <Alert tone="ok" title={`${result.mesh.fileName}: ${formatNumber(result.mesh.triangleCount)} triangles`}>
          <p className="text-sm">
            Volume {formatNumber(result.mesh.volumeMm3 / 1e9, 6)} m³{result.mesh.massKg !== null ? `, mass ${u.formatMass(result.mesh.massKg, 3)}` : ''}, CoG{' '}
            {result.mesh.cogMm.map((v) => u.formatLength(v)).join(', ')}.
          </p>
          {result.notes.map((n) => (
            <p key={n} className="text-sm">
              {n}
            </p>
          ))}
        </Alert>
      )}
      <div>
        <Button type="submit" variant="secondary" loading={progress !== null} disabled={!file}>
          Upload mesh
        </Button>
      </div>
    </form>
  );
}
