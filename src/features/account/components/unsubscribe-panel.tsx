import { useState } from 'react';
import { Link } from 'react-router-dom';
import { MailX } from 'lucide-react';
import { paths } from '@/config/paths';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { isApiError } from '@/lib/api-client';
import { useUnsubscribe } from '../api/unsubscribe';

/**
 * The Settings switch's label, quoted so people can find it again. Written out rather than imported
 * from the switch, so this page and Settings share no chunk (the route map every page loads stays small).
 */
const EMAIL_SETTING_LABEL = 'E-mail me about comments and suggestions';

function failure(error: unknown): string {
  if (isApiError(error) && error.code === 'network') return 'No connection: nothing changed yet. Try again when you have signal.';
  if (isApiError(error) && error.status === 404) {
    return `This link does not work (it may be incomplete). You can also turn e-mails off in Settings: “${EMAIL_SETTING_LABEL}”.`;
  }
  return isApiError(error) && error.message ? error.message : 'Something went wrong; nothing changed yet. Try again.';
}

/** One button that stops notification e-mails; the app's own notifications stay. */
export function UnsubscribePanel({ token }: { token: string }) {
  const unsubscribe = useUnsubscribe(token);
  const [error, setError] = useState<string | null>(null);

  if (unsubscribe.isSuccess) {
    return (
      <div role="status" className="flex flex-col gap-3 rounded border border-line bg-success-surface p-4 text-ink">
        <p className="font-bold">Done: Scrubline sends you no more notification e-mails.</p>
        <p>
          You still see comments and suggestions in the app. To get the e-mails again, sign in, open Settings and switch on “
          {EMAIL_SETTING_LABEL}”.
        </p>
        <Link to={paths.settings} className="inline-flex min-h-tap items-center self-start font-bold text-link underline">
          Open Settings
        </Link>
      </div>
    );
  }

  return (
    <div className="flex flex-col gap-4">
      <p className="text-ink-muted">
        Scrubline e-mails you when someone comments on your cars or suggests a setup. Stop those e-mails here; you still see everything in the
        app, and messages about your account (such as password resets) still arrive.
      </p>
      <FormAlert message={error} />
      <Button
        className="w-full"
        isPending={unsubscribe.isPending}
        pendingLabel="Stopping…"
        onClick={() => {
          setError(null);
          unsubscribe.mutate(undefined, { onError: (e) => setError(failure(e)) });
        }}
      >
        <MailX aria-hidden="true" className="size-5" /> Stop notification e-mails
      </Button>
    </div>
  );
}
