import pg from 'pg';
import { pino, type Logger } from 'pino';
import type { Config } from './config/env.ts';
import { createDb } from './db/knex.ts';
import { createMailer } from './mail/mailer.ts';
import type { BaseDeps } from './app.ts';

/** Opens the resources the app needs; `close` releases them in reverse order. */
export async function openDeps(config: Config, log?: Logger): Promise<BaseDeps & { close(): Promise<void> }> {
  const logger = log ?? pino({ level: config.LOG_LEVEL, base: { app: 'ballast' } });
  const db = createDb(config.DATABASE_URL, config.DATABASE_POOL_MAX, logger);
  const sessionPool = new pg.Pool({ connectionString: config.DATABASE_URL, max: 4, connectionTimeoutMillis: 5_000, idleTimeoutMillis: 30_000 });
  // A dropped idle connection (database restart) must not crash the process.
  sessionPool.on('error', (err) => logger.warn({ err }, 'session pool connection lost'));
  const mailer = await createMailer(config, db, logger);
  return {
    config,
    db,
    sessionPool,
    mailer,
    log: logger,
    async close() {
      await mailer.close();
      await sessionPool.end();
      await db.destroy();
    },
  };
}
