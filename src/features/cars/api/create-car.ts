import type { CreateCarInput } from '@shared/season/car.schema';
import { useOutboxWrite } from '@/lib/outbox-context';

/** A car made on the phone always carries its device-made id, so a replay is the same car. */
export type CreateCarBody = CreateCarInput & { id: string };

export function createCarEntry(body: CreateCarBody) {
  return {
    recordId: body.id,
    kind: 'car.create',
    method: 'POST' as const,
    path: '/api/cars',
    body,
    label: `Car · ${body.name}`,
    scope: { carId: body.id },
  };
}

/** Saves a new car on the device; the outbox uploads it before anything logged for it. */
export function useCreateCar() {
  return useOutboxWrite('car.create');
}
