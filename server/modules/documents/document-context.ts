import type { Knex } from 'knex';
import { notFound } from '../../http/errors.ts';
import type { PaperSize } from '../../pdf/document.ts';

/** What every printout says about where it comes from: the production, its paper size, who printed it and when. */
export interface DocumentContext {
  productionId: string;
  productionName: string;
  machineName: string;
  paperSize: PaperSize;
  /** The production's own paperwork units; a venue may ask for imperial. */
  defaultUnits: 'metric' | 'imperial';
  printedBy: string;
  /** YYYY-MM-DD. */
  printedOn: string;
}

export async function documentContext(db: Knex, productionId: string, userId: string | null, now = new Date()): Promise<DocumentContext> {
  const [production, user] = await Promise.all([
    db('productions').where({ id: productionId }).first('id', 'name', 'machine_name', 'paper_size', 'default_units'),
    userId ? db('users').where({ id: userId }).first('name') : Promise.resolve(null),
  ]);
  if (!production) throw notFound('The production');
  return {
    productionId,
    productionName: production.name ?? '',
    machineName: production.machine_name ?? '',
    paperSize: production.paper_size === 'Letter' ? 'Letter' : 'A4',
    defaultUnits: production.default_units === 'imperial' ? 'imperial' : 'metric',
    printedBy: user?.name ?? 'Ballast',
    printedOn: now.toISOString().slice(0, 10),
  };
}

/** A file name part made of letters, digits, dots and dashes. */
export function safeFilePart(s: string, fallback: string): string {
  const out = s
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .replace(/[^\w.-]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60);
  return out || fallback;
}
