import { useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import type { CrateKind } from '@domain/contracts/crate-loads.ts';
import { Alert, Badge, Button, Card, EmptyState, ErrorState, PageHeader, PageLoading, SelectField, TextField } from '../../../components/ui/index.ts';
import { errorMessage } from '../../../lib/api.ts';
import { useCurrentProduction, useMay } from '../../../lib/current-production.ts';
import { apiFieldErrors, type FieldErrors } from '../../../lib/form-errors.ts';
import { useUnits } from '../../../lib/use-units.ts';
import { useCrates, useCreateCrate, useSections, useStockCatalogue } from '../api/crates-api.ts';
import { verdictLabel } from './crate-figures.tsx';

/** `/p/:productionId/crates`: the crate catalogue of the production. */
export function CratesPage() {
  const { productionId } = useCurrentProduction();
  const u = useUnits();
  const mayEdit = useMay('crate.edit');
  const crates = useCrates(productionId ?? '');
  return (
    <div className="flex flex-col gap-5">
      <PageHeader
        title="Crates & loads"
        description="Crates designed around sections, stock cases and pallets, with their masses, centres of gravity and handling."
        actions={
          <Link to="../loads" relative="path" className="font-semibold text-tide-700 underline">
            Vehicles and packing runs →
          </Link>
        }
      />
      {mayEdit && productionId && <NewCrate productionId={productionId} />}
      {crates.isPending ? (
        <PageLoading label="Loading crates…" />
      ) : crates.isError ? (
        <ErrorState title="The crates could not be loaded" error={crates.error} onRetry={() => crates.refetch()} retrying={crates.isFetching} />
      ) : crates.data.length === 0 ? (
        <EmptyState title="No crates yet">Design a crate around a section, or add a stock case or pallet.</EmptyState>
      ) : (
        <Card title={`${crates.data.length} crates`}>
          <div className="overflow-x-auto">
            <table className="w-full text-left text-sm">
              <thead>
                <tr className="border-b border-ink-200">
                  <th scope="col" className="py-1 pr-3">Crate</th>
                  <th scope="col" className="py-1 pr-3">Kind</th>
                  <th scope="col" className="py-1 pr-3">Outer L × W × H</th>
                  <th scope="col" className="py-1 pr-3">Gross</th>
                  <th scope="col" className="py-1 pr-3">Tipping</th>
                  <th scope="col" className="py-1 pr-3">Handling</th>
                  <th scope="col" className="py-1">Warnings</th>
                </tr>
              </thead>
              <tbody>
                {crates.data.map((c) => (
                  <tr key={c.id} className="border-b border-ink-100">
                    <td className="py-1.5 pr-3">
                      <Link to={c.id} className="font-semibold text-tide-700 underline">
                        {c.code}
                      </Link>{' '}
                      <span className="text-ink-600">{c.name}</span>
                    </td>
                    <td className="py-1.5 pr-3">{c.kind}</td>
                    <td className="py-1.5 pr-3 whitespace-nowrap">{c.outerMm.map((v) => u.formatLength(v)).join(' × ')}</td>
                    <td className="py-1.5 pr-3 whitespace-nowrap">
                      {u.formatMass(c.figures.grossKg)}
                      {!c.figures.massComplete && ' (at least)'}
                    </td>
                    <td className="py-1.5 pr-3">{c.figures.tipping ? <Badge tone={c.figures.tipping.tips ? 'danger' : 'ok'}>{c.figures.tipping.action}</Badge> : <Badge>no verdict</Badge>}</td>
                    <td className="py-1.5 pr-3">{verdictLabel(c)}</td>
                    <td className="py-1.5 text-caution-800">{c.figures.warnings.length || ''}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <p className="mt-3 text-sm text-ink-600">Handling verdicts screen a lift by people; every one carries its cautions on the crate's page. Never stand under a suspended load.</p>
        </Card>
      )}
    </div>
  );
}

function NewCrate({ productionId }: { productionId: string }) {
  const navigate = useNavigate();
  const sections = useSections(productionId);
  const stock = useStockCatalogue(productionId);
  const create = useCreateCrate(productionId);
  const [kind, setKind] = useState<CrateKind>('designed');
  const [code, setCode] = useState('');
  const [sectionId, setSectionId] = useState('');
  const [stockId, setStockId] = useState('');
  const [errors, setErrors] = useState<FieldErrors>({});
  const choices = (stock.data ?? []).filter((s) => (kind === 'pallet' ? s.kind === 'pallet' : s.kind !== 'pallet'));
  return (
    <Card title="New crate">
      <form
        noValidate
        aria-label="New crate"
        className="grid items-end gap-3 sm:grid-cols-4"
        onSubmit={(e) => {
          e.preventDefault();
          setErrors({});
          const body = kind === 'designed' ? { code, kind, sectionId: sectionId || undefined } : { code, kind, stockId: stockId || undefined };
          create.mutate(body, { onSuccess: (c) => navigate(c.id), onError: (er) => setErrors(apiFieldErrors(er)) });
        }}
      >
        <SelectField label="Kind" name="kind" value={kind} onChange={(e) => setKind(e.target.value as CrateKind)}>
          <option value="designed">Designed around a section</option>
          <option value="stock">Stock case or box</option>
          <option value="pallet">Pallet</option>
        </SelectField>
        <TextField label="Code" name="code" value={code} onChange={(e) => setCode(e.target.value)} error={errors.code} />
        {kind === 'designed' ? (
          <SelectField label="Section" name="sectionId" value={sectionId} onChange={(e) => setSectionId(e.target.value)} error={errors.sectionId}>
            <option value="">Pick a section…</option>
            {(sections.data ?? []).map((s) => (
              <option key={s.id} value={s.id}>
                {s.code} {s.name}
              </option>
            ))}
          </SelectField>
        ) : (
          <SelectField label="From the catalogue" name="stockId" value={stockId} onChange={(e) => setStockId(e.target.value)} error={errors.stockId ?? errors.outerMm}>
            <option value="">Pick one…</option>
            {choices.map((s) => (
              <option key={s.id} value={s.id}>
                {s.name}
              </option>
            ))}
          </SelectField>
        )}
        <Button type="submit" loading={create.isPending}>
          Add crate
        </Button>
        {create.isError && Object.keys(apiFieldErrors(create.error)).length === 0 && (
          <Alert tone="danger" className="sm:col-span-4">
            {errorMessage(create.error)}
          </Alert>
        )}
      </form>
    </Card>
  );
}
