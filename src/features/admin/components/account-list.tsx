import { useEffect, useState, type ReactNode } from 'react';
import { Ban, RotateCcw } from 'lucide-react';
import { ACCOUNT_LIST_LIMIT, SUSPENSION_NOTE_MAX, type AdminAccount } from '@shared/auth/admin.schema';
import { CLOSED_ACCOUNT_NAME } from '@shared/auth/person-name';
import { ConfirmButton, type ConfirmButtonProps } from '@/components/dialogs/confirm-button';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { FormAlert } from '@/components/ui/form-alert';
import { TextField } from '@/components/ui/text-field';
import { isApiError } from '@/lib/api-client';
import { dismissToast, toast } from '@/lib/toast-store';
import { formatDay, formatDateTime } from '@/lib/dates';
import { describeRoles } from '@/features/auth/utils/describe-roles';
import { TextArea } from '@/components/ui/text-area';
import { failureMessage } from '@/features/teams/utils/online-failure';
import { useAccounts, useCloseSuspendedAccount, useRestoreAccount, useSetAdmin, useSuspendAccount } from '../api/accounts';

const ASK_WHY = 'Say why, for the next admin who reads this';
const TYPE_ADDRESS = 'Type the account’s e-mail address';

type Handlers = { onSuccess: () => void; onError: (error: unknown) => void };

/**
 * A question that asks for one field before it is answered: an empty field is asked for again and nothing is
 * sent, and the server's refusal of that field goes beside it; anything else shows above the buttons.
 */
function ConfirmWithField({
  field,
  emptyMessage,
  renderField,
  send,
  ...question
}: Omit<ConfirmButtonProps, 'fields' | 'onClose' | 'onConfirm' | 'failureText'> & {
  /** The field's name in the API's field errors. */
  field: string;
  emptyMessage: string;
  renderField: (value: string, setValue: (next: string) => void, error: string | null) => ReactNode;
  send: (value: string, handlers: Handlers) => void;
}) {
  const [value, setValue] = useState('');
  const [error, setError] = useState<string | null>(null);
  return (
    <ConfirmButton
      {...question}
      fields={renderField(value, setValue, error)}
      onClose={() => {
        setValue('');
        setError(null);
      }}
      onConfirm={({ onSuccess, onError }) => {
        setError(null);
        if (!value.trim()) return setError(emptyMessage);
        send(value, {
          onSuccess,
          onError: (e) => {
            const refused = isApiError(e) ? e.fieldErrors[field]?.[0] : undefined;
            if (refused) setError(refused);
            else onError(e);
          },
        });
      }}
      failureText={failureMessage}
    />
  );
}

/**
 * The last word on each account's standing: a new one takes the place of the one before, so "is suspended" never
 * stays on screen above "can sign in again".
 */
const standingToasts = new Map<string, number>();
function standingToast(accountId: string, message: Parameters<typeof toast>[0]) {
  const before = standingToasts.get(accountId);
  if (before !== undefined) dismissToast(before);
  standingToasts.set(accountId, toast(message));
}

type Suspend = ReturnType<typeof useSuspendAccount>;
type Restore = ReturnType<typeof useRestoreAccount>;

/** Asks for a reason, then suspends: the account is signed out everywhere and cannot sign in until restored. */
function SuspendAccount({ account, suspend }: { account: AdminAccount; suspend: Suspend }) {
  return (
    <ConfirmWithField
      variant="secondary"
      title={`Suspend ${account.displayName}?`}
      destructive
      description="They are signed out on every device at once and cannot sign in until an admin restores the account. Their cars, runs and setups stay as they are."
      confirmLabel="Suspend account"
      pendingLabel="Suspending…"
      isPending={suspend.isPending}
      field="note"
      emptyMessage={ASK_WHY}
      renderField={(note, setNote, error) => (
        <TextArea
          label="Why"
          hint="Kept with the account for the next admin; the person suspended does not see it."
          value={note}
          onChange={setNote}
          error={error}
          rows={3}
          maxLength={SUSPENSION_NOTE_MAX}
        />
      )}
      send={(note, { onSuccess, onError }) =>
        suspend.mutate(
          { userId: account.id, note },
          {
            onSuccess: () => {
              onSuccess();
              standingToast(account.id, {
                tone: 'success',
                title: `${account.displayName} is suspended`,
                description: 'Signed out everywhere until an admin restores the account.',
              });
            },
            onError,
          },
        )
      }
    >
      <Ban aria-hidden="true" className="size-5" /> Suspend<span className="sr-only"> {account.displayName}</span>
    </ConfirmWithField>
  );
}

