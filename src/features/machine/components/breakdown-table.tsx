import { useEffect, useMemo, useRef, useState, type KeyboardEvent } from 'react';
import { flexRender, getCoreRowModel, useReactTable, type ColumnDef, type SortingState } from '@tanstack/react-table';
import { useVirtualizer } from '@tanstack/react-virtual';
import type { AssemblyView, BreakdownLineView, MachineMassView, SectionView } from '@domain/contracts/machine.ts';
import { MASS_SOURCES } from '@domain/contracts/mass.ts';
import { formatNumber } from '@domain/units.ts';
import { Badge, CheckboxField, EmptyState, ErrorState, PageLoading, SelectField, Spinner, TextField } from '../../../components/ui/index.ts';
import { cx } from '../../../lib/cx.ts';
import { useUnits } from '../../../lib/use-units.ts';
import { useBreakdown, type BreakdownFilters } from '../api/get-breakdown.ts';

/** A row of the tree table: an assembly heading, or a part line under it. */
export type TreeRow = { kind: 'assembly'; id: string; assembly: AssemblyView; depth: number } | { kind: 'line'; id: string; line: BreakdownLineView; depth: number };

/**
 * Interleaves assembly headings with lines that arrive in tree order (depth-first by assembly number): a
 * heading is written whenever the path of assemblies changes, for each level not already open.
 */
export function treeRows(lines: BreakdownLineView[], assemblies: AssemblyView[], tree: boolean): TreeRow[] {
  if (!tree) return lines.map((l) => ({ kind: 'line', id: l.id, line: l, depth: 0 }));
  const byNumber = new Map(assemblies.map((a) => [a.number, a]));
  const rows: TreeRow[] = [];
  let open: string[] = [];
  for (const l of lines) {
    const path = l.assemblyPath;
    let common = 0;
    while (common < open.length && common < path.length && open[common] === path[common]) common++;
    for (let d = common; d < path.length; d++) {
      const a = byNumber.get(path[d]);
      if (a) rows.push({ kind: 'assembly', id: `a:${a.id}`, assembly: a, depth: d });
    }
    open = path;
    rows.push({ kind: 'line', id: l.id, line: l, depth: path.length });
  }
  return rows;
}

const SORTABLE: Record<string, NonNullable<BreakdownFilters['sort']>> = {
  partNumber: 'partNumber',
  name: 'name',
  quantity: 'quantity',
  unitMassKg: 'unitMassKg',
  lineMassKg: 'lineMassKg',
  massSource: 'massSource',
  material: 'material',
};

const ROW_HEIGHT = 40;

export interface BreakdownTableProps {
  productionId: string;
  sections: SectionView[];
  mass: MachineMassView | undefined;
  onSelectLine?: (line: BreakdownLineView) => void;
  onSelectAssembly?: (assembly: AssemblyView) => void;
  selectedLineId?: string | null;
}

/**
 * The breakdown as a tree table: assemblies as headings with their rolled-up mass, lines under them.
 * Sorting and filtering run on the server (5,000+ lines); rows are virtualised and the next page is
 * fetched as the end comes into view, so scrolling stays smooth.
 */
/** Rows open their panel from the keyboard too: Enter or Space on a focused row. */
function onEnterOrSpace(e: KeyboardEvent, open: () => void): void {
  if (e.key !== 'Enter' && e.key !== ' ') return;
  e.preventDefault();
  open();
}

