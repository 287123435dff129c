import { useState, type FormEvent, type ReactNode } from 'react';
import { Link, useParams } from 'react-router-dom';
import type { VenueAccessData, VenueContact } from '@domain/contracts/tour.ts';
import { Alert, Button, Card, CheckboxField, ErrorState, PageHeader, PageLoading, SelectField, TextField } from '../../../components/ui/index.ts';
import { errorMessage } from '../../../lib/api.ts';
import { useCurrentProduction, useMay } from '../../../lib/current-production.ts';
import { apiFieldErrors, type FieldErrors } from '../../../lib/form-errors.ts';
import { useHangingPointMutations, useHangingPoints, useUpdateVenue, useVenue, useVenueCheck, venueConflict, type VenueView } from '../api/venues.ts';
import { AccessMatrix } from './access-matrix.tsx';
import { NumberInput } from './number-input.tsx';
import { useUnits } from '../../../lib/use-units.ts';

type Door = VenueAccessData['doors'][number];
type Lift = NonNullable<VenueAccessData['lift']>;
type Equipment = NonNullable<VenueAccessData['equipment']>[number];
type Ramp = NonNullable<VenueAccessData['ramps']>[number];

const HANDLING = [
  ['hand-pallet-truck', 'Hand pallet truck'],
  ['electric-pallet-truck', 'Electric pallet truck'],
  ['electric-lift-truck', 'Electric lift truck'],
  ['gas-forklift', 'Gas forklift'],
] as const;

/** `/p/:productionId/tour/venues/:venueId`: the venue's access data, contacts, hanging points and checks. */
export function VenuePage() {
  const { productionId, membership } = useCurrentProduction();
  const { venueId = '' } = useParams();
  const venue = useVenue(productionId ?? '', venueId);
  if (venue.isPending) return <PageLoading />;
  if (venue.isError) return <ErrorState title="The venue could not be loaded" error={venue.error} onRetry={() => venue.refetch()} retrying={venue.isFetching} />;
  return (
    <div className="flex flex-col gap-5">
      <PageHeader
        eyebrow={membership?.productionName}
        title={venue.data.name}
        description="Measure the clear openings on the way from the vehicle to the stage. Leave a box empty when you do not know: the check then says so instead of passing."
        actions={
          <Link to="../.." relative="path" className="text-tide-700 underline">
            Back to the tour
          </Link>
        }
      />
      <VenueForm key={venue.data.id} productionId={productionId ?? ''} venue={venue.data} />
      <HangingPoints productionId={productionId ?? ''} venueId={venueId} />
      <VenueCheck productionId={productionId ?? ''} venueId={venueId} />
    </div>
  );
}

function Section({ title, children }: { title: string; children: ReactNode }) {
  return (
    <fieldset className="flex flex-col gap-3 border-t border-ink-100 pt-4">
      <legend className="text-base font-semibold text-ink-900">{title}</legend>
      {children}
    </fieldset>
  );
}

