import { useState, type FormEvent } from 'react';
import { Link, useParams } from 'react-router-dom';
import { Alert, Badge, Button, buttonClasses, Card, CheckboxField, ErrorState, PageHeader, PageLoading, TextField } from '../../../components/ui/index.ts';
import { errorMessage, isApiError } from '../../../lib/api.ts';
import { useCurrentProduction, useMay } from '../../../lib/current-production.ts';
import { apiFieldErrors } from '../../../lib/form-errors.ts';
import { useUnits } from '../../../lib/use-units.ts';
import { useTour, type TourView } from '../api/get-tour.ts';
import { manifestCsvHref, manifestPdfHref, scanPhotoSrc, useEngagementCheck, useMailings, useMailMutations, useManifest, useScans } from '../api/manifest.ts';
import { useTourMutations } from '../api/tour-mutations.ts';
import { VerdictBadge } from './verdict.tsx';

/** `/p/:productionId/tour/engagements/:engagementId`: dates, the leg that delivers, manifest, e-mail, check-in. */
export function EngagementPage() {
  const { productionId, membership } = useCurrentProduction();
  const { engagementId = '' } = useParams();
  const pid = productionId ?? '';
  const tour = useTour(pid);
  const mayEdit = useMay('tour.edit');
  const maySend = useMay('engagement.send');
  const mayReadTour = useMay('tour.read');
  const engagement = tour.data?.engagements.find((e) => e.id === engagementId);
  if (tour.isPending) return <PageLoading />;
  if (tour.isError) return <ErrorState title="The tour could not be loaded" error={tour.error} onRetry={() => tour.refetch()} />;
  if (!engagement) return <ErrorState title="No such engagement" error={undefined} action={<Link to="../.." relative="path">Back to the tour</Link>} />;
  return (
    <div className="flex flex-col gap-5">
      <PageHeader
        eyebrow={membership?.productionName}
        title={`${engagement.venueName}, ${engagement.venueCity}`}
        description={`Load-in ${engagement.loadInOn} · shows ${engagement.showFirstOn} to ${engagement.showLastOn} · load-out ${engagement.loadOutOn}`}
        actions={
          <>
            <Link to="../.." relative="path" className={buttonClasses({ variant: 'ghost' })}>
              Tour
            </Link>
            <Link to={`../../../check-in/${engagement.id}`} relative="path" className={buttonClasses({ variant: 'primary' })}>
              Check crates in or out
            </Link>
          </>
        }
      />
      <CheckCard productionId={pid} engagementId={engagement.id} />
      {mayEdit && <LegEditor productionId={pid} tour={tour.data} engagementId={engagement.id} />}
      <ManifestCard productionId={pid} engagementId={engagement.id} />
      {maySend && <SendCard productionId={pid} engagementId={engagement.id} />}
      {mayReadTour && <DeliveryLog productionId={pid} engagementId={engagement.id} />}
    </div>
  );
}

function CheckCard({ productionId, engagementId }: { productionId: string; engagementId: string }) {
  const check = useEngagementCheck(productionId, engagementId);
  if (!check.data) return null;
  const s = check.data.summary;
  return (
    <Card title="Check-in" description={check.data.nextLeg ? `Next leg to ${check.data.nextLeg.toVenueName}${check.data.nextLeg.departsOn ? `, leaving ${check.data.nextLeg.departsOn}` : ''}.` : 'Last engagement of the tour.'}>
      <p className="flex flex-wrap gap-2">
        <Badge>expected {s.in.expected}</Badge>
        <Badge tone="ok">here {s.in.here}</Badge>
        <Badge tone={s.in.missing ? 'danger' : 'neutral'}>missing {s.in.missing}</Badge>
        <Badge tone={s.in.damaged ? 'caution' : 'neutral'}>damaged {s.in.damaged}</Badge>
        <Badge>not seen {s.in.notSeen}</Badge>
        <Badge tone="accent">loaded out {s.out.here}</Badge>
      </p>
      {check.data.flags.length > 0 && (
        <Alert tone="danger" title="Before the next leg leaves" className="mt-3">
          <ul>
            {check.data.flags.map((f) => (
              <li key={f.crateId + f.message}>{f.message}</li>
            ))}
          </ul>
        </Alert>
      )}
      <DamageReports productionId={productionId} engagementId={engagementId} />
    </Card>
  );
}

