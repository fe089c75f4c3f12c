import 'reflect-metadata';
import type { Server } from 'node:http';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import pg from 'pg';
import { createApp } from './app';
import { loadConfig, type Config } from './config';
import { createDataSource } from './db/data-source';
import { seedDemoIfEmpty } from './db/seed';
import { logger } from './lib/logger';

export interface RunningServer {
  server: Server;
  port: number;
  seeded: boolean;
  close: () => Promise<void>;
}

const ROOT = join(fileURLToPath(import.meta.url), '..', '..');

/** Connects, migrates, seeds an empty database, and listens. */
export async function startServer(config: Config, clientDir = join(ROOT, 'dist')): Promise<RunningServer> {
  const ds = createDataSource(config.DATABASE_URL);
  await ds.initialize();
  await ds.runMigrations({ transaction: 'each' });
  const seeded = config.SEED_DEMO === 'true' ? await seedDemoIfEmpty(ds) : false;

  const pool = new pg.Pool({ connectionString: config.DATABASE_URL, max: 5 });
  const app = createApp({
    ds,
    pool,
    clientDir,
    trustProxy: config.TRUST_PROXY === 'true',
    session: {
      secret: config.SESSION_SECRET,
      idleMs: config.SESSION_IDLE_MINUTES * 60_000,
      absoluteMs: config.SESSION_ABSOLUTE_MINUTES * 60_000,
      secureCookie: config.COOKIE_SECURE === 'true',
    },
  });

  const server = await new Promise<Server>((resolve, reject) => {
    const s = app.listen(config.PORT, config.HOST);
    s.once('listening', () => resolve(s));
    s.once('error', (err: NodeJS.ErrnoException) => {
      if (err.code === 'EADDRINUSE') {
        reject(new Error(`Port ${config.PORT} is already in use by another program. Stop it, or choose another port: PORT=3001 npm start`));
      } else reject(err);
    });
  }).catch(async (err: unknown) => {
    await pool.end();
    await ds.destroy();
    throw err;
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : config.PORT;

  return {
    server,
    port,
    seeded,
    async close() {
      await new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      });
      await pool.end();
      await ds.destroy();
    },
  };
}

// Run directly (deployments): `tsx server/index.ts` with DATABASE_URL and SESSION_SECRET set.
if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  startServer(loadConfig())
    .then((running) => {
      logger.info(`Scrubline listening on port ${running.port}`);
      const stop = () => void running.close().then(() => process.exit(0));
      process.once('SIGINT', stop);
      process.once('SIGTERM', stop);
    })
    .catch((err: unknown) => {
      console.error(err instanceof Error ? err.message : err);
      process.exit(1);
    });
}