function VenueForm({ productionId, venue }: { productionId: string; venue: VenueView }) {
  const may = useMay('venue.edit');
  const [base, setBase] = useState(venue);
  const [values, setValues] = useState(venue);
  const [errors, setErrors] = useState<FieldErrors>({});
  const update = useUpdateVenue(productionId, venue.id);
  const theirs = venueConflict(update.error);
  const a = values.access;
  const setAccess = (patch: Partial<VenueAccessData>) => setValues((v) => ({ ...v, access: { ...v.access, ...patch } }));
  const doors = a.doors;
  const lift = a.lift ?? null;
  const dock = a.dock ?? null;

  function save(from: VenueView, ev?: FormEvent) {
    ev?.preventDefault();
    setErrors({});
    update.mutate(
      { version: from.version, name: values.name, city: values.city, country: values.country, address: values.address, notes: values.notes, paperworkUnits: values.paperworkUnits, access: values.access, contacts: values.contacts },
      {
        onSuccess: (v) => {
          setBase(v);
          setValues(v);
        },
        onError: (e) => setErrors(apiFieldErrors(e)),
      },
    );
  }

  const setDoor = (i: number, patch: Partial<Door>) => setAccess({ doors: doors.map((d, j) => (j === i ? { ...d, ...patch } : d)) });
  const setLift = (patch: Partial<Lift>) => setAccess({ lift: { ...(lift as Lift), ...patch } });
  const equipment = a.equipment ?? [];
  const ramps = a.ramps ?? [];
  const contacts = values.contacts;
  const setContact = (i: number, patch: Partial<VenueContact>) => setValues((v) => ({ ...v, contacts: v.contacts.map((c, j) => (j === i ? { ...c, ...patch } : c)) }));

  return (
    <Card title="Access and contacts">
      <form noValidate onSubmit={(e) => save(base, e)} className="flex flex-col gap-5">
        {theirs && (
          <Alert
            tone="caution"
            title="Someone else saved this venue while you were editing"
            actions={
              <>
                <Button variant="secondary" onClick={() => { setBase(theirs); setValues(theirs); update.reset(); }}>
                  Reload their version
                </Button>
                <Button onClick={() => save(theirs)} loading={update.isPending}>
                  Keep mine
                </Button>
              </>
            }
          >
            Their version is {theirs.version}; yours started from {base.version}.
          </Alert>
        )}
        {update.isError && !theirs && <Alert tone="danger" title="Could not save">{errorMessage(update.error)} {Object.entries(errors).map(([k, m]) => `${k}: ${m}`).join('; ')}</Alert>}
        {update.isSuccess && <Alert tone="ok">Venue saved.</Alert>}
        <div className="grid gap-3 sm:grid-cols-3">
          <TextField label="Name" value={values.name} onChange={(e) => setValues((v) => ({ ...v, name: e.target.value }))} error={errors.name} disabled={!may} />
          <TextField label="City" value={values.city} onChange={(e) => setValues((v) => ({ ...v, city: e.target.value }))} disabled={!may} />
          <SelectField label="Paperwork units" value={values.paperworkUnits ?? ''} onChange={(e) => setValues((v) => ({ ...v, paperworkUnits: (e.target.value || null) as VenueView['paperworkUnits'] }))} disabled={!may}>
            <option value="">As the production</option>
            <option value="metric">Metric</option>
            <option value="imperial">Imperial</option>
          </SelectField>
        </div>
        <TextField label="Address for deliveries" value={values.address} onChange={(e) => setValues((v) => ({ ...v, address: e.target.value }))} disabled={!may} />

        <Section title="Doors and tight points on the route, in order">
          {doors.length === 0 && <p className="text-sm text-caution-800">No doors recorded: the door check says "door width unknown" for every crate.</p>}
          {doors.map((d, i) => (
            <div key={i} className="grid items-end gap-2 sm:grid-cols-[2fr_1fr_1fr_auto]">
              <TextField label={`Point ${i + 1} name`} value={d.name ?? ''} onChange={(e) => setDoor(i, { name: e.target.value })} disabled={!may} />
              <NumberInput label="Clear width" measure="length" value={d.widthMm} onChange={(v) => setDoor(i, { widthMm: v })} error={errors[`access.doors.${i}.widthMm`]} />
              <NumberInput label="Clear height" measure="length" value={d.heightMm} onChange={(v) => setDoor(i, { heightMm: v })} error={errors[`access.doors.${i}.heightMm`]} />
              {may && (
                <Button variant="ghost" onClick={() => setAccess({ doors: doors.filter((_, j) => j !== i) })}>
                  Remove
                </Button>
              )}
            </div>
          ))}
          {may && (
            <Button variant="secondary" className="w-fit" onClick={() => setAccess({ doors: [...doors, { name: '', widthMm: null, heightMm: null }] })}>
              Add a door
            </Button>
          )}
        </Section>

        <Section title="Unloading">
          <div className="grid gap-3 sm:grid-cols-3">
            <SelectField
              label="Dock"
              value={dock?.kind ?? ''}
              onChange={(e) => setAccess({ dock: e.target.value ? { ...(dock ?? {}), kind: e.target.value as 'dock' | 'street' } : null })}
              disabled={!may}
            >
              <option value="">Unknown</option>
              <option value="dock">Loading dock</option>
              <option value="street">Street level, no dock</option>
            </SelectField>
            {dock?.kind === 'dock' && (
              <>
                <NumberInput label="Dock height" measure="length" value={dock.heightMm} onChange={(v) => setAccess({ dock: { ...dock, heightMm: v } })} />
                <NumberInput label="Leveller reach ±" measure="length" value={dock.levellerRangeMm} onChange={(v) => setAccess({ dock: { ...dock, levellerRangeMm: v } })} />
              </>
            )}
          </div>
          <p className="text-sm font-semibold text-ink-800">Handling equipment on site</p>
          {equipment.map((e, i) => (
            <div key={i} className="grid items-end gap-2 sm:grid-cols-[2fr_1fr_auto]">
              <SelectField label="Kind" value={e.kind} onChange={(ev) => setAccess({ equipment: equipment.map((x, j) => (j === i ? { ...x, kind: ev.target.value as Equipment['kind'] } : x)) })} disabled={!may}>
                {HANDLING.map(([k, l]) => (
                  <option key={k} value={k}>
                    {l}
                  </option>
                ))}
              </SelectField>
              <NumberInput label="Capacity" measure="mass" value={e.capacityKg} onChange={(v) => setAccess({ equipment: equipment.map((x, j) => (j === i ? { ...x, capacityKg: v } : x)) })} />
              {may && (
                <Button variant="ghost" onClick={() => setAccess({ equipment: equipment.filter((_, j) => j !== i) })}>
                  Remove
                </Button>
              )}
            </div>
          ))}
          {may && (
            <Button variant="secondary" className="w-fit" onClick={() => setAccess({ equipment: [...equipment, { kind: 'hand-pallet-truck', capacityKg: null }] })}>
              Add equipment
            </Button>
          )}
          <NumberInput className="max-w-xs" label="Pallet truck riding into the lift" measure="mass" value={a.handlingEquipmentKg} onChange={(v) => setAccess({ handlingEquipmentKg: v })} />
          <p className="text-sm font-semibold text-ink-800">Ramps</p>
          {ramps.map((r: Ramp, i) => (
            <div key={i} className="grid items-end gap-2 sm:grid-cols-[2fr_1fr_auto]">
              <TextField label="Ramp name" value={r.name ?? ''} onChange={(e) => setAccess({ ramps: ramps.map((x, j) => (j === i ? { ...x, name: e.target.value } : x)) })} disabled={!may} />
              <NumberInput label="Gradient" unit="%" value={r.gradientPct} onChange={(v) => setAccess({ ramps: ramps.map((x, j) => (j === i ? { ...x, gradientPct: v } : x)) })} />
              {may && (
                <Button variant="ghost" onClick={() => setAccess({ ramps: ramps.filter((_, j) => j !== i) })}>
                  Remove
                </Button>
              )}
            </div>
          ))}
          {may && (
            <Button variant="secondary" className="w-fit" onClick={() => setAccess({ ramps: [...ramps, { name: '', gradientPct: null }] })}>
              Add a ramp
            </Button>
          )}
        </Section>

        <Section title="Freight lift">
          <CheckboxField
            label="There is a freight lift on the route"
            checked={Boolean(lift)}
            disabled={!may}
            onChange={(e) => setAccess({ lift: e.target.checked ? { name: 'freight lift', carLengthMm: null, carWidthMm: null, carHeightMm: null, doorWidthMm: null, doorHeightMm: null, ratedLoadKg: null, loadingClass: null } : null })}
          />
          {lift && (
            <div className="grid gap-3 sm:grid-cols-3">
              <NumberInput label="Car length" measure="length" value={lift.carLengthMm} onChange={(v) => setLift({ carLengthMm: v })} />
              <NumberInput label="Car width" measure="length" value={lift.carWidthMm} onChange={(v) => setLift({ carWidthMm: v })} />
              <NumberInput label="Car height" measure="length" value={lift.carHeightMm} onChange={(v) => setLift({ carHeightMm: v })} />
              <NumberInput label="Door width" measure="length" value={lift.doorWidthMm} onChange={(v) => setLift({ doorWidthMm: v })} />
              <NumberInput label="Door height" measure="length" value={lift.doorHeightMm} onChange={(v) => setLift({ doorHeightMm: v })} />
              <NumberInput label="Rated load" measure="mass" value={lift.ratedLoadKg} onChange={(v) => setLift({ ratedLoadKg: v })} />
              <SelectField label="Loading class" value={lift.loadingClass ?? ''} onChange={(e) => setLift({ loadingClass: (e.target.value || null) as Lift['loadingClass'] })} hint="Unknown is treated as class A." disabled={!may}>
                <option value="">Unknown</option>
                {['A', 'B', 'C1', 'C2', 'C3'].map((c) => (
                  <option key={c} value={c}>
                    {c}
                  </option>
                ))}
              </SelectField>
            </div>
          )}
        </Section>

        <Section title="Floors">
          <div className="grid gap-3 sm:grid-cols-3">
            <NumberInput label="Route floor rating" measure="pressure" value={a.floorRatingKnPerM2} onChange={(v) => setAccess({ floorRatingKnPerM2: v })} hint="The lowest on the way in." />
            <NumberInput label="Stage floor rating" measure="pressure" value={a.stageFloorRatingKnPerM2} onChange={(v) => setAccess({ stageFloorRatingKnPerM2: v })} />
            <NumberInput label="Point load rating" measure="force" value={a.pointLoadRatingKn} onChange={(v) => setAccess({ pointLoadRatingKn: v })} />
          </div>
        </Section>

        <Section title="Contacts">
          {contacts.map((c, i) => (
            <div key={i} className="grid items-end gap-2 sm:grid-cols-[1fr_1fr_1.3fr_1fr_auto]">
              <TextField label="Name" value={c.name} onChange={(e) => setContact(i, { name: e.target.value })} error={errors[`contacts.${i}.name`]} disabled={!may} />
              <TextField label="Role" value={c.role} onChange={(e) => setContact(i, { role: e.target.value })} disabled={!may} />
              <TextField label="E-mail" type="email" value={c.email} onChange={(e) => setContact(i, { email: e.target.value })} error={errors[`contacts.${i}.email`]} disabled={!may} />
              <TextField label="Phone" value={c.phone} onChange={(e) => setContact(i, { phone: e.target.value })} disabled={!may} />
              <div className="flex flex-col gap-1">
                <CheckboxField label="Gets the manifest" checked={c.receivesManifest} onChange={(e) => setContact(i, { receivesManifest: e.target.checked })} disabled={!may} />
                {may && (
                  <Button variant="ghost" size="sm" onClick={() => setValues((v) => ({ ...v, contacts: v.contacts.filter((_, j) => j !== i) }))}>
                    Remove
                  </Button>
                )}
              </div>
            </div>
          ))}
          {may && (
            <Button variant="secondary" className="w-fit" onClick={() => setValues((v) => ({ ...v, contacts: [...v.contacts, { name: '', role: '', email: '', phone: '', receivesManifest: true }] }))}>
              Add a contact
            </Button>
          )}
        </Section>
        <TextField label="Notes" value={values.notes} onChange={(e) => setValues((v) => ({ ...v, notes: e.target.value }))} disabled={!may} />
        {may && (
          <div>
            <Button type="submit" loading={update.isPending && !theirs} disabled={Boolean(theirs)}>
              Save venue
            </Button>
          </div>
        )}
      </form>
    </Card>
  );
}

