import type { ReactNode } from 'react';
import type { Car } from '@shared/season/car.schema';
import { BackLink } from '@/components/ui/back-link';

interface CarHeaderProps {
  car: Car | undefined;
  isPending: boolean;
  isError: boolean;
  /** The page one step up. */
  back: { to: string; label: string };
  /** Said after "Class … · tyre size · " once the car is here. */
  about: (car: Car) => ReactNode;
  /** Said instead when the car could not be loaded. */
  errorText: string;
  /** The page's actions, as links. */
  children: ReactNode;
}

/** The top of a page about one car: the way back, its name and number, a line about it, and what to do next. */
export function CarHeader({ car, isPending, isError, back, about, errorText, children }: CarHeaderProps) {
  return (
    <div className="flex flex-col gap-2">
      <BackLink to={back.to}>{back.label}</BackLink>
      <h1 className="text-3xl font-extrabold">
        {car ? car.name : isPending ? 'Loading…' : 'Car'}
        {car?.carNumber ? <span className="tabular-figures text-ink-muted"> #{car.carNumber}</span> : null}
      </h1>
      {car ? (
        <p className="text-ink-muted">
          Class {car.classCode}
          {car.tyreSize ? ` · ${car.tyreSize}` : ''} · {about(car)}
        </p>
      ) : isError ? (
        <p className="text-ink-muted">{errorText}</p>
      ) : null}
      <div className="flex flex-wrap gap-2 pt-2">{children}</div>
    </div>
  );
}
