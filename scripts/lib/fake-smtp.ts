// A mail catcher for development and tests: an SMTP server on 127.0.0.1 that accepts
// every message (any sign-in or none) and keeps each one as a JSON file in a folder,
// where the server's /api/dev/mailbox and the /dev/mailbox page read them. Nothing is
// ever delivered anywhere. The server itself never imports this (smtp-server and
// mailparser are development dependencies).
import { randomUUID } from 'node:crypto';
import { mkdirSync, renameSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { SMTPServer } from 'smtp-server';
import { simpleParser, type AddressObject } from 'mailparser';
import type { MailboxFile } from '../../shared/collab/mailbox.schema';

export interface FakeSmtp {
  /** For SMTP_URL: smtp://127.0.0.1:PORT */
  url: string;
  port: number;
  /** The folder holding one JSON file per message. */
  dir: string;
  stop: () => Promise<void>;
}

const addresses = (field: AddressObject | AddressObject[] | undefined): string[] =>
  (Array.isArray(field) ? field : field ? [field] : [])
    .flatMap((o) => o.value)
    .flatMap((a) => (a.group ? a.group : [a]))
    .map((a) => (a.address ?? '').toLowerCase())
    .filter(Boolean);

/** Raw header lines by lower-cased name, unfolded; a repeated header keeps its last value. */
function headerMap(lines: ReadonlyArray<{ key: string; line: string }>): Record<string, string> {
  const out: Record<string, string> = {};
  for (const { key, line } of lines) {
    const unfolded = line.replace(/\r?\n[ \t]+/g, ' ');
    out[key.toLowerCase()] = unfolded.slice(unfolded.indexOf(':') + 1).trim();
  }
  return out;
}

export async function startFakeSmtp(opts: { dir: string; port?: number; host?: string }): Promise<FakeSmtp> {
  const dir = opts.dir;
  mkdirSync(dir, { recursive: true });

  const server = new SMTPServer({
    authOptional: true,
    // Plain text on the loopback interface: no STARTTLS (nodemailer would try it and
    // refuse smtp-server's built-in test certificate), and sign-in allowed without TLS.
    disabledCommands: ['STARTTLS'],
    allowInsecureAuth: true,
    logger: false,
    onAuth(auth, _session, callback) {
      callback(null, { user: auth.username ?? 'anyone' });
    },
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((mail) => {
          const envelopeTo = session.envelope.rcptTo.map((a) => a.address.toLowerCase());
          const headers = headerMap(mail.headerLines);
          const message: MailboxFile = {
            id: randomUUID(),
            date: new Date().toISOString(),
            from: mail.from?.text ?? '',
            to: [...new Set([...addresses(mail.to), ...addresses(mail.cc), ...envelopeTo])],
            subject: mail.subject ?? '',
            text: mail.text ?? '',
            html: mail.html || '',
            listUnsubscribe: headers['list-unsubscribe'] ?? null,
            headers,
          };
          // Millisecond time first, so a plain listing is in arrival order; written under
          // another name and renamed, so a reader never sees half a file.
          const name = `${Date.now()}-${message.id}.json`;
          const partial = join(dir, `.${name}.partial`);
          writeFileSync(partial, JSON.stringify(message, null, 2));
          renameSync(partial, join(dir, name));
          callback();
        })
        .catch((err: unknown) => callback(err instanceof Error ? err : new Error(String(err))));
    },
  });

  const host = opts.host ?? '127.0.0.1';
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(opts.port ?? 0, host, () => {
      server.off('error', reject);
      resolve();
    });
  });
  // Errors on a connection (a client that hangs up) are no reason to stop.
  server.on('error', () => {});
  const port = (server.server.address() as { port: number }).port;

  return {
    url: `smtp://${host}:${port}`,
    port,
    dir,
    stop: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
