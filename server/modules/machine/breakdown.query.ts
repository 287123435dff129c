import type { Knex } from 'knex';
import type { BreakdownQuery } from '../../../src/domain/contracts/machine.ts';
import { toAssemblyView, toPartLineView, type AssemblyRow, type PartLineRow } from './machine.repository.ts';
import { JsonText } from '../../http/routes.ts';
import type { PartInstance } from '../../../src/domain/contracts/mass.ts';
import { cacheFor, machineFingerprint, type FingerprintCache } from '../../db/revision-cache.ts';

/**
 * One page of part lines, filtered and sorted in PostgreSQL so a 5,000-line breakdown never travels whole.
 * Each line comes with its effective section (its own, else its nearest assembly's: the same rule as the
 * mass core) and its assembly's path of numbers, so the client can draw the tree. The default order, 'tree',
 * is depth-first by assembly number, which keeps each assembly's lines together.
 */
export interface BreakdownPageRow extends PartLineRow {
  effective_section_id: string | null;
  assembly_path: string[] | null;
  has_mesh: boolean;
  /** Its placed instances, in order. */
  instances: PartInstance[];
}

const SORT_SQL: Record<BreakdownQuery['sort'], string> = {
  tree: 'a.path nulls first, l.sort_order, l.part_number',
  partNumber: 'l.part_number',
  name: 'l.name',
  quantity: 'l.quantity',
  unitMassKg: 'l.unit_mass_kg',
  lineMassKg: '(l.quantity * l.unit_mass_kg)',
  massSource: 'l.mass_source',
  material: 'l.material',
};

/** A line's place in one filtered, sorted breakdown: what a page needs besides the line's own columns. */
interface OrderedLine {
  id: string;
  effective_section_id: string | null;
  assembly_path: string[] | null;
}

const orderCaches = new WeakMap<Knex, FingerprintCache<OrderedLine[]>>();
const assemblyCaches = new WeakMap<Knex, FingerprintCache<AssemblyRow[]>>();
const pageCaches = new WeakMap<Knex, FingerprintCache<string>>();

/**
 * The order of every line that passes the filters, computed in PostgreSQL and kept per filter and sort while
 * the production's part lines and assemblies are unchanged (server/db/revision-cache.ts); a page is then a slice of it
 * and its lines' own columns, read by id. Sorting the whole breakdown for each page cost tens of
 * milliseconds of database time for 5,000 lines (the load benchmark); checking it is still valid costs one
 * short query.
 */
async function orderedLines(db: Knex, productionId: string, q: BreakdownQuery, fingerprint: string): Promise<OrderedLine[]> {
  const { offset: _o, limit: _l, ...shape } = q;
  const key = `${productionId} ${JSON.stringify(shape)}`;
  return cacheFor(orderCaches, db, 32).get(key, fingerprint, async () => {
    const where: string[] = ['l.production_id = ?'];
    const params: (string | number)[] = [productionId];
    if (q.q) {
      where.push(`(l.part_number ilike ? or l.name ilike ?)`);
      const like = `%${q.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
      params.push(like, like);
    }
    if (q.sectionId === 'none') where.push('coalesce(l.section_id, a.section_id) is null');
    else if (q.sectionId) {
      where.push('coalesce(l.section_id, a.section_id) = ?');
      params.push(q.sectionId);
    }
    if (q.assemblyId) {
      // The assembly and everything below it.
      where.push('? = any(a.ids)');
      params.push(q.assemblyId);
    }
    if (q.massSource === 'none') where.push('l.mass_source is null');
    else if (q.massSource) {
      where.push('l.mass_source = ?');
      params.push(q.massSource);
    }
    if (q.gaps === 'true') where.push('(l.unit_mass_kg is null or l.cog_mm is null)');

    const dir = q.dir === 'desc' ? 'desc' : 'asc';
    const order = q.sort === 'tree' ? SORT_SQL.tree : `${SORT_SQL[q.sort]} ${dir} nulls last, l.part_number, l.id`;
    const sql = `
      with recursive a(id, section_id, path, ids) as (
        select id, section_id, array[number], array[id]
          from machine_assemblies where production_id = ? and parent_id is null
        union all
        select c.id, coalesce(c.section_id, a.section_id), a.path || c.number, a.ids || c.id
          from machine_assemblies c join a on c.parent_id = a.id
         where c.production_id = ?
      )
      select l.id, coalesce(l.section_id, a.section_id) as effective_section_id, a.path as assembly_path
        from machine_part_lines l
        left join a on a.id = l.assembly_id
       where ${where.join(' and ')}
       order by ${order}`;
    const { rows } = (await db.raw(sql, [productionId, productionId, ...params])) as { rows: OrderedLine[] };
    return rows;
  });
}

/**
 * The breakdown screen's answer for one page (`GET …/machine/breakdown`), serialized once per breakdown
 * state and query and kept: people page back and forth through one order while nobody edits, and building
 * and serializing 100 lines was most of the request's cost (the load benchmark: 7.8 ms of app CPU per page
 * against 4.3 ms with only the order cached).
 */
export async function breakdownPageJson(db: Knex, productionId: string, q: BreakdownQuery): Promise<JsonText> {
  const fingerprint = await machineFingerprint(db, productionId);
  const text = await cacheFor(pageCaches, db, 128).get(`${productionId} ${JSON.stringify(q)}`, fingerprint, async () => {
    // The order's slice and every assembly of the machine (the client draws the tree), kept under the same fingerprint.
    const [ordered, assemblies] = await Promise.all([
      orderedLines(db, productionId, q, fingerprint),
      cacheFor(assemblyCaches, db, 32).get(productionId, fingerprint, () => db<AssemblyRow>('machine_assemblies').where({ production_id: productionId }).orderBy(['sort_order', 'number'])),
    ]);
    const rows = await pageRows(db, productionId, ordered.slice(q.offset, q.offset + q.limit));
    return JSON.stringify({
      assemblies: assemblies.map(toAssemblyView),
      lines: rows.map((r) => ({ ...toPartLineView(r, r.instances, r.has_mesh), effectiveSectionId: r.effective_section_id, assemblyPath: r.assembly_path ?? [] })),
      total: ordered.length,
      offset: q.offset,
    });
  });
  return new JsonText(text);
}

/** The page's lines, read by id with their instances and whether they have a mesh, in the order's order. */
async function pageRows(db: Knex, productionId: string, slice: readonly OrderedLine[]): Promise<BreakdownPageRow[]> {
  if (slice.length === 0) return [];
  const { rows } = (await db.raw(
    `select l.*, exists (select 1 from machine_meshes m where m.part_line_id = l.id) as has_mesh,
            coalesce((select json_agg(json_build_object('positionMm', json_build_array(i.x_mm, i.y_mm, i.z_mm), 'eulerZyxDeg', json_build_array(i.rz_deg, i.ry_deg, i.rx_deg)) order by i.seq)
                        from machine_part_instances i where i.part_line_id = l.id), '[]'::json) as instances
       from machine_part_lines l where l.production_id = ? and l.id = any(?::uuid[])`,
    [productionId, slice.map((o) => o.id)],
  )) as { rows: (PartLineRow & { has_mesh: boolean; instances: PartInstance[] })[] };
  const byId = new Map(rows.map((r) => [r.id, r]));
  const page: BreakdownPageRow[] = [];
  for (const o of slice) {
    const r = byId.get(o.id);
    // A line deleted since the order was read is left out.
    if (r) page.push({ ...r, effective_section_id: o.effective_section_id, assembly_path: o.assembly_path ? [...o.assembly_path] : null });
  }
  return page;
}
