import { useState } from 'react';
import type { MaterialView } from '@domain/contracts/machine.ts';
import { formatNumber } from '@domain/units.ts';
import { Alert, Button, EmptyState, TextField } from '../../../components/ui/index.ts';
import { errorMessage, staleCurrent } from '../../../lib/api.ts';
import { useMachineChange } from '../api/edit-machine.ts';

/** The production's materials and densities (seeded from the handbook table; planners may edit). */
export function MaterialsView({ productionId, materials, mayEdit }: { productionId: string; materials: MaterialView[]; mayEdit: boolean }) {
  const [editing, setEditing] = useState<string | null>(null);
  const [density, setDensity] = useState('');
  const change = useMachineChange(productionId);
  if (materials.length === 0) return <EmptyState title="No materials">Materials with their densities turn mesh volumes into masses.</EmptyState>;
  const stale = staleCurrent(change.error);
  return (
    <div className="flex flex-col gap-3">
      {change.isError && (
        <Alert tone={stale ? 'caution' : 'danger'} title={stale ? 'Someone else changed this material; the list shows theirs now.' : 'Not saved'}>
          {stale ? null : errorMessage(change.error)}
        </Alert>
      )}
      <div className="overflow-x-auto rounded-panel border border-ink-200 bg-white">
        <table className="w-full text-left text-sm">
          <thead className="bg-ink-50">
            <tr>
              <th className="px-3 py-2">Code</th>
              <th className="px-3 py-2">Name</th>
              <th className="px-3 py-2 text-right">Density (kg/m³)</th>
              <th className="px-3 py-2">Source</th>
              {mayEdit && <th className="px-3 py-2"><span className="sr-only">Actions</span></th>}
            </tr>
          </thead>
          <tbody>
            {materials.map((m) => (
              <tr key={m.id} className="border-t border-ink-100 align-top">
                <td className="px-3 py-2 font-semibold">{m.code}</td>
                <td className="px-3 py-2">{m.name}</td>
                <td className="px-3 py-2 text-right tabular-nums">
                  {editing === m.id ? (
                    <TextField label={`Density of ${m.name}`} inputMode="decimal" value={density} onChange={(e) => setDensity(e.target.value)} />
                  ) : (
                    formatNumber(m.densityKgPerM3)
                  )}
                </td>
                <td className="px-3 py-2 text-ink-700">{m.source}</td>
                {mayEdit && (
                  <td className="px-3 py-2 whitespace-nowrap">
                    {editing === m.id ? (
                      <span className="flex gap-1">
                        <Button
                          size="sm"
                          loading={change.isPending}
                          onClick={() => change.mutate({ kind: 'updateMaterial', id: m.id, body: { version: m.version, densityKgPerM3: Number(density) } }, { onSuccess: () => setEditing(null) })}
                        >
                          Save
                        </Button>
                        <Button size="sm" variant="ghost" onClick={() => setEditing(null)}>
                          Cancel
                        </Button>
                      </span>
                    ) : (
                      <Button size="sm" variant="ghost" onClick={() => (setEditing(m.id), setDensity(String(m.densityKgPerM3)), change.reset())}>
                        Edit density
                      </Button>
                    )}
                  </td>
                )}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
