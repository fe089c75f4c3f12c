import { useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Mail } from 'lucide-react';
import type * as z from '@shared/zod';
import { inviteMemberInputSchema, type InviteMemberInput, type Team } from '@shared/collab/team.schema';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { SegmentedControl } from '@/components/ui/segmented-control';
import { TextField } from '@/components/ui/text-field';
import { formatDay } from '@/lib/dates';
import { applyServerErrors } from '@/lib/form-errors';
import { useInviteToTeam } from '../api/invite-to-team';
import { onlineFailure } from '../utils/online-failure';

const ROLE_OPTIONS = [
  { value: 'member', label: 'Member' },
  { value: 'captain', label: 'Captain' },
] as const;

/** Captains: invite someone by e-mail; the link works for a week, once. */
export function InviteForm({ teamId }: { teamId: string }) {
  const invite = useInviteToTeam(teamId);
  const [formError, setFormError] = useState<string | null>(null);
  const [sent, setSent] = useState<string | null>(null);
  const { register, control, handleSubmit, setError, reset, formState } = useForm<z.input<typeof inviteMemberInputSchema>, unknown, InviteMemberInput>({
    resolver: zodResolver(inviteMemberInputSchema),
    defaultValues: { email: '', asAdmin: false },
  });

  const onSubmit = handleSubmit((input) => {
    setFormError(null);
    setSent(null);
    invite.mutate(input, {
      onSuccess: () => {
        setSent(`Invitation sent to ${input.email}. The link works for a week.`);
        reset({ email: '', asAdmin: false });
      },
      onError: (error) => setFormError(onlineFailure(error) ?? applyServerErrors(error, setError, ['email', 'asAdmin'])),
    });
  });

  return (
    <form onSubmit={(e) => void onSubmit(e)} noValidate aria-label="Invite someone" className="flex flex-col gap-3">
      <TextField
        label="Their e-mail"
        hint="They get a link to join. Without an account yet, they can create one from the link."
        type="email"
        inputMode="email"
        autoComplete="off"
        autoCapitalize="none"
        autoCorrect="off"
        spellCheck={false}
        error={formState.errors.email?.message}
        {...register('email', { onChange: () => setSent(null) })}
      />
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
      <FormAlert message={formError} />
      <p role="status" className="text-sm font-semibold text-success">
        {sent}
      </p>
      <div>
        <Button type="submit" variant="secondary" isPending={invite.isPending} pendingLabel="Sending…">
          <Mail aria-hidden="true" className="size-5" /> Send invitation
        </Button>
      </div>
    </form>
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