/** Damaged and missing crates as reported, with who, when, the note and the photos. */
function DamageReports({ productionId, engagementId }: { productionId: string; engagementId: string }) {
  const scans = useScans(productionId, engagementId);
  const reports = (scans.data ?? []).filter((s) => s.state !== 'arrived');
  if (reports.length === 0) return null;
  return (
    <section aria-label="Damage and missing reports" className="mt-4">
      <h3 className="mb-2 font-semibold text-ink-900">Reports</h3>
      <ul className="flex flex-col gap-2">
        {reports.map((s) => (
          <li key={s.id} className="rounded-control border border-ink-200 px-3 py-2 text-sm">
            <span className="font-semibold">{s.crateCode}</span> {s.state} at {s.direction === 'in' ? 'check-in' : 'load-out'} · {new Date(s.scannedAt).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short' })}
            {s.scannedByName ? ` by ${s.scannedByName}` : ''}
            {s.note && <span className="block text-ink-700">{s.note}</span>}
            {s.photos.length > 0 && (
              <span className="mt-1 flex flex-wrap gap-2">
                {s.photos.map((p) => (
                  <a key={p.id} href={scanPhotoSrc(productionId, engagementId, s.id, p.id)} target="_blank" rel="noreferrer">
                    <img src={scanPhotoSrc(productionId, engagementId, s.id, p.id)} alt={`Damage to ${s.crateCode}: ${p.filename}`} className="h-20 w-20 rounded-control object-cover" loading="lazy" />
                  </a>
                ))}
              </span>
            )}
          </li>
        ))}
      </ul>
    </section>
  );
}

function LegEditor({ productionId, tour, engagementId }: { productionId: string; tour: TourView; engagementId: string }) {
  const leg = tour.legs.find((l) => l.toEngagementId === engagementId);
  const index = tour.engagements.findIndex((e) => e.id === engagementId);
  const previous = index > 0 ? tour.engagements[index - 1] : undefined;
  const { createLeg, updateLeg } = useTourMutations(productionId);
  const [departsOn, setDepartsOn] = useState(leg?.departsOn ?? '');
  const [vehicleIds, setVehicleIds] = useState<string[]>(leg?.vehicles.map((v) => v.id) ?? []);
  const [crateIds, setCrateIds] = useState<string[]>(leg?.crates.map((c) => c.crateId) ?? tour.crates.map((c) => c.id));
  const mutation = leg ? updateLeg : createLeg;
  const conflict = isApiError(updateLeg.error, 'conflict');
  const toggle = (list: string[], id: string) => (list.includes(id) ? list.filter((x) => x !== id) : [...list, id]);
  function save(ev: FormEvent) {
    ev.preventDefault();
    if (leg) {
      updateLeg.mutate({ id: leg.id, version: leg.version, departsOn: departsOn || null, vehicleIds, crates: crateIds.map((crateId) => ({ crateId, vehicleId: null })) });
    } else {
      createLeg.mutate({ toEngagementId: engagementId, fromEngagementId: previous?.id ?? null, departsOn: departsOn || null, vehicleIds, crateIds });
    }
  }
  return (
    <Card title="Leg to this engagement" description={`From ${previous ? previous.venueName : 'the workshop'}. Crates left unticked stay behind or travel another way.`}>
      <form onSubmit={save} className="flex flex-col gap-4">
        {conflict && (
          <Alert tone="caution" title="Someone else changed this leg while you were editing">
            Reload the page to see their version, then make your change again.
          </Alert>
        )}
        {mutation.isError && !conflict && <Alert tone="danger">{errorMessage(mutation.error)}</Alert>}
        <TextField label="Leaves on" type="date" value={departsOn} onChange={(e) => setDepartsOn(e.target.value)} className="max-w-xs" />
        <fieldset>
          <legend className="mb-1 text-sm font-semibold text-ink-800">Vehicles (the first one's bed height and tail lift count at the dock)</legend>
          {tour.vehicles.length === 0 && <p className="text-sm text-ink-600">No vehicles in this production yet (Crates &amp; loads).</p>}
          <div className="flex flex-wrap gap-4">
            {tour.vehicles.map((v) => (
              <CheckboxField key={v.id} label={`${v.code} ${v.name}`} checked={vehicleIds.includes(v.id)} onChange={() => setVehicleIds((l) => toggle(l, v.id))} />
            ))}
          </div>
        </fieldset>
        <fieldset>
          <legend className="mb-1 text-sm font-semibold text-ink-800">Crates on this leg ({crateIds.length} of {tour.crates.length})</legend>
          <div className="grid gap-2 sm:grid-cols-3">
            {tour.crates.map((c) => (
              <CheckboxField key={c.id} label={`${c.code} ${c.name}`} checked={crateIds.includes(c.id)} onChange={() => setCrateIds((l) => toggle(l, c.id))} />
            ))}
          </div>
        </fieldset>
        <div>
          <Button type="submit" loading={mutation.isPending}>
            {leg ? 'Save the leg' : 'Create the leg'}
          </Button>
          {mutation.isSuccess && <span className="ml-3 text-ok-700">Saved.</span>}
        </div>
      </form>
    </Card>
  );
}

function ManifestCard({ productionId, engagementId }: { productionId: string; engagementId: string }) {
  const manifest = useManifest(productionId, engagementId);
  const units = useUnits();
  if (manifest.isPending) return <PageLoading />;
  if (manifest.isError) return <ErrorState title="The manifest could not be loaded" error={manifest.error} onRetry={() => manifest.refetch()} />;
  const m = manifest.data;
  return (
    <Card
      title="Manifest"
      description={`${m.totals.crateCount} crates · ${m.totals.grossKg === null ? `at least ${units.formatMass(m.totals.knownGrossKg, 0)} (${m.totals.unknownMassCount} without a known mass)` : units.formatMass(m.totals.grossKg, 0)} · ${m.totals.volumeM3.toFixed(1)} m³`}
      actions={
        <>
          <a href={manifestPdfHref(productionId, engagementId)} className={buttonClasses({ variant: 'secondary', size: 'sm' })} download>
            Download PDF
          </a>
          <a href={manifestCsvHref(productionId, engagementId)} className={buttonClasses({ variant: 'secondary', size: 'sm' })} download>
            Download CSV
          </a>
        </>
      }
    >
      {m.notes.map((n) => (
        <Alert key={n} tone="caution" className="mb-3">
          {n}
        </Alert>
      ))}
      <p className="mb-3 flex flex-wrap items-center gap-2 text-sm">
        Access at this venue: <VerdictBadge verdict={m.access.verdict} /> {m.access.fail} fail · {m.access.unknown} not checked · {m.access.pass} pass
      </p>
      <div className="overflow-x-auto">
        <table className="min-w-full text-left text-sm" aria-label="Crates in unloading order">
          <thead>
            <tr className="border-b border-ink-200">
              <th className="py-1 pr-3">#</th>
              <th className="py-1 pr-3">Crate</th>
              <th className="py-1 pr-3">Size</th>
              <th className="py-1 pr-3">Gross</th>
              <th className="py-1">Access</th>
            </tr>
          </thead>
          <tbody>
            {m.crates.map((c) => (
              <tr key={c.crateId} className="border-b border-ink-100 align-top">
                <td className="py-1 pr-3">{c.loadOrder}</td>
                <td className="py-1 pr-3">
                  <span className="font-semibold">{c.code}</span> {c.name}
                </td>
                <td className="py-1 pr-3">
                  {units.formatLength(c.lengthMm)} × {units.formatLength(c.widthMm)} × {units.formatLength(c.heightMm)}
                </td>
                <td className="py-1 pr-3">{c.grossKg === null ? 'unknown' : units.formatMass(c.grossKg, 0)}</td>
                <td className="py-1">
                  <VerdictBadge verdict={c.access.verdict} />
                  {c.access.findings
                    .filter((f) => f.verdict !== 'pass')
                    .map((f, i) => (
                      <span key={i} className="block text-xs text-ink-700">
                        {f.reason}
                      </span>
                    ))}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {m.venue.contacts.length > 0 && (
        <p className="mt-3 text-sm text-ink-700">
          Contacts: {m.venue.contacts.map((c) => `${c.name}${c.role ? ` (${c.role})` : ''}${c.email ? ` <${c.email}>` : ''}${c.phone ? ` ${c.phone}` : ''}`).join('; ')}
        </p>
      )}
    </Card>
  );
}

function SendCard({ productionId, engagementId }: { productionId: string; engagementId: string }) {
  const { send, invite } = useMailMutations(productionId, engagementId);
  const [recipients, setRecipients] = useState('');
  const [message, setMessage] = useState('');
  const [guest, setGuest] = useState({ email: '', name: '' });
  const inviteErrors = apiFieldErrors(invite.error);
  return (
    <Card title="E-mail the venue" description="The manifest goes with its crate list (CSV). A resend says what changed since the last one.">
      <form
        className="flex flex-col gap-3"
        onSubmit={(e) => {
          e.preventDefault();
          const list = recipients.split(/[,;\s]+/).filter(Boolean);
          send.mutate({ recipients: list.length ? list : undefined, message });
        }}
      >
        <TextField label="To" hint="Leave empty to send to the venue's contacts that receive the manifest." value={recipients} onChange={(e) => setRecipients(e.target.value)} />
        <TextField label="Message" value={message} onChange={(e) => setMessage(e.target.value)} />
        {send.isError && <Alert tone="danger">{errorMessage(send.error)}</Alert>}
        {send.data && (
          <Alert tone={send.data.every((m) => m.status === 'sent') ? 'ok' : 'danger'}>
            {send.data.map((m) => `${m.recipient}: ${m.status === 'sent' ? 'sent' : `not delivered (${m.error})`}`).join('; ')}
          </Alert>
        )}
        <div>
          <Button type="submit" loading={send.isPending}>
            Send the manifest
          </Button>
        </div>
      </form>
      <form
        className="mt-5 flex flex-wrap items-end gap-3 border-t border-ink-100 pt-4"
        onSubmit={(e) => {
          e.preventDefault();
          invite.mutate(guest, { onSuccess: () => setGuest({ email: '', name: '' }) });
        }}
      >
        <TextField label="Invite venue staff: name" value={guest.name} onChange={(e) => setGuest((g) => ({ ...g, name: e.target.value }))} error={inviteErrors.name} />
        <TextField label="E-mail" type="email" value={guest.email} onChange={(e) => setGuest((g) => ({ ...g, email: e.target.value }))} error={inviteErrors.email} />
        <Button type="submit" variant="secondary" loading={invite.isPending}>
          Send invitation
        </Button>
        {invite.isError && !inviteErrors.email && !inviteErrors.name && <Alert tone="danger">{errorMessage(invite.error)}</Alert>}
        {invite.data && <Alert tone={invite.data.status === 'sent' ? 'ok' : 'danger'}>{invite.data.status === 'sent' ? `Invitation sent to ${invite.data.recipient}.` : `Not delivered: ${invite.data.error}`}</Alert>}
      </form>
    </Card>
  );
}

function DeliveryLog({ productionId, engagementId }: { productionId: string; engagementId: string }) {
  const log = useMailings(productionId, engagementId);
  const { retry } = useMailMutations(productionId, engagementId);
  const maySend = useMay('engagement.send');
  return (
    <Card title="Delivery log">
      {log.isPending ? (
        <PageLoading />
      ) : log.isError ? (
        <ErrorState error={log.error} onRetry={() => log.refetch()} />
      ) : log.data.length === 0 ? (
        <p className="text-ink-700">Nothing sent yet.</p>
      ) : (
        <ul className="flex flex-col gap-2" aria-label="Delivery log">
          {log.data.map((m) => (
            <li key={m.id} className="rounded-control border border-ink-200 px-3 py-2 text-sm">
              <div className="flex flex-wrap items-center gap-2">
                <Badge tone={m.status === 'sent' ? 'ok' : 'danger'}>{m.status === 'sent' ? 'delivered to the mail server' : 'not delivered'}</Badge>
                <span className="font-semibold">{m.kind === 'manifest' ? 'Manifest' : 'Invitation'}</span>
                <span>to {m.recipient}</span>
                <span className="text-ink-600">
                  {new Date(m.lastAttemptAt).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short' })} by {m.sentBy ?? 'someone'}
                  {m.attempts > 1 ? ` · ${m.attempts} attempts` : ''}
                </span>
                {m.status === 'failed' && maySend && (
                  <Button size="sm" variant="secondary" loading={retry.isPending && retry.variables === m.id} onClick={() => retry.mutate(m.id)}>
                    Send again
                  </Button>
                )}
              </div>
              {m.error && <p className="mt-1 text-danger-700">{m.error}</p>}
              {m.changes.length > 0 && <p className="mt-1 text-ink-700">Changed: {m.changes.join(' ')}</p>}
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}
