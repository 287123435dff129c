import { useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { Alert, Badge, Button, Card, CheckboxField, EmptyState, ErrorState, PageHeader, PageLoading, SelectField, TextField } from '../../../components/ui/index.ts';
import { errorMessage } from '../../../lib/api.ts';
import { useCurrentProduction, useMay } from '../../../lib/current-production.ts';
import { apiFieldErrors, type FieldErrors } from '../../../lib/form-errors.ts';
import { useUnits } from '../../../lib/use-units.ts';
import { useAddVehicle, useCrateChoices, useRuns, useStartRun, useVehicleCatalogue, useVehicles } from '../api/loads-api.ts';

/** `/p/:productionId/loads`: the production's vehicles and its packing runs. */
export function LoadsPage() {
  const { productionId } = useCurrentProduction();
  const mayEdit = useMay('crate.edit');
  const pid = productionId ?? '';
  return (
    <div className="flex flex-col gap-5">
      <PageHeader
        title="Vehicles and packing runs"
        description="Trucks and containers, and how the crates fill them."
        actions={
          <Link to="../crates" relative="path" className="font-semibold text-tide-700 underline">
            ← Crates
          </Link>
        }
      />
      <VehiclesCard productionId={pid} mayEdit={mayEdit} />
      {mayEdit && <NewRun productionId={pid} />}
      <RunsCard productionId={pid} />
    </div>
  );
}

function VehiclesCard({ productionId, mayEdit }: { productionId: string; mayEdit: boolean }) {
  const u = useUnits();
  const vehicles = useVehicles(productionId);
  const catalogue = useVehicleCatalogue(productionId);
  const add = useAddVehicle(productionId);
  const [code, setCode] = useState('');
  const [catalogueId, setCatalogueId] = useState('');
  const [errors, setErrors] = useState<FieldErrors>({});
  if (vehicles.isPending) return <PageLoading label="Loading vehicles…" />;
  if (vehicles.isError) return <ErrorState title="The vehicles could not be loaded" error={vehicles.error} onRetry={() => vehicles.refetch()} />;
  return (
    <Card title="Vehicles and containers">
      {vehicles.data.length === 0 ? (
        <EmptyState title="No vehicles yet">Add a semi-trailer, a container or a truck from the catalogue.</EmptyState>
      ) : (
        <ul className="grid gap-2 sm:grid-cols-2">
          {vehicles.data.map((v) => (
            <li key={v.id} className="rounded-control border border-ink-200 p-3 text-sm">
              <p className="font-semibold">
                {v.code} — {v.name}
              </p>
              <p>
                Inside {[v.spec.lengthMm, v.spec.widthMm, v.spec.heightMm].map((x) => u.formatLength(x)).join(' × ')}; door {v.spec.doorWidthMm ? u.formatLength(v.spec.doorWidthMm) : '—'} ×{' '}
                {v.spec.doorHeightMm ? u.formatLength(v.spec.doorHeightMm) : '—'}; payload {u.formatMass(v.spec.maxPayloadKg, 0)}
              </p>
              {v.spec.axles && <p className="text-ink-600">Axle groups: {v.spec.axles.kind === 'rigid' ? `${v.spec.axles.front.name}, ${v.spec.axles.rear.name}` : `${v.spec.axles.kingpin.name}, ${v.spec.axles.axles.name}`}</p>}
            </li>
          ))}
        </ul>
      )}
      {mayEdit && (
        <form
          noValidate
          aria-label="Add a vehicle"
          className="mt-4 grid items-end gap-3 sm:grid-cols-3"
          onSubmit={(e) => {
            e.preventDefault();
            add.mutate({ code, catalogueId }, { onSuccess: () => { setCode(''); setErrors({}); }, onError: (er) => setErrors(apiFieldErrors(er)) });
          }}
        >
          <TextField label="Code" name="vehicleCode" value={code} onChange={(e) => setCode(e.target.value)} error={errors.code} />
          <SelectField label="From the catalogue" name="catalogueId" value={catalogueId} onChange={(e) => setCatalogueId(e.target.value)} error={errors.catalogueId}>
            <option value="">Pick one…</option>
            {(catalogue.data ?? []).map((v) => (
              <option key={v.id} value={v.id}>
                {v.name}
              </option>
            ))}
          </SelectField>
          <Button type="submit" loading={add.isPending}>
            Add vehicle
          </Button>
        </form>
      )}
    </Card>
  );
}

function NewRun({ productionId }: { productionId: string }) {
  const navigate = useNavigate();
  const vehicles = useVehicles(productionId);
  const crates = useCrateChoices(productionId);
  const start = useStartRun(productionId);
  const [name, setName] = useState('');
  const [vehicleIds, setVehicleIds] = useState<string[]>([]);
  const [crateIds, setCrateIds] = useState<string[] | null>(null);
  const [seconds, setSeconds] = useState('3');
  const [errors, setErrors] = useState<FieldErrors>({});
  const packable = (crates.data ?? []).filter((c) => c.figures.massComplete);
  const chosen = crateIds ?? packable.map((c) => c.id);
  const toggle = (list: string[], id: string) => (list.includes(id) ? list.filter((x) => x !== id) : [...list, id]);
  return (
    <Card title="New packing run" description="Packs the chosen crates into the chosen vehicles, in the order given, on the server. Crates whose mass is not known cannot be packed.">
      <form
        noValidate
        aria-label="New packing run"
        className="flex flex-col gap-4"
        onSubmit={(e) => {
          e.preventDefault();
          setErrors({});
          start.mutate(
            { name, vehicleIds, crates: chosen.map((crateId) => ({ crateId })), timeLimitMs: Math.round((Number(seconds) || 3) * 1000) },
            { onSuccess: (run) => navigate(run.id), onError: (er) => setErrors(apiFieldErrors(er)) },
          );
        }}
      >
        <div className="grid gap-3 sm:grid-cols-2">
          <TextField label="Name" name="runName" value={name} onChange={(e) => setName(e.target.value)} error={errors.name} />
          <TextField label="Time budget (s)" name="seconds" inputMode="decimal" value={seconds} onChange={(e) => setSeconds(e.target.value)} error={errors.timeLimitMs} />
        </div>
        <fieldset>
          <legend className="text-sm font-semibold">Vehicles {errors.vehicleIds && <span className="text-danger-700">— {errors.vehicleIds}</span>}</legend>
          <div className="flex flex-wrap gap-3">
            {(vehicles.data ?? []).map((v) => (
              <CheckboxField key={v.id} label={`${v.code} ${v.name}`} checked={vehicleIds.includes(v.id)} onChange={() => setVehicleIds(toggle(vehicleIds, v.id))} />
            ))}
          </div>
        </fieldset>
        <fieldset>
          <legend className="text-sm font-semibold">Crates ({chosen.length}) {errors.crates && <span className="text-danger-700">— {errors.crates}</span>}</legend>
          <div className="flex flex-wrap gap-3">
            {packable.map((c) => (
              <CheckboxField key={c.id} label={c.code} checked={chosen.includes(c.id)} onChange={() => setCrateIds(toggle(chosen, c.id))} />
            ))}
          </div>
        </fieldset>
        {start.isError && Object.keys(apiFieldErrors(start.error)).length === 0 && <Alert tone="danger">{errorMessage(start.error)}</Alert>}
        <div>
          <Button type="submit" loading={start.isPending}>
            Start packing
          </Button>
        </div>
      </form>
    </Card>
  );
}

const STATUS_TONE = { queued: 'neutral', running: 'accent', done: 'ok', failed: 'danger' } as const;

function RunsCard({ productionId }: { productionId: string }) {
  const runs = useRuns(productionId);
  if (runs.isPending) return <PageLoading label="Loading runs…" />;
  if (runs.isError) return <ErrorState title="The packing runs could not be loaded" error={runs.error} onRetry={() => runs.refetch()} />;
  return (
    <Card title="Packing runs">
      {runs.data.length === 0 ? (
        <EmptyState title="No packing runs yet">Start one above.</EmptyState>
      ) : (
        <ul className="flex flex-col gap-2">
          {runs.data.map((r) => (
            <li key={r.id} className="flex flex-wrap items-center gap-3 text-sm">
              <Link to={r.id} className="font-semibold text-tide-700 underline">
                {r.name}
              </Link>
              <Badge tone={STATUS_TONE[r.status]}>{r.status}</Badge>
              {r.figures && (
                <span className="text-ink-600">
                  {r.figures.placedCount} placed, {r.figures.unplacedCount} not placed, {r.figures.vehiclesUsed} vehicle(s)
                </span>
              )}
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}
