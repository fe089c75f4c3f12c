import { useEffect, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { CLOSED_ACCOUNT_NAME, closeAccountInputSchema, type CloseAccountInput } from '@shared/auth/account.schema';
import { ACCOUNT_EXPORT_PATH } from '@shared/export/account-export';
import { Button, buttonClasses } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { PasswordField } from '@/components/ui/password-field';
import { isApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { useOutboxEntries } from '@/lib/outbox-context';
import { onDeviceOnlyText } from '@/lib/outbox-summary';
import { useCloseAccount } from '../api/close-account';

const NO_CONNECTION = 'No connection: your account is still open. Try again when you have signal.';

/** The password typed again, with what goes and what stays said right above the button. */
function CloseAccountForm({ email, onCancel }: { email: string; onCancel: () => void }) {
  const close = useCloseAccount();
  const entries = useOutboxEntries();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, setFocus, formState } = useForm<CloseAccountInput>({
    resolver: zodResolver(closeAccountInputSchema),
    defaultValues: { password: '' },
  });
  useEffect(() => setFocus('password'), [setFocus]);
  const onSubmit = handleSubmit((input) => {
    setFormError(null);
    close.mutate(input, {
      onError: (error) => {
        if (isApiError(error) && error.code === 'network') setFormError(NO_CONNECTION);
        else setFormError(applyServerErrors(error, setError, ['password']));
      },
    });
  });
  return (
    <form onSubmit={(e) => void onSubmit(e)} noValidate aria-label="Close account" className="flex flex-col gap-3 rounded border border-line-strong p-3">
      <input type="text" name="username" autoComplete="username" value={email} readOnly hidden />
      <p className="font-semibold">This cannot be undone. Type your password to close the account.</p>
      {entries.length ? (
        <p className="rounded border border-line bg-surface-raised p-3 text-sm">
          <span className="font-bold">{onDeviceOnlyText(entries)}.</span> Closing the account deletes them too.
        </p>
      ) : null}
      <PasswordField label="Your password" autoComplete="current-password" error={formState.errors.password?.message} {...register('password')} />
      <FormAlert message={formError} />
      <div className="flex flex-wrap gap-3">
        <Button type="submit" variant="danger" isPending={close.isPending} pendingLabel="Closing…">
          Close my account
        </Button>
        <Button variant="secondary" onClick={onCancel}>
          Keep my account
        </Button>
      </div>
    </form>
  );
}

/**
 * Everything the account holds, as one file (OWASP ASVS 4.0 V8.3.2): a plain link, so the browser saves it as
 * it saves any download.
 */
export function DownloadYourData() {
  return (
    <div className="flex flex-col gap-3">
      <p className="text-sm">
        One JSON file with your profile and settings, each of your cars’ seasons (each one imports again on its own, from
        the Cars page), the runs you drove on other people’s cars, your comments, and the shops and teams you belong to.
      </p>
      <a href={ACCOUNT_EXPORT_PATH} download className={buttonClasses('secondary', 'self-start')}>
        Download your data
      </a>
    </div>
  );
}

/**
 * Closing the account (OWASP ASVS 4.0 V8.3.2): what is deleted, and what stays with other people's records.
 */
export function CloseAccount({ email }: { email: string }) {
  const [open, setOpen] = useState(false);
  return (
    <div className="flex flex-col gap-3">
      <ul className="list-disc space-y-1 pl-5 text-sm">
        <li>Your cars are deleted, with every run, setup, tyre reading, file and work order on them, your co-drivers’ runs included.</li>
        <li>Your comments are deleted, and you leave your shops and teams.</li>
        <li>A shop keeps the invoices it made out to you: they are its business records.</li>
        <li>
          Runs you drove on other people’s cars, and setups or suggestions you wrote for them, stay in their seasons under “{CLOSED_ACCOUNT_NAME}”.
        </li>
      </ul>
      <p className="text-sm text-ink-muted">To keep your seasons, download your data first (above).</p>
      {open ? (
        <CloseAccountForm email={email} onCancel={() => setOpen(false)} />
      ) : (
        <Button variant="secondary" className="self-start" onClick={() => setOpen(true)}>
          Close account…
        </Button>
      )}
    </div>
  );
}
