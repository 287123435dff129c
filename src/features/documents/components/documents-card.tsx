import { useState, type ReactNode } from 'react';
import { buttonClasses, Card, SelectField, Spinner } from '../../../components/ui/index.ts';
import { errorMessage } from '../../../lib/api.ts';
import { useMay } from '../../../lib/current-production.ts';
import { documentLinks } from '../api/document-links.ts';
import { useDocumentCrates, useDocumentEngagements } from '../api/document-subjects.ts';

/** A download that opens in a new tab (PDFs show in the browser's viewer; spreadsheets download). */
export function DocumentLink({ href, children, variant = 'secondary' }: { href: string; children: ReactNode; variant?: 'primary' | 'secondary' }) {
  return (
    <a href={href} target="_blank" rel="noopener" className={buttonClasses({ variant, size: 'sm' })}>
      {children}
    </a>
  );
}

/** The packing list of one crate: for a crate's own screen. */
export function PackingListLink({ productionId, crateId }: { productionId: string; crateId: string }) {
  return <DocumentLink href={documentLinks.packingList(productionId, crateId)}>Packing list (PDF)</DocumentLink>;
}

/** The manifest of one engagement: for an engagement's own screen. */
export function ManifestLink({ productionId, engagementId }: { productionId: string; engagementId: string }) {
  return <DocumentLink href={documentLinks.manifest(productionId, engagementId)}>Manifest (PDF)</DocumentLink>;
}

/**
 * Printable paperwork of the production, by role: packing lists, labels and the customs list for those
 * who read crates; venue manifests for those who read engagements (venue staff see their own venues').
 */
export function DocumentsCard({ productionId }: { productionId: string }) {
  const mayCrates = useMay('crate.read');
  const mayManifests = useMay('engagement.read');
  if (!mayCrates && !mayManifests) return null;
  return (
    <Card title="Documents" description="Printed on the production's paper size; imperial figures alongside for venues that use them.">
      <div className="flex flex-col gap-5">
        {mayCrates && <CrateDocuments productionId={productionId} />}
        {mayManifests && <ManifestDocuments productionId={productionId} />}
      </div>
    </Card>
  );
}

function CrateDocuments({ productionId }: { productionId: string }) {
  const crates = useDocumentCrates(productionId, true);
  const [crateId, setCrateId] = useState('');
  const [perPage, setPerPage] = useState<1 | 2>(1);
  const list = crates.data ?? [];
  const chosen = list.find((c) => c.id === crateId) ?? list[0];
  return (
    <div className="flex flex-col gap-3">
      <h3 className="font-semibold text-ink-800">Crates</h3>
      {crates.isPending ? (
        <Spinner />
      ) : crates.isError ? (
        <p className="text-sm text-danger-700">The crates could not be loaded: {errorMessage(crates.error)}</p>
      ) : list.length === 0 ? (
        <p className="text-sm text-ink-600">No crates yet: packing lists and labels appear once crates are added.</p>
      ) : (
        <>
          <div className="flex flex-wrap items-end gap-2">
            <SelectField label="Crate" value={chosen?.id ?? ''} onChange={(e) => setCrateId(e.target.value)} className="min-w-48">
              {list.map((c) => (
                <option key={c.id} value={c.id}>
                  {c.code}
                  {c.name ? ` — ${c.name}` : ''}
                </option>
              ))}
            </SelectField>
            {chosen && <PackingListLink productionId={productionId} crateId={chosen.id} />}
            {chosen && <DocumentLink href={documentLinks.labels(productionId, [chosen.id], perPage)}>Label (PDF)</DocumentLink>}
          </div>
          <div className="flex flex-wrap items-end gap-2">
            <SelectField label="Labels per page" value={String(perPage)} onChange={(e) => setPerPage(e.target.value === '2' ? 2 : 1)} className="min-w-32">
              <option value="1">One</option>
              <option value="2">Two</option>
            </SelectField>
            <DocumentLink href={documentLinks.labels(productionId, [], perPage)}>Labels of all {list.length} crates (PDF)</DocumentLink>
          </div>
        </>
      )}
      <div className="flex flex-wrap items-center gap-2">
        <span className="text-sm text-ink-700">Customs list (item, description with serial numbers, pieces, weight, value, origin):</span>
        <DocumentLink href={documentLinks.customsList(productionId, 'xlsx')}>XLSX</DocumentLink>
        <DocumentLink href={documentLinks.customsList(productionId, 'csv')}>CSV</DocumentLink>
      </div>
    </div>
  );
}

function ManifestDocuments({ productionId }: { productionId: string }) {
  const engagements = useDocumentEngagements(productionId, true);
  const [engagementId, setEngagementId] = useState('');
  const list = engagements.data ?? [];
  const chosen = list.find((e) => e.id === engagementId) ?? list[0];
  return (
    <div className="flex flex-col gap-3">
      <h3 className="font-semibold text-ink-800">Venue manifests</h3>
      {engagements.isPending ? (
        <Spinner />
      ) : engagements.isError ? (
        <p className="text-sm text-danger-700">The tour could not be loaded: {errorMessage(engagements.error)}</p>
      ) : list.length === 0 ? (
        <p className="text-sm text-ink-600">No engagements yet.</p>
      ) : (
        <div className="flex flex-wrap items-end gap-2">
          <SelectField label="Engagement" value={chosen?.id ?? ''} onChange={(e) => setEngagementId(e.target.value)} className="min-w-48">
            {list.map((e) => (
              <option key={e.id} value={e.id}>
                {e.venueName}
                {e.venueCity ? `, ${e.venueCity}` : ''} — load-in {e.loadInOn}
              </option>
            ))}
          </SelectField>
          {chosen && <ManifestLink productionId={productionId} engagementId={chosen.id} />}
        </div>
      )}
    </div>
  );
}
