import type { Car } from '@shared/season/car.schema';
import { pathTo } from '@/config/paths';
import { recordPath } from '@/config/record-paths';

/** Whether this person drives the car: its owner or one of its co-drivers. */
export const drivesCar = (car: Pick<Car, 'owner' | 'coDrivers'>, userId: string): boolean =>
  car.owner.id === userId || car.coDrivers.some((d) => d.id === userId);

/**
 * Where a car's page is for this person: a driver's own car page, with its setup editor, tread and imports; for
 * shop staff reading a customer's car (the only others who may read one), the shop's page of that customer.
 */
export const carPagePath = (car: Pick<Car, 'id' | 'owner' | 'coDrivers'>, userId: string): string =>
  drivesCar(car, userId) ? pathTo.car(car.id) : recordPath.shopCustomer(car.id);
