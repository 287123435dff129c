import { useMemo, useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { parseCrateQr, type ExpectedCrateView } from '@domain/contracts/tour.ts';
import { Alert, Badge, Button, buttonClasses, ChoiceGroup, EmptyState, ErrorState, PageHeader, PageLoading, TextField } from '../../../components/ui/index.ts';
import { useCurrentProduction } from '../../../lib/current-production.ts';
import { cx } from '../../../lib/cx.ts';
import { useCheck, useCheckStatuses } from '../api/check-in.ts';
import { newScanKey } from '../scan-queue.ts';
import { useScanSync } from '../use-scan-sync.ts';
import { QrScanner } from './qr-scanner.tsx';

/** Photos of damage: the server's limit, checked on the phone first so nothing big waits in the queue. */
const PHOTO_MAX_BYTES = 8 * 1024 * 1024;
const PHOTO_TYPES = ['image/jpeg', 'image/png', 'image/webp', 'image/heic', 'image/heif'];

type State = 'arrived' | 'damaged' | 'missing';
type Direction = 'in' | 'out';

/** `/p/:productionId/check-in`: the engagements this person checks crates in at; today's first. */
export function CheckInListPage() {
  const { productionId, membership } = useCurrentProduction();
  const statuses = useCheckStatuses(productionId ?? '');
  const today = new Date().toISOString().slice(0, 10);
  return (
    <div className="flex flex-col gap-4">
      <PageHeader eyebrow={membership?.productionName} title="Check-in" description="Pick the engagement, then scan each crate's label or tick it in the list." />
      {statuses.isPending ? (
        <PageLoading />
      ) : statuses.isError ? (
        <ErrorState error={statuses.error} onRetry={() => statuses.refetch()} />
      ) : statuses.data.length === 0 ? (
        <EmptyState title="No engagements to check in">The planner has not put your venue on the tour yet.</EmptyState>
      ) : (
        <ul className="flex flex-col gap-2">
          {[...statuses.data]
            .sort((a, b) => Number(b.engagement.loadInOn <= today && today <= b.engagement.loadOutOn) - Number(a.engagement.loadInOn <= today && today <= a.engagement.loadOutOn))
            .map((s) => (
              <li key={s.engagement.id}>
                <Link to={s.engagement.id} className="block rounded-panel border border-ink-200 bg-white px-4 py-3 hover:bg-ink-50">
                  <span className="block text-lg font-semibold text-tide-700">{s.engagement.venueName}</span>
                  <span className="block text-sm text-ink-700">
                    load-in {s.engagement.loadInOn} · load-out {s.engagement.loadOutOn}
                  </span>
                  <span className="mt-1 flex flex-wrap gap-2 text-sm">
                    <Badge>expected {s.summary.in.expected}</Badge>
                    <Badge tone="ok">here {s.summary.in.here}</Badge>
                    {s.flags.length > 0 && <Badge tone="danger">{s.flags.length} to chase</Badge>}
                  </span>
                </Link>
              </li>
            ))}
        </ul>
      )}
    </div>
  );
}

/** `/p/:productionId/check-in/:engagementId`: scan or tick each crate in (or out), on a phone. */
export function CheckInPage() {
  const { productionId } = useCurrentProduction();
  const { engagementId = '' } = useParams();
  const pid = productionId ?? '';
  const check = useCheck(pid, engagementId);
  const sync = useScanSync(pid, engagementId);
  const [direction, setDirection] = useState<Direction>('in');
  const [camera, setCamera] = useState(false);
  const [notice, setNotice] = useState<{ tone: 'ok' | 'danger' | 'caution'; text: string } | null>(null);
  const [damageFor, setDamageFor] = useState<string | null>(null);

  // The server's latest scans with the phone's queued ones on top, so a tick shows at once, offline too.
  const rows = useMemo(() => {
    const base: ExpectedCrateView[] = check.data?.crates ?? [];
    return base.map((r) => {
      const queued = sync.queue.filter((q) => q.crateId === r.crateId);
      let out = r;
      for (const q of queued) {
        const mark = { scanId: q.key, state: q.body.state, scannedAt: q.queuedAt, by: null, photoCount: q.photo ? 1 : 0 };
        out = q.body.direction === 'in' ? { ...out, in: mark } : { ...out, out: mark };
      }
      return { ...out, queued: queued.length > 0 };
    });
  }, [check.data, sync.queue]);

  if (check.isPending) return <PageLoading />;
  if (check.isError) return <ErrorState title="The crate list could not be loaded" error={check.error} onRetry={() => check.refetch()} />;
  const status = check.data;
  const list = rows;
  const mark = (r: (typeof rows)[number]) => (direction === 'in' ? r.in : r.out);
  const counts = {
    expected: status.summary.in.expected,
    here: list.filter((r) => mark(r) && mark(r)!.state !== 'missing').length,
    damaged: list.filter((r) => mark(r)?.state === 'damaged').length,
    missing: list.filter((r) => mark(r)?.state === 'missing').length,
  };

  async function record(crateId: string | null, state: State, extra: { code?: string; note?: string; photo?: File } = {}) {
    const key = newScanKey();
    await sync.add({
      key,
      productionId: pid,
      engagementId,
      crateId,
      body: { idempotencyKey: key, direction, state, note: extra.note ?? '', scannedAt: new Date().toISOString(), ...(extra.code ? { code: extra.code } : { crateId: crateId! }) },
      photo: extra.photo,
      photoName: extra.photo?.name,
      queuedAt: new Date().toISOString(),
    });
    const code = rows.find((r) => r.crateId === crateId)?.code ?? 'The crate';
    const verb = state === 'missing' ? 'marked missing' : direction === 'in' ? (state === 'damaged' ? 'checked in as damaged' : 'checked in') : state === 'damaged' ? 'loaded out as damaged' : 'loaded out';
    setNotice({ tone: state === 'arrived' ? 'ok' : 'caution', text: `${code} ${verb}${navigator.onLine ? '.' : ' — kept on this phone, sent when the connection returns.'}` });
  }

  function onCode(text: string) {
    const parsed = parseCrateQr(text);
    if (!parsed) return setNotice({ tone: 'danger', text: 'This QR code is not a Ballast crate label.' });
    if (parsed.productionId !== pid) return setNotice({ tone: 'danger', text: 'This crate label belongs to another production: it cannot be checked in here. Set the crate aside and tell the planner.' });
    void record(parsed.crateId, 'arrived', { code: text });
  }

  return (
    <div className="mx-auto flex max-w-xl flex-col gap-4">
      <PageHeader
        title={`${direction === 'in' ? 'Check in' : 'Check out'}: ${status.engagement.venueName}`}
        description={`Load-in ${status.engagement.loadInOn} · load-out ${status.engagement.loadOutOn}`}
        actions={
          <Link to=".." relative="path" className={buttonClasses({ variant: 'ghost', size: 'sm' })}>
            Other engagements
          </Link>
        }
      />
      <ChoiceGroup
        legend="What are you doing?"
        name="direction"
        value={direction}
        choices={[
          { value: 'in', label: 'Checking in' },
          { value: 'out', label: 'Loading out' },
        ]}
        onChange={setDirection}
      />
      <dl className="grid grid-cols-4 gap-2 text-center" aria-label="Counts">
        {(
          [
            ['expected', 'Expected', 'bg-ink-100'],
            ['here', direction === 'in' ? 'Here' : 'Loaded', 'bg-ok-100'],
            ['damaged', 'Damaged', 'bg-caution-100'],
            ['missing', 'Missing', 'bg-danger-100'],
          ] as const
        ).map(([k, label, tone]) => (
          <div key={k} className={cx('rounded-control px-1 py-2', tone)}>
            <dt className="text-xs font-semibold text-ink-700">{label}</dt>
            <dd className="text-2xl font-bold text-ink-950" data-testid={`count-${k}`}>
              {counts[k]}
            </dd>
          </div>
        ))}
      </dl>
      {!sync.online && <Alert tone="caution">No connection: scans are kept on this phone and sent when it returns.</Alert>}
      {sync.queue.length > 0 && (
        <Alert tone="neutral" actions={<Button size="sm" variant="secondary" onClick={() => void sync.flush()} loading={sync.sending}>Send now</Button>}>
          {sync.queue.length} scan{sync.queue.length === 1 ? '' : 's'} waiting to be sent{sync.queue[0].lastError ? ` (${sync.queue[0].lastError})` : ''}.
        </Alert>
      )}
      <div aria-live="polite">{notice && <Alert tone={notice.tone}>{notice.text}</Alert>}</div>
      {sync.refusals.map((r) => (
        <Alert key={r.key} tone="danger" actions={<Button size="sm" variant="ghost" onClick={() => sync.dismiss(r.key)}>Dismiss</Button>}>
          {r.message}
        </Alert>
      ))}
      {status.flags.map((f) => (
        <Alert key={f.crateId + f.message} tone="danger">
          ⚑ {f.message}
        </Alert>
      ))}
      {camera ? <QrScanner onCode={onCode} onClose={() => setCamera(false)} /> : (
        <Button block onClick={() => setCamera(true)}>
          Scan a label with the camera
        </Button>
      )}
      <ul className="flex flex-col gap-2" aria-label="Crates">
        {rows.map((r) => {
          const m = mark(r);
          return (
            <li key={r.crateId} className={cx('rounded-panel border bg-white px-3 py-2', m?.state === 'missing' ? 'border-danger-300' : m ? 'border-ok-300' : 'border-ink-200')}>
              <div className="flex items-center justify-between gap-2">
                <div className="min-w-0">
                  <span className="block font-semibold text-ink-900">{r.code}</span>
                  <span className="block truncate text-sm text-ink-600">{r.name}</span>
                </div>
                <span className="text-sm" data-testid={`state-${r.code}`}>
                  {m ? (m.state === 'arrived' ? (direction === 'in' ? 'here' : 'loaded') : m.state) : 'not seen'}
                  {r.queued ? ' · waiting to send' : ''}
                </span>
              </div>
              <div className="mt-2 grid grid-cols-3 gap-2">
                <Button size="md" variant={m?.state === 'arrived' ? 'primary' : 'secondary'} aria-label={`${r.code}: ${direction === 'in' ? 'here' : 'loaded'}`} onClick={() => void record(r.crateId, 'arrived')}>
                  {direction === 'in' ? 'Here' : 'Loaded'}
                </Button>
                <Button size="md" variant="secondary" aria-label={`${r.code}: damaged`} onClick={() => setDamageFor(damageFor === r.crateId ? null : r.crateId)}>
                  Damaged
                </Button>
                <Button size="md" variant={m?.state === 'missing' ? 'danger' : 'secondary'} aria-label={`${r.code}: missing`} onClick={() => void record(r.crateId, 'missing')}>
                  Missing
                </Button>
              </div>
              {damageFor === r.crateId && <DamageForm onSubmit={(note, photo) => void record(r.crateId, 'damaged', { note, photo }).then(() => setDamageFor(null))} />}
            </li>
          );
        })}
      </ul>
    </div>
  );
}

function DamageForm({ onSubmit }: { onSubmit: (note: string, photo: File | undefined) => void }) {
  const [note, setNote] = useState('');
  const [photo, setPhoto] = useState<File | undefined>();
  const [error, setError] = useState<string | null>(null);
  return (
    <form
      className="mt-2 flex flex-col gap-2 border-t border-ink-100 pt-2"
      onSubmit={(e) => {
        e.preventDefault();
        onSubmit(note, photo);
      }}
    >
      <TextField label="What is damaged?" value={note} onChange={(e) => setNote(e.target.value)} />
      <label className="text-sm font-semibold text-ink-800">
        Photo (JPEG, PNG, WebP or HEIC, at most 8 MB)
        <input
          type="file"
          accept="image/*"
          capture="environment"
          className="mt-1 block w-full text-sm"
          onChange={(e) => {
            const f = e.target.files?.[0];
            setError(null);
            setPhoto(undefined);
            if (!f) return;
            if (f.size > PHOTO_MAX_BYTES) return setError(`The photo is ${(f.size / 1024 / 1024).toFixed(1)} MB; the limit is 8 MB.`);
            if (f.type && !PHOTO_TYPES.includes(f.type)) return setError(`A ${f.type} file cannot be sent; use JPEG, PNG, WebP or HEIC.`);
            setPhoto(f);
          }}
        />
      </label>
      {error && <p className="text-sm font-medium text-danger-700">{error}</p>}
      <Button type="submit" variant="danger">
        Record damage
      </Button>
    </form>
  );
}