export function BreakdownTable({ productionId, sections, mass, onSelectLine, onSelectAssembly, selectedLineId }: BreakdownTableProps) {
  const u = useUnits();
  const [sorting, setSorting] = useState<SortingState>([]);
  const [search, setSearch] = useState('');
  const [q, setQ] = useState('');
  const [sectionId, setSectionId] = useState('');
  const [source, setSource] = useState('');
  const [gaps, setGaps] = useState(false);
  useEffect(() => {
    const t = setTimeout(() => setQ(search.trim()), 250);
    return () => clearTimeout(t);
  }, [search]);

  const sort = sorting[0] ? SORTABLE[sorting[0].id] : undefined;
  const filters: BreakdownFilters = {
    q: q || undefined,
    sectionId: (sectionId || undefined) as BreakdownFilters['sectionId'],
    massSource: (source || undefined) as BreakdownFilters['massSource'],
    gaps: gaps ? 'true' : undefined,
    sort: sort ?? 'tree',
    dir: sorting[0]?.desc ? 'desc' : 'asc',
  };
  const query = useBreakdown(productionId, filters);
  const pages = query.data?.pages;
  const assemblies = useMemo(() => pages?.[0]?.assemblies ?? [], [pages]);
  const lines = useMemo(() => pages?.flatMap((p) => p.lines) ?? [], [pages]);
  const total = pages?.[0]?.total ?? 0;
  const rows = useMemo(() => treeRows(lines, assemblies, !sort), [lines, assemblies, sort]);
  const sectionCode = useMemo(() => new Map(sections.map((s) => [s.id, s.code])), [sections]);

  const columns = useMemo<ColumnDef<TreeRow>[]>(
    () => [
      { id: 'partNumber', header: 'Part number', size: 200 },
      { id: 'name', header: 'Name', size: 260 },
      { id: 'quantity', header: 'Qty', size: 70 },
      { id: 'unitMassKg', header: `Unit mass`, size: 110 },
      { id: 'lineMassKg', header: `Line mass`, size: 110 },
      { id: 'massSource', header: 'Source', size: 110 },
      { id: 'material', header: 'Material', size: 130 },
      { id: 'section', header: 'Section', size: 90, enableSorting: false },
      { id: 'cog', header: 'CoG x, y, z', size: 210, enableSorting: false },
    ],
    [],
  );
  const table = useReactTable({
    data: rows,
    columns,
    getRowId: (r) => r.id,
    getCoreRowModel: getCoreRowModel(),
    manualSorting: true,
    enableMultiSort: false,
    state: { sorting },
    onSortingChange: setSorting,
  });

  const scrollRef = useRef<HTMLDivElement>(null);
  const tableRows = table.getRowModel().rows;
  const virtualizer = useVirtualizer({ count: tableRows.length, getScrollElement: () => scrollRef.current, estimateSize: () => ROW_HEIGHT, overscan: 12 });
  const items = virtualizer.getVirtualItems();
  const lastIndex = items.length ? items[items.length - 1].index : 0;
  const { hasNextPage, isFetchingNextPage, fetchNextPage } = query;
  useEffect(() => {
    if (hasNextPage && !isFetchingNextPage && lastIndex >= tableRows.length - 40) void fetchNextPage();
  }, [lastIndex, tableRows.length, hasNextPage, isFetchingNextPage, fetchNextPage]);

  const cell = (r: TreeRow, id: string) => {
    if (r.kind === 'assembly') return null;
    const l = r.line;
    switch (id) {
      case 'partNumber':
        return (
          <span className="flex items-center gap-1.5 font-semibold tabular-nums" style={{ paddingLeft: `${r.depth * 1}rem` }}>
            {l.partNumber}
            {l.hasMesh && <Badge className="px-1.5 py-0 text-xs">mesh</Badge>}
          </span>
        );
      case 'name':
        return <span className="block truncate">{l.name}</span>;
      case 'quantity':
        return formatNumber(l.quantity, Number.isInteger(l.quantity) ? 0 : 2);
      case 'unitMassKg':
        return l.unitMassKg === null ? <Badge tone="caution">no mass</Badge> : u.formatMass(l.unitMassKg, 3);
      case 'lineMassKg':
        return l.unitMassKg === null ? '—' : u.formatMass(l.unitMassKg * l.quantity, 2);
      case 'massSource':
        return l.massSource ?? <span className="text-ink-500">none</span>;
      case 'material':
        return l.material ?? '';
      case 'section':
        return l.effectiveSectionId ? sectionCode.get(l.effectiveSectionId) : <span className="text-ink-500">loose</span>;
      case 'cog':
        return l.cogMm ? <span className="tabular-nums">{l.cogMm.map((v) => u.formatLength(v)).join(', ')}</span> : <Badge tone="caution">no position</Badge>;
      default:
        return null;
    }
  };

  const gridTemplate = columns.map((c) => `${c.size}px`).join(' ');
  const width = columns.reduce((s, c) => s + (c.size ?? 100), 0);

  return (
    <div className="flex flex-col gap-3">
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <TextField label="Search part number or name" type="search" value={search} onChange={(e) => setSearch(e.target.value)} />
        <SelectField label="Section" value={sectionId} onChange={(e) => setSectionId(e.target.value)}>
          <option value="">All</option>
          {sections.map((s) => (
            <option key={s.id} value={s.id}>
              {s.code} — {s.name}
            </option>
          ))}
          <option value="none">Loose (no section)</option>
        </SelectField>
        <SelectField label="Mass source" value={source} onChange={(e) => setSource(e.target.value)}>
          <option value="">All</option>
          {MASS_SOURCES.map((s) => (
            <option key={s} value={s}>
              {s}
            </option>
          ))}
          <option value="none">none given</option>
        </SelectField>
        <CheckboxField label="Only gaps" hint="No mass or no position" checked={gaps} onChange={(e) => setGaps(e.target.checked)} className="self-end pb-2" />
      </div>
      <p className="text-sm text-ink-700" aria-live="polite">
        {query.isFetching && !query.isFetchingNextPage ? <Spinner size="sm" label="Updating…" /> : `${formatNumber(total)} lines`}
        {lines.length < total && !query.isPending ? ` (${formatNumber(lines.length)} loaded; more load as you scroll)` : ''}
      </p>
      {query.isPending ? (
        <PageLoading label="Loading the breakdown…" />
      ) : query.isError ? (
        <ErrorState title="The breakdown could not be loaded" error={query.error} onRetry={() => query.refetch()} retrying={query.isFetching} />
      ) : rows.length === 0 ? (
        <EmptyState title={q || sectionId || source || gaps ? 'No lines match these filters' : 'No part lines yet'}>
          {q || sectionId || source || gaps ? 'Clear a filter to see more.' : 'Import a parts list to start the breakdown.'}
        </EmptyState>
      ) : (
        <div ref={scrollRef} className="h-[65vh] overflow-auto rounded-panel border border-ink-200 bg-white" role="table" aria-label="Machine breakdown" aria-rowcount={rows.length + 1}>
          <div style={{ width }} className="sticky top-0 z-10 border-b border-ink-200 bg-ink-50" role="rowgroup">
            {table.getHeaderGroups().map((hg) => (
              <div key={hg.id} role="row" className="grid" style={{ gridTemplateColumns: gridTemplate }}>
                {hg.headers.map((h) => {
                  const sortable = h.column.getCanSort();
                  const dir = h.column.getIsSorted();
                  return (
                    <div key={h.id} role="columnheader" aria-sort={dir === 'asc' ? 'ascending' : dir === 'desc' ? 'descending' : 'none'} className="px-2 py-2 text-left text-sm font-semibold text-ink-800">
                      {sortable ? (
                        <button type="button" className="flex items-center gap-1 hover:text-tide-700" onClick={h.column.getToggleSortingHandler()}>
                          {flexRender(h.column.columnDef.header, h.getContext())}
                          <span aria-hidden="true">{dir === 'asc' ? '▲' : dir === 'desc' ? '▼' : ''}</span>
                        </button>
                      ) : (
                        flexRender(h.column.columnDef.header, h.getContext())
                      )}
                    </div>
                  );
                })}
              </div>
            ))}
          </div>
          <div role="rowgroup" style={{ height: virtualizer.getTotalSize(), width, position: 'relative' }}>
            {items.map((vi) => {
              const row = tableRows[vi.index];
              const r = row.original;
              const style = { position: 'absolute' as const, top: 0, left: 0, width, height: vi.size, transform: `translateY(${vi.start}px)` };
              if (r.kind === 'assembly') {
                const m = mass?.assemblies[r.assembly.id];
                return (
                  <div
                    key={row.id}
                    role="row"
                    aria-rowindex={vi.index + 2}
                    aria-selected={selectedLineId === r.assembly.id}
                    style={style}
                    className={cx('flex cursor-pointer items-center gap-3 border-b border-ink-100 bg-tide-50 px-2 text-sm hover:bg-tide-100', selectedLineId === r.assembly.id && 'bg-tide-100')}
                    tabIndex={onSelectAssembly ? 0 : undefined}
                    onClick={() => onSelectAssembly?.(r.assembly)}
                    onKeyDown={(e) => onEnterOrSpace(e, () => onSelectAssembly?.(r.assembly))}
                  >
                    <span role="cell" className="font-semibold text-tide-900" style={{ paddingLeft: `${r.depth * 1}rem` }}>
                      {r.assembly.number} {r.assembly.name}
                    </span>
                    {r.assembly.sectionId && <Badge tone="accent">{sectionCode.get(r.assembly.sectionId)}</Badge>}
                    {r.assembly.keepTogether && <Badge>keep together</Badge>}
                    {m && (
                      <span className="ml-auto pr-2 text-ink-700 tabular-nums">
                        {u.formatMass(m.massKg)} · {m.lineCount} lines{m.gaps.length ? ` · ${m.gaps.length} gaps` : ''}
                      </span>
                    )}
                  </div>
                );
              }
              return (
                <div
                  key={row.id}
                  role="row"
                  aria-rowindex={vi.index + 2}
                  aria-selected={selectedLineId === r.id}
                  style={{ ...style, gridTemplateColumns: gridTemplate }}
                  className={cx('grid cursor-pointer items-center border-b border-ink-100 text-sm hover:bg-ink-50', selectedLineId === r.id && 'bg-tide-100')}
                  tabIndex={onSelectLine ? 0 : undefined}
                  onClick={() => onSelectLine?.(r.line)}
                  onKeyDown={(e) => onEnterOrSpace(e, () => onSelectLine?.(r.line))}
                >
                  {row.getVisibleCells().map((c) => (
                    <div key={c.id} role="cell" className="truncate px-2">
                      {cell(r, c.column.id)}
                    </div>
                  ))}
                </div>
              );
            })}
          </div>
          {query.isFetchingNextPage && (
            <div className="p-3 text-center">
              <Spinner size="sm" label="Loading more lines…" />
            </div>
          )}
        </div>
      )}
    </div>
  );
}