function HangingPoints({ productionId, venueId }: { productionId: string; venueId: string }) {
  const points = useHangingPoints(productionId, venueId);
  const may = useMay('venue.edit');
  const u = useUnits();
  const { add, remove } = useHangingPointMutations(productionId, venueId);
  const [name, setName] = useState('');
  const [wll, setWll] = useState<number | null>(null);
  return (
    <Card title="Hanging points" description="For the lift plans: a point without a rating cannot be counted on.">
      {points.data?.length ? (
        <ul className="mb-3 flex flex-col gap-1">
          {points.data.map((p) => (
            <li key={p.id} className="flex flex-wrap items-center gap-3">
              <span className="font-semibold">{p.label}</span>
              <span>{p.ratingKg === null ? 'rating unknown' : `rated ${u.formatMass(p.ratingKg)}`}</span>
              {p.notes && <span className="text-ink-600">{p.notes}</span>}
              {may && (
                <Button size="sm" variant="ghost" onClick={() => remove.mutate(p.id)}>
                  Remove
                </Button>
              )}
            </li>
          ))}
        </ul>
      ) : (
        <p className="mb-3 text-ink-700">No hanging points recorded.</p>
      )}
      {may && (
        <form
          className="flex flex-wrap items-end gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            add.mutate({ label: name, ratingKg: wll }, { onSuccess: () => setName('') });
          }}
        >
          <TextField label="Point name" value={name} onChange={(e) => setName(e.target.value)} />
          <NumberInput label="Rating" measure="mass" value={wll} onChange={setWll} />
          <Button type="submit" variant="secondary" loading={add.isPending}>
            Add point
          </Button>
          {add.isError && <Alert tone="danger">{errorMessage(add.error)}</Alert>}
        </form>
      )}
    </Card>
  );
}

function VenueCheck({ productionId, venueId }: { productionId: string; venueId: string }) {
  const check = useVenueCheck(productionId, venueId);
  return (
    <Card title="Every crate at this venue" description="Without the delivering vehicle; the tour's access matrix checks the dock against each leg's vehicle.">
      {check.isPending ? <PageLoading /> : check.isError ? <ErrorState error={check.error} onRetry={() => check.refetch()} /> : <AccessMatrix matrix={check.data} />}
    </Card>
  );
}
