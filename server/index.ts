import 'reflect-metadata';
import type { Server } from 'node:http';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import pg from 'pg';
import { createApp } from './app';
import type { AuthLimits } from './auth/rate-limit';
import { isProduction, loadConfig, type Config } from './config';
import { createDataSource } from './db/data-source';
import { seedDemoIfEmpty } from './db/seed';
import { logger } from './lib/logger';
import { smtpMailer, type MailSettings } from './mail/mailer';
import { createPaymentSettings, type PaymentSettings } from './features/payments/payment-settings';
import { DEFAULT_UPLOAD_DIR } from './files/disk-storage';
import { storageFromConfig } from './files/storage-config';
import { startFileSweeper, type FileSweeper } from './files/file-sweep';

export interface RunningServer {
  server: Server;
  port: number;
  seeded: boolean;
  /** How e-mails go out, or undefined when SMTP_URL is not set (development). */
  mail?: MailSettings;
  /** The payment service, or undefined when STRIPE_SECRET_KEY is not set (invoices are then paid in cash only). */
  payments?: PaymentSettings;
  /** Removes the stored objects of deleted records, every FILE_SWEEP_SECONDS. */
  sweeper: FileSweeper;
  close: () => Promise<void>;
}

/** This machine's address for links when PUBLIC_URL is not set: the listening host, or localhost for "any". */
export function localOrigin(host: string, port: number): string {
  const name = ['0.0.0.0', '::', ''].includes(host) ? 'localhost' : host.includes(':') ? `[${host}]` : host;
  return `http://${name}:${port}`;
}

const ROOT = join(fileURLToPath(import.meta.url), '..', '..');

/** Connects, migrates, seeds an empty database, and listens. */
/** What only a test harness sets: the end-to-end suite signs in dozens of times from one address within one window. */
export interface StartOptions {
  authLimits?: Partial<AuthLimits>;
}

export async function startServer(config: Config, clientDir = join(ROOT, 'dist'), { authLimits }: StartOptions = {}): Promise<RunningServer> {
  const ds = createDataSource(config.DATABASE_URL);
  await ds.initialize();
  await ds.runMigrations({ transaction: 'each' });
  const seeded = config.SEED_DEMO === 'true' ? await seedDemoIfEmpty(ds) : false;

  // Links in e-mails point at PUBLIC_URL; in development, at this server (its port is known once it listens).
  const mail: MailSettings | undefined = config.SMTP_URL
    ? { mailer: smtpMailer(config.SMTP_URL, config.MAIL_FROM), publicUrl: config.PUBLIC_URL ?? localOrigin(config.HOST, config.PORT), from: config.MAIL_FROM }
    : undefined;
  if (!mail) logger.warn('SMTP_URL is not set: invitations, password resets and notifications are not e-mailed');
  // Keys only ever come from the environment; STRIPE_API_URL points the SDK at the local fake.
  const payments: PaymentSettings | undefined = config.STRIPE_SECRET_KEY && config.STRIPE_WEBHOOK_SECRET
    ? createPaymentSettings({
        secretKey: config.STRIPE_SECRET_KEY,
        webhookSecret: config.STRIPE_WEBHOOK_SECRET,
        apiUrl: config.STRIPE_API_URL,
        publicUrl: config.PUBLIC_URL ?? localOrigin(config.HOST, config.PORT),
      })
    : undefined;
  if (!payments) logger.warn('STRIPE_SECRET_KEY is not set: invoices can be marked paid in cash but not paid online');
  // Attachments: an S3-compatible bucket when S3_BUCKET is set, otherwise a folder on this disk.
  const storage = await storageFromConfig(config);
  logger.info(storage.kind === 's3' ? `Attachments are kept in the S3 bucket ${config.S3_BUCKET}` : `Attachments are kept in ${config.UPLOAD_DIR ?? DEFAULT_UPLOAD_DIR}`);
  // The development mailbox shows every e-mail, reset links included: never in production.
  const mailboxDir = isProduction(config) ? undefined : config.MAILBOX_DIR;

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
    mail,
    mailboxDir,
    payments,
    storage,
    authLimits,
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
  // Objects of attachments deleted with their record (a run, a setup, a car…) are queued by the
  // database and removed here; the first sweep also takes what was queued while no server ran.
  const sweeper = startFileSweeper(ds, storage, config.FILE_SWEEP_SECONDS * 1000);
  sweeper.soon();
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : config.PORT;
  // The services hold this same object, so they pick up the real port (PORT=0 in tests).
  if (mail && !config.PUBLIC_URL) mail.publicUrl = localOrigin(config.HOST, port);
  if (payments && !config.PUBLIC_URL) payments.publicUrl = localOrigin(config.HOST, port);

  return {
    server,
    port,
    seeded,
    mail,
    payments,
    sweeper,
    async close() {
      await new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      });
      await sweeper.stop();
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
