import { useEffect, useRef, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useSearchParams } from 'react-router-dom';
import { changeEmailInputSchema, EMAIL_LINK_PARAM, type ChangeEmailInput } from '@shared/auth/account.schema';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { PasswordField } from '@/components/ui/password-field';
import { EMAIL_INPUT, TextField } from '@/components/ui/text-field';
import { isApiError } from '@/lib/api-client';
import { formatDateTime } from '@/lib/dates';
import { applyServerErrors } from '@/lib/form-errors';
import { useConfirmEmailChange, usePendingEmailChange, useRequestEmailChange } from '../api/change-email';

const NO_CONNECTION = 'No connection: nothing was sent and your address is unchanged. Try again when you have signal.';
const SUCCESS = 'rounded border border-line bg-success-surface p-3 font-semibold text-success';

/** The new address and the password typed again (OWASP ASVS 4.0 V3.7.1); a link then goes to the new address. */
function ChangeEmailForm({ email, onSent, onCancel }: { email: string; onSent: () => void; onCancel: () => void }) {
  const request = useRequestEmailChange();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, reset, formState } = useForm<ChangeEmailInput>({
    resolver: zodResolver(changeEmailInputSchema),
    defaultValues: { newEmail: '', password: '' },
  });
  const onSubmit = handleSubmit((input) => {
    setFormError(null);
    request.mutate(input, {
      onSuccess: () => {
        reset();
        onSent();
      },
      onError: (error) => {
        if (isApiError(error) && error.code === 'network') setFormError(NO_CONNECTION);
        else setFormError(applyServerErrors(error, setError, ['newEmail', 'password']));
      },
    });
  });
  return (
    <form onSubmit={(e) => void onSubmit(e)} noValidate aria-label="Change sign-in address" className="flex flex-col gap-4">
      <input type="text" name="username" autoComplete="username" value={email} readOnly hidden />
      <TextField
        label="New address"
        {...EMAIL_INPUT}
        autoComplete="email"
        hint="We send a link to it. Your address changes when you open the link, signed in; until then you sign in with the old one."
        error={formState.errors.newEmail?.message}
        {...register('newEmail')}
      />
      <PasswordField label="Your password" autoComplete="current-password" error={formState.errors.password?.message} {...register('password')} />
      <FormAlert message={formError} />
      <div className="flex flex-wrap gap-3">
        <Button type="submit" isPending={request.isPending} pendingLabel="Sending…">
          Send the link
        </Button>
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

/** The address the account signs in with, a change waiting for its link, and the form to ask for one. */
export function SignInAddress({ email }: { email: string }) {
  const pending = usePendingEmailChange();
  const [open, setOpen] = useState(false);
  const waiting = pending.data ?? null;
  return (
    <div className="flex flex-col gap-3">
      <p>
        You sign in with <strong className="break-all">{email}</strong>.
      </p>
      {waiting ? (
        <p role="status" className="rounded border border-line bg-surface-raised p-3 text-sm">
          A link was sent to <strong className="break-all">{waiting.email}</strong>. Open it on a device signed in to this
          account before {formatDateTime(waiting.expiresAt)} to sign in with that address; asking again sends a new link.
        </p>
      ) : null}
      {open ? (
        <ChangeEmailForm email={email} onSent={() => setOpen(false)} onCancel={() => setOpen(false)} />
      ) : (
        <Button variant="secondary" className="self-start" onClick={() => setOpen(true)}>
          Change address
        </Button>
      )}
    </div>
  );
}

/**
 * The link from the new address (/settings?email-link=…): opened on this page, signed in, it is sent once and
 * taken out of the address bar, and the page says what happened.
 */
export function EmailLinkResult() {
  const [params, setParams] = useSearchParams();
  const token = params.get(EMAIL_LINK_PARAM);
  const confirm = useConfirmEmailChange();
  const sent = useRef(false);
  const [outcome, setOutcome] = useState<{ ok: boolean; message: string } | null>(null);
  useEffect(() => {
    if (!token || sent.current) return;
    sent.current = true;
    setParams(
      (p) => {
        p.delete(EMAIL_LINK_PARAM);
        return p;
      },
      { replace: true },
    );
    confirm.mutate(token, {
      onSuccess: ({ user }) => setOutcome({ ok: true, message: `Done: you now sign in with ${user.email}.` }),
      onError: (error) =>
        setOutcome({
          ok: false,
          message:
            isApiError(error) && error.code === 'network'
              ? 'No connection: your address is unchanged. Open the link from the e-mail again when you have signal.'
              : (isApiError(error) ? error.fieldErrors.token?.[0] : undefined) ?? (error instanceof Error ? error.message : 'Your address is unchanged.'),
        }),
    });
  }, [token, confirm, setParams]);
  if (confirm.isPending) return <p role="status">Changing your address…</p>;
  if (!outcome) return null;
  return outcome.ok ? <p role="status" className={SUCCESS}>{outcome.message}</p> : <FormAlert message={outcome.message} />;
}
