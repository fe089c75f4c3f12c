import { useEffect, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import * as z from '@shared/zod';
import { endSessionsInputSchema, type SignedInDevice } from '@shared/auth/account.schema';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { PasswordField } from '@/components/ui/password-field';
import { isApiError } from '@/lib/api-client';
import { formatDateTime, formatDay } from '@/lib/dates';
import { applyServerErrors } from '@/lib/form-errors';
import { useEndSessions, useSignedInDevices } from '../api/signed-in-devices';

const NO_CONNECTION = 'No connection: no device was signed out. Try again when you have signal.';
const formSchema = z.strictObject({ password: endSessionsInputSchema.shape.password });
type FormValues = z.infer<typeof formSchema>;

const nameOf = (d: SignedInDevice) => d.device ?? 'A browser that did not say what it is';

/** Which device to sign out: one, or every one but this. */
type Target = { kind: 'one'; device: SignedInDevice } | { kind: 'others'; count: number };

/** The password typed again before signing devices out (OWASP ASVS 4.0 V3.3.4). */
function ConfirmSignOut({ target, onDone, onCancel }: { target: Target; onDone: (ended: number) => void; onCancel: () => void }) {
  const end = useEndSessions();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, setFocus, formState } = useForm<FormValues>({ resolver: zodResolver(formSchema), defaultValues: { password: '' } });
  // Opened by a tap on Sign out: the keyboard comes up for the password straight away.
  useEffect(() => setFocus('password'), [setFocus]);
  const what = target.kind === 'one' ? nameOf(target.device) : target.count === 1 ? 'the other device' : `all ${target.count} other devices`;

  const onSubmit = handleSubmit(({ password }) => {
    setFormError(null);
    end.mutate(
      { password, ...(target.kind === 'one' ? { sessionId: target.device.id } : {}) },
      {
        onSuccess: ({ ended }) => onDone(ended),
        onError: (error) => {
          if (isApiError(error) && error.code === 'network') setFormError(NO_CONNECTION);
          else setFormError(applyServerErrors(error, setError, ['password']));
        },
      },
    );
  });

  return (
    <form onSubmit={(e) => void onSubmit(e)} noValidate aria-label="Confirm signing out" className="flex flex-col gap-3 rounded border border-line-strong p-3">
      <p className="font-semibold">Sign out {what}? Type your password to confirm. Whoever uses it will need the password to sign in again.</p>
      <PasswordField label="Your password" autoComplete="current-password" error={formState.errors.password?.message} {...register('password')} />
      <FormAlert message={formError} />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" variant="danger" isPending={end.isPending} pendingLabel="Signing out…">
          Sign out
        </Button>
        <Button type="button" variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

/** How many devices show before "Show all": this one and the latest active, the ones a driver looks for. */
const DEVICES_SHOWN = 6;

/** Where this account is signed in, with a way to sign out a lost phone or a shared computer. */
export function SignedInDevices() {
  const devices = useSignedInDevices();
  const [target, setTarget] = useState<Target | null>(null);
  const [ended, setEnded] = useState<number | null>(null);
  const [all, setAll] = useState(false);

  if (devices.isPending) return <p className="text-ink-muted">Loading…</p>;
  if (devices.isError) return <FormAlert message="The list of devices could not be loaded. Try again when you have signal." />;
  const others = devices.data.filter((d) => !d.current);
  const choose = (next: Target) => {
    setEnded(null);
    setTarget(next);
  };

  const confirm = (t: Target) => (
    <ConfirmSignOut
      key={t.kind === 'one' ? t.device.id : 'others'}
      target={t}
      onCancel={() => setTarget(null)}
      onDone={(n) => {
        setTarget(null);
        setEnded(n);
      }}
    />
  );

  return (
    <div className="flex flex-col gap-3">
      <p className="text-sm text-ink-muted">
        Where this account is signed in now. Sign out a phone you lost or a computer you shared; it will need the password to sign in again.
      </p>
      {ended !== null ? (
        <p role="status" className="rounded border border-line bg-success-surface p-3 font-semibold text-success">
          Signed out: {ended === 1 ? '1 device' : `${ended} devices`}.
        </p>
      ) : null}
      {/* Above the list, which can be long: the way out for every other device is not at its far end. */}
      {others.length > 1 ? (
        <Button variant="secondary" className="self-start" onClick={() => choose({ kind: 'others', count: others.length })}>
          Sign out all other devices
        </Button>
      ) : null}
      {target?.kind === 'others' ? confirm(target) : null}
      <ul className="flex flex-col gap-2" aria-label="Signed-in devices">
        {(all ? devices.data : devices.data.slice(0, DEVICES_SHOWN)).map((d) => (
          <li key={d.id} className="flex flex-col gap-3 rounded border border-line p-3">
            <div className="flex flex-wrap items-center justify-between gap-2">
              <div className="flex min-w-0 flex-col">
                <p className="font-semibold">
                  {nameOf(d)}
                  {d.current ? <span className="ml-2 rounded bg-accent-soft px-2 py-0.5 text-sm font-bold">This device</span> : null}
                </p>
                <p className="tabular-figures text-sm text-ink-muted">
                  {d.signedInAt ? `Signed in ${formatDay(d.signedInAt)} · ` : ''}last active {formatDateTime(d.lastActiveAt)}
                </p>
              </div>
              {d.current ? null : (
                <Button variant="secondary" className="px-3" onClick={() => choose({ kind: 'one', device: d })}>
                  Sign out<span className="sr-only"> {nameOf(d)}</span>
                </Button>
              )}
            </div>
            {/* The question opens under the device it is about. */}
            {target?.kind === 'one' && target.device.id === d.id ? confirm(target) : null}
          </li>
        ))}
      </ul>
      {!all && devices.data.length > DEVICES_SHOWN ? (
        <Button variant="quiet" className="self-start" onClick={() => setAll(true)}>
          Show all {devices.data.length} devices
        </Button>
      ) : null}
    </div>
  );
}
