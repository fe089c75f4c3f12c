import { useState, type FormEvent } from 'react';
import { CircleMinus, Pencil } from 'lucide-react';
import type { Team, TeamEntry, TeamSharing } from '@shared/collab/team.schema';
import { ConfirmButton } from '@/components/dialogs/confirm-button';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { FormAlert } from '@/components/ui/form-alert';
import { TextField } from '@/components/ui/text-field';
import { isApiError } from '@/lib/api-client';
import { toast } from '@/lib/toast-store';
import { useUpdateEntry } from '../api/update-entry';
import { useWithdrawEntry } from '../api/withdraw-entry';
import { failureMessage, onlineFailure } from '../utils/online-failure';
import { SHARING_LABELS } from '../utils/team-words';
import { SharingChoice } from './sharing-choice';

const carName = (entry: TeamEntry) => `${entry.car.name}${entry.car.carNumber ? ` #${entry.car.carNumber}` : ''}`;

function EditEntry({ teamId, entry, onDone }: { teamId: string; entry: TeamEntry; onDone: () => void }) {
  const update = useUpdateEntry(teamId);
  const [classCode, setClassCode] = useState(entry.classCode);
  const [sharing, setSharing] = useState<TeamSharing>(entry.sharing);
  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);

  const onSubmit = (event: FormEvent) => {
    event.preventDefault();
    setFormError(null);
    setFieldErrors({});
    const trimmed = classCode.trim();
    if (!trimmed) {
      setFieldErrors({ classCode: 'Enter the class' });
      return;
    }
    update.mutate(
      { carId: entry.car.id, classCode: trimmed, sharing },
      {
        onSuccess: onDone,
        onError: (error) => {
          const offline = onlineFailure(error);
          if (offline || !isApiError(error) || !error.hasFieldErrors) {
            setFormError(offline ?? (error instanceof Error ? error.message : null));
            return;
          }
          setFieldErrors(Object.fromEntries(Object.entries(error.fieldErrors).map(([k, v]) => [k, v.join(' ')])));
        },
      },
    );
  };

  return (
    <form onSubmit={onSubmit} noValidate aria-label={`Change the entry of ${carName(entry)}`} className="flex flex-col gap-3 pt-2">
      <TextField
        label="Class"
        autoComplete="off"
        autoCapitalize="characters"
        value={classCode}
        onChange={(e) => setClassCode(e.target.value)}
        error={fieldErrors.classCode}
      />
      <SharingChoice name={`sharing-${entry.car.id}`} value={sharing} onChange={setSharing} error={fieldErrors.sharing} />
      <FormAlert message={formError} />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" isPending={update.isPending} pendingLabel="Saving…">
          Save entry
        </Button>
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

type Withdraw = ReturnType<typeof useWithdrawEntry>;

/** Takes the car off the team after asking: its owner may, and so may any captain. */
function WithdrawEntry({ team, entry, withdraw }: { team: Team; entry: TeamEntry; withdraw: Withdraw }) {
  const name = carName(entry);
  return (
    <ConfirmButton
      title={`Withdraw ${name}?`}
      destructive
      description={
        entry.mine
          ? 'The car comes off the team’s class board. Its runs and setups stay with the car; you can enter it again.'
          : `${entry.owner.displayName}’s car comes off the team’s class board. Its runs and setups stay with the car; ${entry.owner.displayName} can enter it again.`
      }
      confirmLabel="Withdraw the car"
      pendingLabel="Withdrawing…"
      keepLabel="Keep it entered"
      isPending={withdraw.isPending}
      onConfirm={({ onSuccess, onError }) =>
        withdraw.mutate(entry.car.id, {
          onSuccess: () => {
            onSuccess();
            toast({ tone: 'success', title: `${name} is withdrawn from ${team.name}`, description: 'It no longer shows on the class board.' });
          },
          onError,
        })
      }
      failureText={failureMessage}
    >
      <CircleMinus aria-hidden="true" className="size-4" /> Withdraw<span className="sr-only"> {name}</span>
    </ConfirmButton>
  );
}

function EntryItem({ team, entry, withdraw }: { team: Team; entry: TeamEntry; withdraw: Withdraw }) {
  const teamId = team.id;
  const [editing, setEditing] = useState(false);
  return (
    <li className="flex flex-col rounded border border-line px-3 py-2">
      <div className="flex min-h-tap flex-wrap items-center gap-x-3 gap-y-1">
        <div className="flex min-w-0 flex-1 flex-col">
          <span className="font-bold wrap-anywhere">{carName(entry)}</span>
          <span className="text-sm text-ink-muted">
            Class {entry.classCode} · {SHARING_LABELS[entry.sharing]} · {entry.mine ? 'yours' : entry.owner.displayName}
          </span>
        </div>
        {entry.mine && !editing ? (
          <Button variant="quiet" onClick={() => setEditing(true)}>
            <Pencil aria-hidden="true" className="size-4" /> Change<span className="sr-only"> {carName(entry)}</span>
          </Button>
        ) : null}
        {entry.mine || team.isCaptain ? <WithdrawEntry team={team} entry={entry} withdraw={withdraw} /> : null}
      </div>
      {editing ? <EditEntry teamId={teamId} entry={entry} onDone={() => setEditing(false)} /> : null}
    </li>
  );
}

/**
 * Every car entered in the team, with its class and what its owner shares; the user's own can be changed or
 * withdrawn, and a captain may withdraw any.
 */
export function EntryList({ team }: { team: Team }) {
  // Here rather than in the row, which is gone once the team is read again: the toast after it still comes.
  const withdraw = useWithdrawEntry(team.id);
  if (team.entries.length === 0) return <EmptyState message="No cars entered yet. Enter yours below; it then shows on the class board." />;
  const entries = [...team.entries].sort((a, b) => a.classCode.localeCompare(b.classCode) || a.car.name.localeCompare(b.car.name));
  return (
    <ul className="flex flex-col gap-2" aria-label="Entered cars">
      {entries.map((entry) => (
        <EntryItem key={entry.car.id} team={team} entry={entry} withdraw={withdraw} />
      ))}
    </ul>
  );
}
