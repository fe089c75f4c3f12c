import { Router } from 'express';
import { readdir, readFile, rm } from 'node:fs/promises';
import { join } from 'node:path';
import * as z from '@shared/zod';
import type { MailboxFile, MailboxMessage } from '@shared/collab/mailbox.schema';
import { list } from '../../lib/http';
import { parsed, validate } from '../../lib/validate';

const querySchema = z.strictObject({
  to: z.optional(z.string().check(z.trim(), z.toLowerCase(), z.maxLength(254, 'An e-mail address has at most 254 characters'))),
});

/** Every message file in the folder; a missing folder is an empty mailbox, a half-written file is skipped. */
async function readMailbox(dir: string): Promise<MailboxMessage[]> {
  let names: string[];
  try {
    names = (await readdir(dir)).filter((n) => n.endsWith('.json'));
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code === 'ENOENT') return [];
    throw err;
  }
  const messages: MailboxMessage[] = [];
  for (const name of names) {
    try {
      const file = JSON.parse(await readFile(join(dir, name), 'utf8')) as Partial<MailboxFile>;
      if (typeof file.id !== 'string' || typeof file.date !== 'string') continue;
      messages.push({
        id: file.id,
        date: file.date,
        from: String(file.from ?? ''),
        to: Array.isArray(file.to) ? file.to.map(String) : [],
        subject: String(file.subject ?? ''),
        text: String(file.text ?? ''),
        html: String(file.html ?? ''),
        listUnsubscribe: typeof file.listUnsubscribe === 'string' ? file.listUnsubscribe : null,
      });
    } catch {
      // Removed or being written while we read: not a message yet.
    }
  }
  return messages.sort((a, b) => b.date.localeCompare(a.date) || b.id.localeCompare(a.id));
}

/**
 * Development only: the e-mails the local mail catcher received (scripts/lib/fake-smtp.ts),
 * newest first. Mounted only when the app is given a mailbox folder, which production never is.
 */
export function mailboxRoutes(dir: string) {
  const router = Router();

  router.get('/', validate({ query: querySchema }), async (_req, res) => {
    const { to } = parsed<z.infer<typeof querySchema>>(res, 'query');
    const messages = await readMailbox(dir);
    res.json(list(to ? messages.filter((m) => m.to.some((address) => address.toLowerCase() === to)) : messages));
  });

  router.delete('/', async (_req, res) => {
    const names = await readdir(dir).catch(() => [] as string[]);
    await Promise.all(names.filter((n) => n.endsWith('.json')).map((n) => rm(join(dir, n), { force: true })));
    res.status(204).end();
  });

  return router;
}
