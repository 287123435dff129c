import type { Knex } from 'knex';
import type { BreakdownQuery } from '../../../src/domain/contracts/machine.ts';
import type { PartLineRow } from './machine.repository.ts';

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

export async function breakdownPage(db: Knex, productionId: string, q: BreakdownQuery): Promise<{ rows: BreakdownPageRow[]; total: number }> {
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
    select l.*, coalesce(l.section_id, a.section_id) as effective_section_id, a.path as assembly_path,
           exists (select 1 from machine_meshes m where m.part_line_id = l.id) as has_mesh,
           count(*) over () as total_count
      from machine_part_lines l
      left join a on a.id = l.assembly_id
     where ${where.join(' and ')}
     order by ${order}
     offset ? limit ?`;
  const { rows } = (await db.raw(sql, [productionId, productionId, ...params, q.offset, q.limit])) as { rows: (BreakdownPageRow & { total_count: number })[] };
  let total = rows[0]?.total_count ?? 0;
  if (rows.length === 0 && q.offset > 0) {
    // Past the end: count separately so the client still learns the total.
    const c = (await db.raw(sql.replace(/order by[\s\S]*$/, '').replace(/select l\.\*[\s\S]*?from machine_part_lines/, 'select count(*) as n from machine_part_lines'), [productionId, productionId, ...params])) as {
      rows: { n: number }[];
    };
    total = Number(c.rows[0]?.n ?? 0);
  }
  return { rows: rows.map(({ total_count: _t, ...r }) => r), total: Number(total) };
}
