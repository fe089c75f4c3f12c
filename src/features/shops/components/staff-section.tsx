import { MailPlus, UserMinus } from 'lucide-react';
import { inviteInputSchema, type Shop, type StaffMember } from '@shared/collab/shop.schema';
import { RemovePersonButton } from '@/components/dialogs/confirm-button';
import { EmailInviteForm } from '@/components/forms/email-invite-form';
import { isApiError } from '@/lib/api-client';
import { formatDay } from '@/lib/dates';
import { useInviteStaff } from '../api/invite-staff';
import { useRemoveStaff } from '../api/remove-staff';

const NEEDS_SIGNAL = 'This needs a connection. Try again when you have signal.';

function InviteForm({ shopId }: { shopId: string }) {
  const invite = useInviteStaff(shopId);
  return (
    <EmailInviteForm
      label="Invite staff"
      emailLabel="E-mail of the person to invite"
      emailHint="They get an e-mail with a link; the invitation shows below until they accept it."
      schema={inviteInputSchema}
      defaultValues={{ email: '', asAdmin: false }}
      mutation={invite}
      doneText={(input) => `Invitation sent to ${input.email}.`}
      offlineText={NEEDS_SIGNAL}
      submitLabel="Send invitation"
      submitIcon={MailPlus}
      pendingLabel="Sending…"
    >
      {({ register }) => (
        <label className="flex min-h-tap items-center gap-3">
          <input type="checkbox" className="size-5 accent-accent" {...register('asAdmin')} />
          <span>
            <span className="font-semibold">Shop admin</span>
            <span className="block text-sm text-ink-muted">May invite and remove staff too.</span>
          </span>
        </label>
      )}
    </EmailInviteForm>
  );
}

function RemoveStaff({ shopId, person }: { shopId: string; person: StaffMember }) {
  return (
    <RemovePersonButton
      person={person}
      description="They will no longer see the shop’s customers. Their comments and suggestions stay. You can invite them again later."
      confirmLabel="Remove from staff"
      remove={useRemoveStaff(shopId)}
      failureText={(e) => (isApiError(e) ? (e.code === 'network' ? NEEDS_SIGNAL : e.message) : 'Something went wrong; try again.')}
      icon={UserMinus}
    />
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
              <span className="font-semibold wrap-anywhere">
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
