import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { Wordmark } from '@/components/ui/wordmark';
import { MailboxView } from '@/features/account/components/mailbox';

/** Development only: the e-mails the local mail server caught. */
export function MailboxPage() {
  return (
    <div className="flex min-h-dvh flex-col">
      <header className="mx-auto flex w-full max-w-page items-center gap-3 px-4 pt-6">
        <Link to={paths.home} className="inline-flex min-h-tap items-center rounded" aria-label="Scrubline, Home">
          <Wordmark />
        </Link>
      </header>
      <main className="mx-auto flex w-full max-w-page flex-1 flex-col gap-4 px-4 pt-6 pb-12">
        <title>Mailbox (development) · Scrubline</title>
        <div className="flex flex-col gap-1">
          <h1 className="text-3xl font-extrabold">Mailbox</h1>
          <p className="text-ink-muted">E-mails the app sent while developing, caught before they reach anyone. Newest first.</p>
        </div>
        <MailboxView />
      </main>
    </div>
  );
}
