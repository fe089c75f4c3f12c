import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type * as z from '@shared/zod';
import { MailPlus, UserMinus } from 'lucide-react';
import { inviteInputSchema, type Shop, type StaffMember } from '@shared/collab/shop.schema';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { FormAlert } from '@/components/ui/form-alert';
import { TextField } from '@/components/ui/text-field';
import { isApiError } from '@/lib/api-client';
import { formatDay } from '@/lib/dates';
import { applyServerErrors } from '@/lib/form-errors';
import { useInviteStaff, type InviteStaffInput } from '../api/invite-staff';
import { useRemoveStaff } from '../api/remove-staff';

const NEEDS_SIGNAL = 'This needs a connection. Try again when you have signal.';

function InviteForm({ shopId }: { shopId: string }) {
  const invite = useInviteStaff(shopId);
  const [formError, setFormError] = useState<string | null>(null);
  const [sent, setSent] = useState<string | null>(null);
  const { register, handleSubmit, setError, reset, formState } = useForm<z.input<typeof inviteInputSchema>, unknown, InviteStaffInput>({
    resolver: zodResolver(inviteInputSchema),
    defaultValues: { email: '', asAdmin: false },
  });
  const onSubmit = handleSubmit((input) => {
    setFormError(null);
    setSent(null);
    invite.mutate(input, {
      onSuccess: () => {
        setSent(`Invitation sent to ${input.email}.`);
        reset({ email: '', asAdmin: false });
      },
      onError: (error) =>
        setFormError(isApiError(error) && error.code === 'network' ? NEEDS_SIGNAL : applyServerErrors(error, setError, ['email', 'asAdmin'])),
    });
  });
  return (
    <form onSubmit={(e) => void onSubmit(e)} noValidate aria-label="Invite staff" className="flex flex-col gap-3">
      <TextField
        label="E-mail of the person to invite"
        hint="They get an e-mail with a link; the invitation shows below until they accept it."
        type="email"
        inputMode="email"
        autoComplete="off"
        autoCapitalize="none"
        spellCheck={false}
        error={formState.errors.email?.message}
        {...register('email', { onChange: () => setSent(null) })}
      />
      <label className="flex min-h-tap items-center gap-3">
        <input type="checkbox" className="size-5 accent-accent" {...register('asAdmin')} />
        <span>
          <span className="font-semibold">Shop admin</span>
          <span className="block text-sm text-ink-muted">May invite and remove staff too.</span>
        </span>
      </label>
      <FormAlert message={formError} />
      <p role="status" className="text-sm font-semibold text-success">
        {sent}
      </p>
      <div>
        <Button type="submit" variant="secondary" isPending={invite.isPending} pendingLabel="Sending…">
          <MailPlus aria-hidden="true" className="size-5" /> Send invitation
        </Button>
      </div>
    </form>
  );
}

function RemoveStaff({ shopId, person }: { shopId: string; person: StaffMember }) {
  const remove = useRemoveStaff(shopId);
  const [open, setOpen] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const onOpenChange = (next: boolean) => {
    setOpen(next);
    if (!next) setError(null);
  };
  return (
    <>
      <Button variant="quiet" className="shrink-0" onClick={() => onOpenChange(true)}>
        <UserMinus aria-hidden="true" className="size-5" /> Remove<span className="sr-only"> {person.displayName}</span>
      </Button>
      <Dialog
        open={open}
        onOpenChange={onOpenChange}
        title={`Remove ${person.displayName}?`}
        description="They will no longer see the shop’s customers. Their comments and suggestions stay. You can invite them again later."
      >
        <FormAlert message={error} />
        <div className="flex flex-wrap gap-3">
          <Button
            isPending={remove.isPending}
            pendingLabel="Removing…"
            onClick={() => {
              setError(null);
              remove.mutate(person.id, {
                onSuccess: () => setOpen(false),
                onError: (e) => setError(isApiError(e) ? (e.code === 'network' ? NEEDS_SIGNAL : e.message) : 'Something went wrong; try again.'),
              });
            }}
          >
            Remove from staff
          </Button>
          <Button variant="secondary" onClick={() => onOpenChange(false)}>
            Keep
          </Button>
        </div>
      </Dialog>
    </>
  );
}

/** Who works at the shop; shop admins invite and remove staff. */
export function StaffSection({ shop, currentUserId }: { shop: Shop; currentUserId: string }) {
  return (
    <div className="flex flex-col gap-4">
      <ul className="flex flex-col gap-2" aria-label="Staff">
        {shop.staff.map((person) => (
          <li key={person.id} className="flex min-h-tap flex-wrap items-center justify-between gap-2 rounded border border-line px-3 py-2">
            <span className="flex min-w-0 flex-col">
              <span className="font-semibold break-words">
                {person.displayName}
                {person.id === currentUserId ? ' (you)' : ''}
                {person.isShopAdmin ? <span className="text-sm font-normal text-ink-muted"> · shop admin</span> : null}
              </span>
              <span className="truncate text-sm text-ink-muted">{person.email}</span>
            </span>
            {shop.isShopAdmin && person.id !== currentUserId ? <RemoveStaff shopId={shop.id} person={person} /> : null}
          </li>
        ))}
      </ul>
      {shop.pendingInvitations.length > 0 ? (
        <div className="flex flex-col gap-2">
          <h3 className="font-bold">Invited, not yet joined</h3>
          <ul className="flex flex-col gap-1" aria-label="Pending invitations">
            {shop.pendingInvitations.map((inv) => (
              <li key={inv.email} className="text-sm">
                <span className="font-semibold">{inv.email}</span>
                {inv.asAdmin ? ' · as shop admin' : ''} · <span className="text-ink-muted">link valid until {formatDay(inv.expiresAt)}</span>
              </li>
            ))}
          </ul>
        </div>
      ) : null}
      {shop.isShopAdmin ? (
        <InviteForm shopId={shop.id} />
      ) : (
        <p className="text-sm text-ink-muted">Only the shop’s admins can invite or remove staff.</p>
      )}
    </div>
  );
}
