import { loadConfig, ConfigError } from './config/env.ts';
import { openDeps } from './deps.ts';
import { createApp } from './app.ts';
import { migrateLatest } from './db/migrate.ts';

async function main(): Promise<void> {
  let config;
  try {
    config = loadConfig();
  } catch (err) {
    if (err instanceof ConfigError) {
      console.error(err.message);
      process.exit(2);
    }
    throw err;
  }
  const deps = await openDeps(config);
  const { log } = deps;
  if (process.env.BALLAST_MIGRATE_ON_START !== 'false') {
    const applied = await migrateLatest(deps.db);
    if (applied.length) log.info({ applied }, 'migrations applied');
  }
  const app = createApp(deps);
  const server = app.listen(config.PORT, config.HOST, () => {
    log.info(`Ballast is serving on http://${config.HOST}:${config.PORT} (public address ${config.APP_URL})`);
  });
  server.keepAliveTimeout = 65_000;

  let stopping = false;
  const shutdown = (signal: string) => {
    if (stopping) return;
    stopping = true;
    log.info({ signal }, 'shutting down: finishing open requests');
    const force = setTimeout(() => {
      log.warn('open requests did not finish in 10 s; closing anyway');
      process.exit(1);
    }, 10_000);
    force.unref();
    server.close(async () => {
      await deps.close().catch((err) => log.error({ err }, 'error while closing resources'));
      log.info('stopped');
      process.exit(0);
    });
    server.closeIdleConnections();
  };
  process.on('SIGINT', () => shutdown('SIGINT'));
  process.on('SIGTERM', () => shutdown('SIGTERM'));
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