/**
 * Closes a suspended account for good (someone asked to be removed, or the account was abuse): its address is
 * typed again first, as the confirmation.
 */
function CloseSuspendedAccount({ account }: { account: AdminAccount }) {
  const close = useCloseSuspendedAccount();
  return (
    <ConfirmWithField
      title={`Close ${account.displayName}’s account for good?`}
      destructive
      description={`Their cars go, with every run, setup, tyre reading, file and work order on them, and so do their comments and memberships; shops keep the invoices they issued. What they wrote into other people’s records stays there under “${CLOSED_ACCOUNT_NAME}”. This cannot be undone; they get an e-mail saying so.`}
      confirmLabel="Close the account"
      pendingLabel="Closing…"
      isPending={close.isPending}
      field="email"
      emptyMessage={TYPE_ADDRESS}
      renderField={(email, setEmail, error) => (
        <TextField
          label="Their e-mail address"
          hint={`Type ${account.email} to confirm.`}
          type="email"
          autoComplete="off"
          value={email}
          onChange={(e) => setEmail(e.target.value)}
          error={error ?? undefined}
        />
      )}
      send={(email, { onSuccess, onError }) =>
        close.mutate(
          { userId: account.id, email },
          {
            onSuccess: () => {
              onSuccess();
              toast({ tone: 'success', title: `${account.displayName}’s account is closed`, description: 'A farewell e-mail went to them.' });
            },
            onError,
          },
        )
      }
    >
      Close for good<span className="sr-only"> {account.displayName}</span>
    </ConfirmWithField>
  );
}

function RestoreAccount({ account, restore }: { account: AdminAccount; restore: Restore }) {
  return (
    <ConfirmButton
      variant="secondary"
      title={`Restore ${account.displayName}?`}
      description="They can sign in again with their password. The note about the suspension is removed."
      confirmLabel="Restore account"
      pendingLabel="Restoring…"
      isPending={restore.isPending}
      onConfirm={({ onSuccess, onError }) =>
        restore.mutate(account.id, {
          onSuccess: () => {
            onSuccess();
            standingToast(account.id, { tone: 'success', title: `${account.displayName} can sign in again` });
          },
          onError,
        })
      }
      failureText={failureMessage}
    >
      <RotateCcw aria-hidden="true" className="size-5" /> Restore<span className="sr-only"> {account.displayName}</span>
    </ConfirmButton>
  );
}

/** Gives or takes the admin role, after asking. */
function AdminRole({ account }: { account: AdminAccount }) {
  const setAdmin = useSetAdmin();
  const isAdmin = account.roles.includes('admin');
  return (
    <ConfirmButton
      title={isAdmin ? `Take the admin role from ${account.displayName}?` : `Make ${account.displayName} an admin?`}
      destructive={isAdmin}
      description={
        isAdmin
          ? 'They keep their account, cars and shops, but can no longer see the accounts or suspend anyone.'
          : 'They can then see every account, suspend or restore one, and give or take this role, as you can.'
      }
      confirmLabel={isAdmin ? 'Take the role' : 'Make admin'}
      pendingLabel="Saving…"
      isPending={setAdmin.isPending}
      onConfirm={(handlers) => setAdmin.mutate({ userId: account.id, isAdmin: !isAdmin }, handlers)}
      failureText={failureMessage}
    >
      {isAdmin ? 'Take admin role' : 'Make admin'}
      <span className="sr-only"> {account.displayName}</span>
    </ConfirmButton>
  );
}

