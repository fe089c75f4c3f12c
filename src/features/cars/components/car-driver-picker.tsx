import { useState, type FormEvent } from 'react';
import type { Car, Person } from '@shared/season/car.schema';
import { Button } from '@/components/ui/button';
import { cn } from '@/lib/cn';

/** Everyone who may drive a car: its owner first, then its co-drivers. */
export function driversOf(car: Car): Person[] {
  return [car.owner, ...car.coDrivers];
}

interface CarDriverPickerProps {
  cars: readonly Car[];
  currentUserId: string;
  initialCarId?: string | null;
  initialDriverId?: string | null;
  onChoose: (choice: { carId: string; driverId: string }) => void;
  /** The button's words: what choosing leads to ("Start logging", or a past day's runs). */
  action: string;
}

/** Which car, and who drives it, for the rest of the event: asked once, then remembered on this phone. */
export function CarDriverPicker({ cars, currentUserId, initialCarId, initialDriverId, onChoose, action }: CarDriverPickerProps) {
  const [carId, setCarId] = useState<string | null>(initialCarId ?? (cars.length === 1 ? cars[0]!.id : null));
  const car = cars.find((c) => c.id === carId) ?? null;
  const drivers = car ? driversOf(car) : [];
  const defaultDriver =
    drivers.find((d) => d.id === initialDriverId)?.id ?? drivers.find((d) => d.id === currentUserId)?.id ?? drivers[0]?.id ?? null;
  const [driverChoice, setDriverChoice] = useState<string | null>(null);
  const driverId = drivers.some((d) => d.id === driverChoice) ? driverChoice : defaultDriver;

  const onSubmit = (event: FormEvent) => {
    event.preventDefault();
    if (carId && driverId) onChoose({ carId, driverId });
  };

  const option = (checked: boolean) =>
    cn(
      'flex min-h-tap cursor-pointer items-center gap-3 rounded border px-3 py-2 font-semibold has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-focus',
      checked ? 'border-2 border-accent bg-accent-soft' : 'border-line-strong bg-surface',
    );

  return (
    <form onSubmit={onSubmit} className="flex flex-col gap-5" aria-label="Car and driver">
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-2 text-lg font-bold">Which car?</legend>
        {cars.map((c) => (
          <label key={c.id} className={option(c.id === carId)}>
            <input type="radio" name="car" className="size-5 accent-[var(--sl-accent)]" checked={c.id === carId} onChange={() => setCarId(c.id)} />
            <span className="flex min-w-0 flex-col">
              <span>
                {c.name}
                {c.carNumber ? <span className="tabular-figures text-ink-muted"> #{c.carNumber}</span> : null}
              </span>
              <span className="text-sm font-normal text-ink-muted">Class {c.classCode}</span>
            </span>
          </label>
        ))}
      </fieldset>
      {car ? (
        <fieldset className="flex flex-col gap-2">
          <legend className="mb-2 text-lg font-bold">Who is driving?</legend>
          {drivers.map((d) => (
            <label key={d.id} className={option(d.id === driverId)}>
              <input
                type="radio"
                name="driver"
                className="size-5 accent-[var(--sl-accent)]"
                checked={d.id === driverId}
                onChange={() => setDriverChoice(d.id)}
              />
              {d.displayName}
              {d.id === currentUserId ? <span className="text-sm font-normal text-ink-muted">(you)</span> : null}
            </label>
          ))}
        </fieldset>
      ) : null}
      <Button type="submit" disabled={!carId || !driverId} className="min-h-tap-lg w-full text-lg">
        {action}
      </Button>
    </form>
  );
}
