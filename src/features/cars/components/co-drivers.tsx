import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type * as z from '@shared/zod';
import { UserMinus, UserPlus } from 'lucide-react';
import { addCoDriverInputSchema, type Car, type Person } from '@shared/season/car.schema';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { FormAlert } from '@/components/ui/form-alert';
import { TextField } from '@/components/ui/text-field';
import { useOnlineStatus } from '@/hooks/use-online-status';
import { isApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { useAddCoDriver, type AddCoDriverInput } from '../api/add-co-driver';
import { useRemoveCoDriver } from '../api/remove-co-driver';

const NEEDS_SIGNAL = 'This needs a connection: the server has to find the account. Try again when you have signal.';

/** What went wrong with an online write, in words for the form. */
function failureText(error: unknown): string | null {
  if (isApiError(error) && error.code === 'network') return NEEDS_SIGNAL;
  return null;
}

function AddCoDriverForm({ carId, knownIds }: { carId: string; knownIds: readonly string[] }) {
  const add = useAddCoDriver(carId);
  const online = useOnlineStatus();
  const [formError, setFormError] = useState<string | null>(null);
  const [added, setAdded] = useState<string | null>(null);
  const { register, handleSubmit, setError, reset, formState } = useForm<z.input<typeof addCoDriverInputSchema>, unknown, AddCoDriverInput>({
    resolver: zodResolver(addCoDriverInputSchema),
    defaultValues: { email: '' },
  });

  const onSubmit = handleSubmit((input) => {
    setFormError(null);
    setAdded(null);
    add.mutate(input, {
      onSuccess: (car) => {
        const person = car.coDrivers.find((p) => !knownIds.includes(p.id));
        setAdded(person ? `${person.displayName} can now drive this car.` : 'That person already co-drives this car.');
        reset({ email: '' });
      },
      onError: (error) => setFormError(failureText(error) ?? applyServerErrors(error, setError, ['email'])),
    });
  });

  return (
    <form onSubmit={(e) => void onSubmit(e)} noValidate aria-label="Add a co-driver" className="flex flex-col gap-3">
      <TextField
        label="Co-driver’s e-mail"
        hint="They need a Scrubline account. They will see this car’s season and can log runs in it."
        type="email"
        inputMode="email"
        autoComplete="off"
        autoCapitalize="none"
        autoCorrect="off"
        spellCheck={false}
        error={formState.errors.email?.message}
        {...register('email', { onChange: () => setAdded(null) })}
      />
      {!online ? <p className="text-sm text-ink-muted">You seem to be offline; adding a co-driver needs a connection.</p> : null}
      <FormAlert message={formError} />
      <p role="status" className="text-sm font-semibold text-success">
        {added}
      </p>
      <div>
        <Button type="submit" variant="secondary" isPending={add.isPending} pendingLabel="Adding…">
          <UserPlus aria-hidden="true" className="size-5" /> Add co-driver
        </Button>
      </div>
    </form>
  );
}

function RemoveCoDriver({ carId, person }: { carId: string; person: Person }) {
  const remove = useRemoveCoDriver(carId);
  const [open, setOpen] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const onOpenChange = (next: boolean) => {
    setOpen(next);
    if (!next) setError(null);
  };
  const confirm = () => {
    setError(null);
    remove.mutate(person.id, {
      onSuccess: () => setOpen(false),
      onError: (e) => setError(failureText(e) ?? (isApiError(e) ? e.message : 'Something went wrong; try again.')),
    });
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
        description="They will no longer see this car or log runs in it. You can add them again later."
      >
        <FormAlert message={error} />
        <div className="flex flex-wrap gap-3">
          <Button onClick={confirm} isPending={remove.isPending} pendingLabel="Removing…">
            Remove co-driver
          </Button>
          <Button variant="secondary" onClick={() => onOpenChange(false)}>
            Keep
          </Button>
        </div>
      </Dialog>
    </>
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
            <span className="min-w-0 font-semibold break-words">
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
