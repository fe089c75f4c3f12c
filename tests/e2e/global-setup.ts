import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { TestProject } from 'vitest/node';
import { startServer } from '../../server/index';
import { loadConfig } from '../../server/config';
import { startFakeSmtp } from '../../scripts/lib/fake-smtp';
import { startFakePayments } from '../../scripts/lib/fake-payments';
import { databaseForTests } from '../support/throwaway-db';

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
  }
}

/**
 * The production build served by the real server on a free port, against its own database,
 * sending its e-mails to a local mail catcher that the tests read at GET /api/dev/mailbox,
 * and taking payments through a local fake of the payment service.
 */
export default async function setup(project: TestProject) {
  const root = join(import.meta.dirname, '..', '..');
  if (!existsSync(join(root, 'dist', 'index.html'))) throw new Error('Build the client first: npx vite build');
  const db = await databaseForTests('E2E_DATABASE_URL', 'scrubline_e2e');
  const smtp = await startFakeSmtp({ dir: mkdtempSync(join(tmpdir(), 'scrubline-e2e-mailbox-')) });
  const payments = await startFakePayments();
  const running = await startServer(
    loadConfig({
      DATABASE_URL: db.url,
      SESSION_SECRET: 'e2e-secret-e2e-secret-e2e-secret!!',
      PORT: '0',
      HOST: '127.0.0.1',
      SMTP_URL: smtp.url,
      MAILBOX_DIR: smtp.dir,
      STRIPE_SECRET_KEY: payments.secretKey,
      STRIPE_WEBHOOK_SECRET: payments.webhookSecret,
      STRIPE_API_URL: payments.url,
    }),
    join(root, 'dist'),
    // Every phone of the suite signs in and registers from 127.0.0.1 within one 15-minute window, far more often
    // than one person would; the limits themselves are tested in tests/server/auth/rate-limit.test.ts.
    { authLimits: { loginPerIp: 300, registerPerIp: 100 } },
  );
  payments.setWebhookUrl(`http://127.0.0.1:${running.port}/api/payments/webhook`);
  project.provide('baseUrl', `http://127.0.0.1:${running.port}`);
  return async () => {
    await running.close();
    await payments.stop();
    await smtp.stop();
    rmSync(smtp.dir, { recursive: true, force: true });
    await db.stop();
  };
}