function AccountRow({ account, isMe }: { account: AdminAccount; isMe: boolean }) {
  // Here, not in the buttons: suspending swaps Suspend for Restore, and the toast after it must still come.
  const suspend = useSuspendAccount();
  const restore = useRestoreAccount();
  const devices = account.signedInDevices;
  const isAdmin = account.roles.includes('admin');
  return (
    <li className="flex flex-col gap-2 rounded border border-line p-3">
      <div className="flex flex-wrap items-start gap-x-3 gap-y-2">
        <div className="flex min-w-0 flex-1 flex-col">
          <span className="font-bold wrap-anywhere">
            {account.displayName}
            {isMe ? ' (you)' : ''}
          </span>
          <span className="text-sm break-all text-ink-muted">{account.email}</span>
        </div>
        {isMe ? null : account.suspendedAt ? <RestoreAccount account={account} restore={restore} /> : <SuspendAccount account={account} suspend={suspend} />}
      </div>
      <p className="text-sm text-ink-muted">
        {describeRoles(account.roles)} · joined {formatDay(account.createdAt)} ·{' '}
        {devices === 0 ? 'not signed in' : `signed in on ${devices} ${devices === 1 ? 'device' : 'devices'}`}
      </p>
      {isMe ? null : (
        <div className="-ml-3 flex flex-wrap gap-x-2">
          {/* A suspended account cannot sign in: it is not made an admin, though a role it has can be taken. */}
          {account.suspendedAt && !isAdmin ? null : <AdminRole account={account} />}
          {account.suspendedAt ? <CloseSuspendedAccount account={account} /> : null}
        </div>
      )}
      {account.suspendedAt ? (
        <div className="flex flex-col gap-1 rounded border border-warning-line bg-warning-surface p-3 text-sm">
          <p className="font-semibold text-warning">Suspended since {formatDateTime(account.suspendedAt)}</p>
          <p className="wrap-anywhere whitespace-pre-line text-ink">{account.suspensionNote}</p>
        </div>
      ) : null}
    </li>
  );
}

/** Waits until typing pauses before asking the server again. */
function useSettled(value: string, ms = 300) {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    const timer = setTimeout(() => setSettled(value), ms);
    return () => clearTimeout(timer);
  }, [value, ms]);
  return settled;
}

/** Every account, or those whose name or e-mail holds what is typed, by name: suspending one does not move it. */
export function AccountList({ currentUserId }: { currentUserId: string }) {
  const [typed, setTyped] = useState('');
  const q = useSettled(typed);
  const { data, error, isPending, refetch } = useAccounts(q);
  return (
    <div className="flex flex-col gap-4">
      <TextField
        label="Find an account"
        hint="Part of a name or an e-mail address."
        type="search"
        value={typed}
        maxLength={80}
        autoComplete="off"
        onChange={(e) => setTyped(e.target.value)}
      />
      {isPending ? (
        <p className="text-ink-muted">Loading the accounts…</p>
      ) : error && !data ? (
        <div className="flex flex-col gap-3">
          <FormAlert message={failureMessage(error)} />
          <Button variant="secondary" onClick={() => void refetch()}>
            Try again
          </Button>
        </div>
      ) : data.items.length === 0 ? (
        <EmptyState message={q ? `No account’s name or e-mail holds “${q}”.` : 'No accounts yet.'} />
      ) : (
        <>
          <p className="text-sm text-ink-muted" aria-live="polite">
            {data.total > data.count
              ? `The first ${ACCOUNT_LIST_LIMIT} of ${data.total} accounts; type to narrow them down.`
              : `${data.total} ${data.total === 1 ? 'account' : 'accounts'}`}
          </p>
          <ul className="flex flex-col gap-3" aria-label="Accounts">
            {data.items.map((account) => (
              <AccountRow key={account.id} account={account} isMe={account.id === currentUserId} />
            ))}
          </ul>
        </>
      )}
    </div>
  );
}
