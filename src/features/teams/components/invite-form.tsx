import { Controller } from 'react-hook-form';
import { Mail } from 'lucide-react';
import { inviteMemberInputSchema, type Team } from '@shared/collab/team.schema';
import { EmailInviteForm } from '@/components/forms/email-invite-form';
import { SegmentedControl } from '@/components/ui/segmented-control';
import { formatDay } from '@/lib/dates';
import { useInviteToTeam } from '../api/invite-to-team';
import { NEEDS_SIGNAL } from '../utils/online-failure';

const ROLE_OPTIONS = [
  { value: 'member', label: 'Member' },
  { value: 'captain', label: 'Captain' },
] as const;

/** Captains: invite someone by e-mail; the link works for a week, once. */
export function InviteForm({ teamId }: { teamId: string }) {
  const invite = useInviteToTeam(teamId);
  return (
    <EmailInviteForm
      label="Invite someone"
      emailLabel="Their e-mail"
      emailHint="They get a link to join. Without an account yet, they can create one from the link."
      schema={inviteMemberInputSchema}
      defaultValues={{ email: '', asAdmin: false }}
      mutation={invite}
      doneText={(input) => `Invitation sent to ${input.email}. The link works for a week.`}
      offlineText={NEEDS_SIGNAL}
      submitLabel="Send invitation"
      submitIcon={Mail}
      pendingLabel="Sending…"
    >
      {({ control }) => (
        <>
          <Controller
            control={control}
            name="asAdmin"
            render={({ field }) => (
              <SegmentedControl
                label="Join as"
                name="invite-as"
                options={ROLE_OPTIONS}
                value={field.value ? 'captain' : 'member'}
                onChange={(value) => field.onChange(value === 'captain')}
              />
            )}
          />
          <p className="text-sm text-ink-muted">Captains invite people, change who captains and enter the class factors.</p>
        </>
      )}
    </EmailInviteForm>
  );
}

/** Invitations not yet used, with who they are for and until when they work. */
export function PendingInvitations({ invitations }: { invitations: Team['pendingInvitations'] }) {
  if (invitations.length === 0) return <p className="text-sm text-ink-muted">No invitations waiting.</p>;
  return (
    <ul className="flex flex-col gap-2" aria-label="Invitations waiting">
      {invitations.map((invitation) => (
        <li key={invitation.email} className="flex flex-wrap items-baseline gap-x-2 rounded border border-dashed border-line-strong px-3 py-2">
          <span className="min-w-0 font-semibold break-all">{invitation.email}</span>
          <span className="text-sm text-ink-muted">
            as {invitation.asAdmin ? 'captain' : 'member'} · works until {formatDay(invitation.expiresAt)}
          </span>
        </li>
      ))}
    </ul>
  );
}
