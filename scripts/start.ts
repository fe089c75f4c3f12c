// `npm start`: private PostgreSQL under .data/, migrations, demo seed on first run,
// a production build of the client, and one Express process serving both. Unless
// SMTP_URL names a real mail server, e-mails go to a local mail catcher whose
// messages the app shows at /dev/mailbox. Unless STRIPE_SECRET_KEY is set, online payments
// go to a local fake of the payment service (see docs/payments.md).
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { portIsFree, startCluster, type Cluster } from './lib/pg-cluster';
import type { FakeSmtp } from './lib/fake-smtp';
import { startFakePayments, type FakePayments } from './lib/fake-payments';
import { DATA_DIR, localSessionSecret, ROOT, say } from './lib/env';
import { loadConfig } from '../server/config';
import { localOrigin, startServer, type RunningServer } from '../server/index';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../server/db/demo-accounts';

let cluster: Cluster | undefined;
let running: RunningServer | undefined;
let smtp: FakeSmtp | undefined;
let payments: FakePayments | undefined;
let stopping = false;

async function shutdown(code: number) {
  if (stopping) return;
  stopping = true;
  say('stopping…');
  try {
    await running?.close();
    await smtp?.stop();
    await payments?.stop();
  } finally {
    cluster?.stop();
    say('stopped. Your data stays in .data/ for next time.');
    process.exit(code);
  }
}

async function main() {
  for (const signal of ['SIGINT', 'SIGTERM'] as const) process.on(signal, () => void shutdown(0));

  const port = Number(process.env.PORT ?? 3000);
  if (port > 0 && !(await portIsFree(port))) {
    throw new Error(`Port ${port} is already in use by another program. Stop it, or choose another port: PORT=${port + 1} npm start`);
  }

  let databaseUrl = process.env.DATABASE_URL;
  if (!databaseUrl) {
    cluster = await startCluster({ dir: join(DATA_DIR, 'pg'), port: 0, database: 'scrubline', log: say });
    databaseUrl = cluster.url;
    say(`PostgreSQL is running on 127.0.0.1:${cluster.port} (data in .data/pg)`);
  }

  // Loaded only when needed: smtp-server and mailparser are development dependencies.
  if (!process.env.SMTP_URL && process.env.NODE_ENV !== 'production') {
    const { startFakeSmtp } = await import('./lib/fake-smtp');
    smtp = await startFakeSmtp({ dir: join(DATA_DIR, 'mailbox') });
    say(`e-mails stay on this machine: a local mail catcher on 127.0.0.1:${smtp.port} keeps them in .data/mailbox`);
  }

  if (!process.env.STRIPE_SECRET_KEY && process.env.NODE_ENV !== 'production') {
    payments = await startFakePayments();
    say(`payments stay on this machine: a local fake of the payment service on 127.0.0.1:${payments.port}`);
  }

  say('building the client…');
  const build = spawnSync(join(ROOT, 'node_modules', '.bin', 'vite'), ['build', '--logLevel', 'warn'], {
    cwd: ROOT,
    stdio: 'inherit',
  });
  if (build.status !== 0) throw new Error('The client build failed; see the output above.');

  const config = loadConfig({
    ...process.env,
    DATABASE_URL: databaseUrl,
    SESSION_SECRET: process.env.SESSION_SECRET ?? localSessionSecret(),
    ...(smtp ? { SMTP_URL: smtp.url, MAILBOX_DIR: smtp.dir } : {}),
    ...(payments ? { STRIPE_SECRET_KEY: payments.secretKey, STRIPE_WEBHOOK_SECRET: payments.webhookSecret, STRIPE_API_URL: payments.url } : {}),
  });
  running = await startServer(config);
  payments?.setWebhookUrl(`${localOrigin(config.HOST, running.port)}/api/payments/webhook`);
  if (running.seeded) say('filled in the demo season (first run).');

  const mailLine = smtp
    ? `\n  E-mails the app sends (invitations, password resets): http://localhost:${running.port}/dev/mailbox\n`
    : '';
  const lines = Object.values(DEMO_ACCOUNTS).map((a) => `    ${a.email.padEnd(22)} ${DEMO_PASSWORD}   (${a.note})`);
  console.log(`
  Scrubline is running at http://localhost:${running.port}
${mailLine}
  Demo sign-ins (e-mail, password):
${lines.join('\n')}

  Press Ctrl+C to stop the app and its database.
`);
}

main().catch(async (err: unknown) => {
  console.error(`\n[scrubline] could not start: ${err instanceof Error ? err.message : String(err)}\n`);
  await shutdown(1);
});
