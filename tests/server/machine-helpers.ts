import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import { DEMO_USERS } from '../../seeds/01_demo.ts';

/**
 * A production of its own for a machine test file, with the demo planner, rigger and venue user as members,
 * so tests that rewrite a breakdown never touch the demo production other files read.
 */
export async function machineTestProduction(db: Knex, label: string): Promise<string> {
  const [p] = await db('productions').insert({ name: `${label} ${randomUUID()}`, machine_name: 'Test machine' }).returning('id');
  for (const u of DEMO_USERS) {
    if (!u.role) continue;
    const user = await db('users').whereRaw('lower(email) = ?', [u.email]).first('id');
    await db('memberships').insert({ production_id: p.id, user_id: user.id, role: u.role, venue_ids: u.role === 'venue' ? [randomUUID()] : [] });
  }
  return p.id;
}

/** Triangles (9 numbers each) of an axis-aligned box, outward faces counter-clockwise seen from outside. */
export function boxTriangles(min: [number, number, number], max: [number, number, number]): number[] {
  const [x0, y0, z0] = min;
  const [x1, y1, z1] = max;
  const v = [
    [x0, y0, z0],
    [x1, y0, z0],
    [x1, y1, z0],
    [x0, y1, z0],
    [x0, y0, z1],
    [x1, y0, z1],
    [x1, y1, z1],
    [x0, y1, z1],
  ];
  const faces = [
    [0, 3, 2, 1], // bottom, seen from below
    [4, 5, 6, 7], // top
    [0, 1, 5, 4], // front (y0)
    [2, 3, 7, 6], // back (y1)
    [1, 2, 6, 5], // right (x1)
    [3, 0, 4, 7], // left (x0)
  ];
  const out: number[] = [];
  for (const [a, b, c, d] of faces) out.push(...v[a], ...v[b], ...v[c], ...v[a], ...v[c], ...v[d]);
  return out;
}

/** A binary STL of the given triangles. */
export function binaryStl(tri: number[]): Buffer {
  const n = tri.length / 9;
  const buf = Buffer.alloc(84 + 50 * n);
  buf.write('test mesh', 0, 'ascii');
  buf.writeUInt32LE(n, 80);
  for (let i = 0; i < n; i++) {
    const o = 84 + 50 * i;
    for (let k = 0; k < 9; k++) buf.writeFloatLE(tri[9 * i + k], o + 12 + 4 * k);
  }
  return buf;
}

/** An ASCII STL of the given triangles. */
export function asciiStl(tri: number[]): Buffer {
  const lines = ['solid test'];
  for (let i = 0; i < tri.length; i += 9) {
    lines.push('  facet normal 0 0 0', '    outer loop');
    for (let c = 0; c < 3; c++) lines.push(`      vertex ${tri[i + 3 * c]} ${tri[i + 3 * c + 1]} ${tri[i + 3 * c + 2]}`);
    lines.push('    endloop', '  endfacet');
  }
  lines.push('endsolid test');
  return Buffer.from(lines.join('\n'));
}

/** The same triangles with every corner order reversed (inside out). */
export function reversed(tri: number[]): number[] {
  const out: number[] = [];
  for (let i = 0; i < tri.length; i += 9) out.push(...tri.slice(i, i + 3), ...tri.slice(i + 6, i + 9), ...tri.slice(i + 3, i + 6));
  return out;
}
