import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { TestProject } from 'vitest/node';
import { startServer } from '../../server/index';
import { loadConfig } from '../../server/config';
import { startFakeSmtp } from '../../scripts/lib/fake-smtp';
import { databaseForTests } from '../support/throwaway-db';

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
  }
}

/**
 * The production build served by the real server on a free port, against its own database,
 * sending its e-mails to a local mail catcher that the tests read at GET /api/dev/mailbox.
 */
export default async function setup(project: TestProject) {
  const root = join(import.meta.dirname, '..', '..');
  if (!existsSync(join(root, 'dist', 'index.html'))) throw new Error('Build the client first: npx vite build');
  const db = await databaseForTests('E2E_DATABASE_URL', 'scrubline_e2e');
  const smtp = await startFakeSmtp({ dir: mkdtempSync(join(tmpdir(), 'scrubline-e2e-mailbox-')) });
  const running = await startServer(
    loadConfig({
      DATABASE_URL: db.url,
      SESSION_SECRET: 'e2e-secret-e2e-secret-e2e-secret!!',
      PORT: '0',
      HOST: '127.0.0.1',
      SMTP_URL: smtp.url,
      MAILBOX_DIR: smtp.dir,
    }),
    join(root, 'dist'),
  );
  project.provide('baseUrl', `http://127.0.0.1:${running.port}`);
  return async () => {
    await running.close();
    await smtp.stop();
    rmSync(smtp.dir, { recursive: true, force: true });
    await db.stop();
  };
}
