import { UserMinus, UserPlus } from 'lucide-react';
import { addCoDriverInputSchema, type Car, type Person } from '@shared/season/car.schema';
import { RemovePersonButton } from '@/components/dialogs/confirm-button';
import { EmailInviteForm } from '@/components/forms/email-invite-form';
import { useOnlineStatus } from '@/hooks/use-online-status';
import { isApiError } from '@/lib/api-client';
import { useAddCoDriver } from '../api/add-co-driver';
import { useRemoveCoDriver } from '../api/remove-co-driver';

const NEEDS_SIGNAL = 'This needs a connection: the server has to find the account. Try again when you have signal.';

/** What went wrong removing someone, in words for the dialog. */
function failureText(error: unknown): string {
  if (!isApiError(error)) return 'Something went wrong; try again.';
  return error.code === 'network' ? NEEDS_SIGNAL : error.message;
}

function AddCoDriverForm({ carId, knownIds }: { carId: string; knownIds: readonly string[] }) {
  const add = useAddCoDriver(carId);
  const online = useOnlineStatus();
  return (
    <EmailInviteForm
      label="Add a co-driver"
      emailLabel="Co-driver’s e-mail"
      emailHint="They need a Scrubline account. They will see this car’s season and can log runs in it."
      schema={addCoDriverInputSchema}
      defaultValues={{ email: '' }}
      mutation={add}
      doneText={(_input, car) => {
        const person = car.coDrivers.find((p) => !knownIds.includes(p.id));
        return person ? `${person.displayName} can now drive this car.` : 'That person already co-drives this car.';
      }}
      offlineText={NEEDS_SIGNAL}
      submitLabel="Add co-driver"
      submitIcon={UserPlus}
      pendingLabel="Adding…"
    >
      {() => (!online ? <p className="text-sm text-ink-muted">You seem to be offline; adding a co-driver needs a connection.</p> : null)}
    </EmailInviteForm>
  );
}

function RemoveCoDriver({ carId, person }: { carId: string; person: Person }) {
  return (
    <RemovePersonButton
      person={person}
      description="They will no longer see this car or log runs in it. You can add them again later."
      confirmLabel="Remove co-driver"
      remove={useRemoveCoDriver(carId)}
      failureText={failureText}
      icon={UserMinus}
    />
  );
}

/** Who drives the car: the owner and the co-drivers. Only the owner adds or removes co-drivers. */
export function CoDrivers({ car, currentUserId }: { car: Car; currentUserId: string }) {
  const isOwner = car.owner.id === currentUserId;
  const you = (p: Person) => (p.id === currentUserId ? ' (you)' : '');
  return (
    <div className="flex flex-col gap-4">
      <ul className="flex flex-col gap-2" aria-label="Drivers">
        <li className="flex min-h-tap items-center gap-2 rounded border border-line px-3 py-2">
          <span className="font-semibold">
            {car.owner.displayName}
            {you(car.owner)}
          </span>
          <span className="text-sm text-ink-muted">owner</span>
        </li>
        {car.coDrivers.map((person) => (
          <li key={person.id} className="flex min-h-tap flex-wrap items-center justify-between gap-2 rounded border border-line px-3 py-1">
            <span className="min-w-0 font-semibold wrap-anywhere">
              {person.displayName}
              {you(person)}
            </span>
            {isOwner ? <RemoveCoDriver carId={car.id} person={person} /> : null}
          </li>
        ))}
      </ul>
      {car.coDrivers.length === 0 ? <p className="text-sm text-ink-muted">No co-drivers yet.</p> : null}
      {isOwner ? (
        <AddCoDriverForm carId={car.id} knownIds={car.coDrivers.map((p) => p.id)} />
      ) : (
        <p className="text-sm text-ink-muted">Only the owner, {car.owner.displayName}, can add or remove co-drivers.</p>
      )}
    </div>
  );
}
