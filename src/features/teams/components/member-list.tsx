import { useId, useState } from 'react';
import { DoorOpen, UserX } from 'lucide-react';
import type { Team } from '@shared/collab/team.schema';
import { ConfirmButton, RemovePersonButton } from '@/components/dialogs/confirm-button';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { useLeaveTeam } from '../api/leave-team';
import { useRemoveMember } from '../api/remove-member';
import { useSetCaptain } from '../api/set-captain';
import { failureMessage } from '../utils/online-failure';
import { CaptainMarker } from './team-list';

type Member = Team['members'][number];

/** Said beside the last captain's "Make member", which the team cannot do without. */
const LAST_CAPTAIN = 'A team needs at least one captain: make another member captain first.';

function CaptainToggle({ teamId, member, isLastCaptain }: { teamId: string; member: Member; isLastCaptain: boolean }) {
  const setCaptain = useSetCaptain(teamId);
  const [error, setError] = useState<string | null>(null);
  const whyId = useId();
  const toggle = () => {
    setError(null);
    setCaptain.mutate({ userId: member.id, isCaptain: !member.isCaptain }, { onError: (e) => setError(failureMessage(e)) });
  };
  return (
    <div className="flex flex-col gap-1">
      <Button
        variant="secondary"
        className="shrink-0"
        onClick={toggle}
        isPending={setCaptain.isPending}
        pendingLabel="Saving…"
        disabled={isLastCaptain}
        aria-describedby={isLastCaptain ? whyId : undefined}
      >
        {member.isCaptain ? 'Make member' : 'Make captain'}
        <span className="sr-only"> {member.displayName}</span>
      </Button>
      {isLastCaptain ? (
        <p id={whyId} className="max-w-56 text-sm text-ink-muted">
          {LAST_CAPTAIN}
        </p>
      ) : null}
      <FormAlert message={error} />
    </div>
  );
}

function RemoveMember({ teamId, member }: { teamId: string; member: Member }) {
  return (
    <RemovePersonButton
      person={member}
      description="They leave the team: their cars come off the class board and they no longer see it. You can invite them again later."
      confirmLabel="Remove from team"
      remove={useRemoveMember(teamId)}
      failureText={failureMessage}
      icon={UserX}
    />
  );
}

/** The team's people; captains may change who captains and remove members. */
export function MemberList({ team, currentUserId }: { team: Team; currentUserId: string }) {
  const captains = team.members.filter((m) => m.isCaptain).length;
  return (
    <ul className="flex flex-col gap-2" aria-label="Members">
      {team.members.map((member) => {
        const isMe = member.id === currentUserId;
        return (
          <li key={member.id} className="flex min-h-tap flex-wrap items-center gap-2 rounded border border-line px-3 py-2">
            <span className="min-w-0 font-semibold wrap-anywhere">
              {member.displayName}
              {isMe ? ' (you)' : ''}
            </span>
            {member.isCaptain ? <CaptainMarker /> : null}
            {team.isCaptain ? (
              <span className="ml-auto flex flex-wrap items-start gap-2">
                <CaptainToggle teamId={team.id} member={member} isLastCaptain={member.isCaptain && captains === 1} />
                {isMe ? null : <RemoveMember teamId={team.id} member={member} />}
              </span>
            ) : null}
          </li>
        );
      })}
    </ul>
  );
}

/** Why the last captain cannot leave yet: with teammates, one of them must captain first; alone, someone must join. */
function lastCaptainLeaving(team: Team): string {
  return team.members.length > 1
    ? 'A team needs at least one captain: make another member captain first, then you can leave.'
    : 'A team needs at least one captain: invite someone, make them captain, then you can leave.';
}

/**
 * Every member may leave, but the last captain, whose button is disabled with why beside it; the page then goes
 * back to the list of teams.
 */
export function LeaveTeam({ team, currentUserId, onLeft }: { team: Team; currentUserId: string; onLeft: () => void }) {
  const leave = useLeaveTeam(team.id, currentUserId);
  const whyId = useId();
  const me = team.members.find((m) => m.id === currentUserId);
  const isLastCaptain = me?.isCaptain === true && team.members.filter((m) => m.isCaptain).length === 1;
  if (isLastCaptain) {
    return (
      <div className="flex flex-col gap-1">
        <Button variant="secondary" className="shrink-0 self-start" disabled aria-describedby={whyId}>
          <DoorOpen aria-hidden="true" className="size-5" /> Leave team
        </Button>
        <p id={whyId} className="max-w-sm text-sm text-ink-muted">
          {lastCaptainLeaving(team)}
        </p>
      </div>
    );
  }
  return (
    <ConfirmButton
      variant="secondary"
      title={`Leave ${team.name}?`}
      destructive
      description="Your cars come off the team’s class board and you no longer see it. A captain can invite you again."
      confirmLabel="Leave team"
      pendingLabel="Leaving…"
      keepLabel="Stay"
      isPending={leave.isPending}
      onConfirm={({ onSuccess, onError }) =>
        leave.mutate(undefined, {
          onSuccess: () => {
            onSuccess();
            onLeft();
          },
          onError,
        })
      }
      failureText={failureMessage}
    >
      <DoorOpen aria-hidden="true" className="size-5" /> Leave team
    </ConfirmButton>
  );
}
