import { describe, expect, it } from 'vitest';
import type { Knex } from 'knex';
import { allQueries } from '../../server/db/parallel.ts';

/** Tasks that record when they start and end; each ends on a timer. */
function tasks(log: string[]) {
  const task = (name: string, ms: number) => () =>
    new Promise<string>((resolve) => {
      log.push(`start ${name}`);
      setTimeout(() => {
        log.push(`end ${name}`);
        resolve(name);
      }, ms);
    });
  return [task('a', 20), task('b', 5)] as const;
}

describe('allQueries', () => {
  it('starts every read at once on the pool', async () => {
    const log: string[] = [];
    expect(await allQueries({} as Knex, tasks(log))).toEqual(['a', 'b']);
    expect(log).toEqual(['start a', 'start b', 'end b', 'end a']);
  });

  it('runs them one after another on a transaction, results in the same order', async () => {
    const log: string[] = [];
    expect(await allQueries({ isTransaction: true } as unknown as Knex, tasks(log))).toEqual(['a', 'b']);
    expect(log).toEqual(['start a', 'end a', 'start b', 'end b']);
  });
});
