import { useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { createEngagementBody, type CheckStatusView } from '@domain/contracts/tour.ts';
import { Alert, Badge, Button, buttonClasses, Card, EmptyState, ErrorState, PageHeader, PageLoading, SelectField, TextField } from '../../../components/ui/index.ts';
import { errorMessage } from '../../../lib/api.ts';
import { useCurrentProduction, useMay } from '../../../lib/current-production.ts';
import { apiFieldErrors, validate, type FieldErrors } from '../../../lib/form-errors.ts';
import { useTour, type TourView } from '../api/get-tour.ts';
import { useCheckStatuses } from '../api/get-check-status.ts';
import { useFailedMailings, useMailMutations } from '../api/manifest.ts';
import { useTourMutations } from '../api/tour-mutations.ts';
import { useCreateVenue, useVenues } from '../api/venues.ts';

/** `/p/:productionId/tour`: the engagements in order, what arrived where, and the venues. */
export function TourPage() {
  const { productionId, membership } = useCurrentProduction();
  const pid = productionId ?? '';
  const tour = useTour(pid);
  const mayEdit = useMay('tour.edit');
  const mayReadTour = useMay('tour.read');
  const statuses = useCheckStatuses(pid);
  return (
    <div className="flex flex-col gap-5">
      <PageHeader
        eyebrow={membership?.productionName}
        title="Tour & venues"
        description="Engagements in order, the legs between them, and what has been checked in where."
        actions={
          <>
            {mayReadTour && (
              <Link to="matrix" className={buttonClasses({ variant: 'secondary' })}>
                Access matrix
              </Link>
            )}
            <Link to="../check-in" relative="path" className={buttonClasses({ variant: 'primary' })}>
              Check-in
            </Link>
          </>
        }
      />
      {mayReadTour && <FailedMail productionId={pid} />}
      {tour.isPending ? (
        <PageLoading />
      ) : tour.isError ? (
        <ErrorState title="The tour could not be loaded" error={tour.error} onRetry={() => tour.refetch()} retrying={tour.isFetching} />
      ) : (
        <>
          <Engagements tour={tour.data} statuses={statuses.data ?? []} />
          {mayEdit && <AddEngagement productionId={pid} tour={tour.data} />}
          <Venues productionId={pid} />
        </>
      )}
    </div>
  );
}

function Engagements({ tour, statuses }: { tour: TourView; statuses: CheckStatusView[] }) {
  if (tour.engagements.length === 0) return <EmptyState title="No engagements yet">Add the first venue of the tour with its dates.</EmptyState>;
  return (
    <Card title="Engagements" description="In tour order. Open one for its manifest, e-mail and check-in.">
      <ol className="flex flex-col gap-3">
        {tour.engagements.map((e, i) => {
          const leg = tour.legs.find((l) => l.toEngagementId === e.id);
          const status = statuses.find((s) => s.engagement.id === e.id);
          return (
            <li key={e.id} className="rounded-control border border-ink-200 p-3">
              <div className="flex flex-wrap items-baseline justify-between gap-2">
                <h3 className="text-base font-semibold text-ink-900">
                  {i + 1}. <Link to={`engagements/${e.id}`} className="text-tide-700 underline">{e.venueName}</Link>
                  <span className="ml-2 text-sm font-normal text-ink-600">{e.venueCity}</span>
                </h3>
                <span className="text-sm text-ink-700">
                  load-in {e.loadInOn} · shows {e.showFirstOn}–{e.showLastOn} · load-out {e.loadOutOn}
                </span>
              </div>
              <p className="mt-1 text-sm text-ink-700">
                {leg
                  ? `Leg ${leg.departsOn ? `leaves ${leg.departsOn}` : '(date not set)'}; ${leg.vehicles.map((v) => v.name).join(', ') || 'no vehicle yet'}; ${leg.crates.length} crates.`
                  : 'No leg delivers here yet.'}
              </p>
              {status && (
                <p className="mt-1 flex flex-wrap gap-2 text-sm" aria-label={`Check-in at ${e.venueName}`}>
                  <Badge>expected {status.summary.in.expected}</Badge>
                  <Badge tone="ok">here {status.summary.in.here}</Badge>
                  {status.summary.in.missing > 0 && <Badge tone="danger">missing {status.summary.in.missing}</Badge>}
                  {status.summary.in.damaged > 0 && <Badge tone="caution">damaged {status.summary.in.damaged}</Badge>}
                  {status.summary.out.here > 0 && <Badge tone="accent">loaded out {status.summary.out.here}</Badge>}
                </p>
              )}
              {status?.flags.map((f) => (
                <p key={f.crateId} className="mt-1 text-sm font-semibold text-danger-700">
                  ⚑ {f.message}
                </p>
              ))}
            </li>
          );
        })}
      </ol>
    </Card>
  );
}

function AddEngagement({ productionId, tour }: { productionId: string; tour: TourView }) {
  const { createEngagement } = useTourMutations(productionId);
  const empty = { venueId: '', loadInOn: '', showFirstOn: '', showLastOn: '', loadOutOn: '' };
  const [values, setValues] = useState(empty);
  const [errors, setErrors] = useState<FieldErrors>({});
  function submit(ev: FormEvent) {
    ev.preventDefault();
    const checked = validate(createEngagementBody, values);
    if (!checked.ok) return setErrors(checked.errors);
    setErrors({});
    createEngagement.mutate(checked.data, { onSuccess: () => setValues(empty), onError: (e) => setErrors(apiFieldErrors(e)) });
  }
  const set = (k: keyof typeof empty) => (e: { target: { value: string } }) => setValues((v) => ({ ...v, [k]: e.target.value }));
  return (
    <Card title="Add an engagement">
      <form noValidate onSubmit={submit} className="grid gap-3 sm:grid-cols-2 lg:grid-cols-5">
        <SelectField label="Venue" value={values.venueId} onChange={set('venueId')} error={errors.venueId}>
          <option value="">Choose…</option>
          {tour.venues.map((v) => (
            <option key={v.id} value={v.id}>
              {v.name}
            </option>
          ))}
        </SelectField>
        <TextField label="Load-in" type="date" value={values.loadInOn} onChange={set('loadInOn')} error={errors.loadInOn} />
        <TextField label="First show" type="date" value={values.showFirstOn} onChange={set('showFirstOn')} error={errors.showFirstOn} />
        <TextField label="Last show" type="date" value={values.showLastOn} onChange={set('showLastOn')} error={errors.showLastOn} />
        <TextField label="Load-out" type="date" value={values.loadOutOn} onChange={set('loadOutOn')} error={errors.loadOutOn} />
        <div className="sm:col-span-2 lg:col-span-5">
          {createEngagement.isError && Object.keys(apiFieldErrors(createEngagement.error)).length === 0 && <Alert tone="danger">{errorMessage(createEngagement.error)}</Alert>}
          <Button type="submit" loading={createEngagement.isPending}>
            Add engagement
          </Button>
        </div>
      </form>
    </Card>
  );
}

function Venues({ productionId }: { productionId: string }) {
  const venues = useVenues(productionId);
  const mayEdit = useMay('tour.edit');
  const create = useCreateVenue(productionId);
  const [name, setName] = useState('');
  return (
    <Card title="Venues" description="Access data, contacts and hanging points of each venue.">
      {venues.isPending ? (
        <PageLoading />
      ) : venues.isError ? (
        <ErrorState error={venues.error} onRetry={() => venues.refetch()} />
      ) : (
        <ul className="grid gap-2 sm:grid-cols-2">
          {venues.data.map((v) => (
            <li key={v.id}>
              <Link to={`venues/${v.id}`} className="block rounded-control border border-ink-200 px-3 py-2 hover:bg-ink-50">
                <span className="font-semibold text-tide-700">{v.name}</span>
                <span className="block text-sm text-ink-600">
                  {v.city} · {v.access.doors.length} door{v.access.doors.length === 1 ? '' : 's'} on the route
                  {v.contacts.length ? ` · ${v.contacts.length} contact${v.contacts.length === 1 ? '' : 's'}` : ' · no contacts'}
                </span>
              </Link>
            </li>
          ))}
        </ul>
      )}
      {mayEdit && (
        <form
          className="mt-4 flex flex-wrap items-end gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            if (name.trim()) create.mutate({ name: name.trim() }, { onSuccess: () => setName('') });
          }}
        >
          <TextField label="New venue" value={name} onChange={(e) => setName(e.target.value)} error={create.isError ? errorMessage(create.error) : undefined} />
          <Button type="submit" variant="secondary" loading={create.isPending}>
            Add venue
          </Button>
        </form>
      )}
    </Card>
  );
}

function FailedMail({ productionId }: { productionId: string }) {
  const failed = useFailedMailings(productionId);
  const { retry } = useMailMutations(productionId, '');
  if (!failed.data?.length) return null;
  return (
    <Alert tone="danger" title={`${failed.data.length} e-mail${failed.data.length === 1 ? '' : 's'} could not be delivered`}>
      <ul className="mt-1 flex flex-col gap-2">
        {failed.data.map((m) => (
          <li key={m.id} className="flex flex-wrap items-center gap-2">
            <span>
              {m.kind === 'manifest' ? 'Manifest' : 'Invitation'} to {m.recipient}: {m.error}
            </span>
            <Button size="sm" variant="secondary" loading={retry.isPending && retry.variables === m.id} onClick={() => retry.mutate(m.id, { onSuccess: () => void failed.refetch() })}>
              Send again
            </Button>
          </li>
        ))}
      </ul>
    </Alert>
  );
}
