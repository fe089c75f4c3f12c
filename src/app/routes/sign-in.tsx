import { useEffect, useState } from 'react';
import { Link, useLocation, useNavigate, useSearchParams } from 'react-router-dom';
import { NEXT_PARAM, paths, registerPath, safeNextPath } from '@/config/paths';
import { AuthLayout } from '@/components/layouts/auth-layout';
import { LoginForm } from '@/features/auth/components/login-form';
import type { OutboxEntry } from '@/lib/outbox';
import { useOutbox } from '@/lib/outbox-context';
import { onDeviceOnlyText } from '@/lib/outbox-summary';

/**
 * What another page may leave for this one in the navigation state: a note shown once (gone on
 * reload, and no link can set it). Kept here rather than in a shared module, so that the pages
 * that send it share no code with this one.
 */
export interface SignInState {
  notice: 'password-changed' | 'account-closed';
}

const NOTICES: Record<SignInState['notice'], string> = {
  'password-changed': 'Your password is changed. Sign in with the new one.',
  'account-closed': 'Your account is closed.',
};

function noticeOf(state: unknown): string | null {
  const notice = typeof state === 'object' && state !== null ? (state as Partial<SignInState>).notice : undefined;
  return notice && Object.hasOwn(NOTICES, notice) ? NOTICES[notice] : null;
}

/**
 * Changes made on this phone that never reached the server. Signed out, they are nobody's to send: each waits
 * for the account that made it (see Outbox), and this page says so, lest a driver whose session ended types
 * the day's runs in again, or someone else signing in here wonders whose they are.
 */
function useWaitingOnPhone(): readonly OutboxEntry[] {
  const outbox = useOutbox();
  const [entries, setEntries] = useState<readonly OutboxEntry[]>([]);
  useEffect(() => {
    let shown = true;
    void outbox.stored().then((stored) => shown && setEntries(stored));
    return () => {
      shown = false;
    };
  }, [outbox]);
  return entries;
}

export function SignInPage() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const notice = noticeOf(useLocation().state);
  const next = safeNextPath(params.get(NEXT_PARAM)) ?? paths.home;
  const waiting = useWaitingOnPhone();
  const one = waiting.length === 1;

  return (
    <AuthLayout title="Sign in" intro="Your season notebook: runs, setups and notes from every event.">
      <title>Sign in · Scrubline</title>
      {notice ? (
        <p role="status" className="rounded border border-line bg-success-surface p-3 font-semibold text-success">
          {notice}
        </p>
      ) : null}
      {waiting.length ? (
        <p role="status" className="rounded border border-line-strong bg-surface p-3">
          {/* "Wait", not "upload": one the server refused needs its account to fix it first. */}
          <span className="font-semibold">{onDeviceOnlyText(waiting)}.</span> {one ? 'It waits' : 'They wait'} for the
          account that made {one ? 'it' : 'them'} to sign in here again.
        </p>
      ) : null}
      <LoginForm onSuccess={() => void navigate(next, { replace: true })} />
      <Link to={paths.forgotPassword} className="-mt-2 inline-flex min-h-tap items-center self-start font-bold text-link underline">
        Forgot your password?
      </Link>
      <p className="text-ink-muted">
        New to Scrubline?{' '}
        <Link to={registerPath(next)} className="inline-flex min-h-tap items-center font-bold text-link underline">
          Create an account
        </Link>
      </p>
    </AuthLayout>
  );
}
