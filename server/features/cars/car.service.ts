import type { DataSource, EntityManager } from 'typeorm';
import type { User } from '@shared/auth/auth.schema';
import type { Car, ClickAdjuster, CreateCarInput, DamperAdjuster, Person, UpdateCarInput } from '@shared/season/car.schema';
import { AXLES, type Axle } from '@shared/season/corners';
import { AppError, staleVersion } from '../../lib/app-error';
import { accessibleCarIdsSql, assertCarAccess } from '../../auth/access';
import { insertUnlessPresent } from '../../lib/insert';
import type { MailSettings } from '../../mail/mailer';
import { notify, sendOutbox } from '../notifications/notify';
import { CarCoDriverEntity, CarEntity } from './car.entity';

type Db = DataSource | EntityManager;

/** Each axle's adjuster columns. */
const COLUMNS = {
  front: {
    positions: 'frontDamperPositions', countFrom: 'frontDamperCountFrom',
    reboundPositions: 'frontDamperReboundPositions', reboundCountFrom: 'frontDamperReboundCountFrom',
  },
  rear: {
    positions: 'rearDamperPositions', countFrom: 'rearDamperCountFrom',
    reboundPositions: 'rearDamperReboundPositions', reboundCountFrom: 'rearDamperReboundCountFrom',
  },
} as const satisfies Record<Axle, Record<string, keyof CarEntity>>;

const clickAdjuster = (positions: number | null, countFrom: ClickAdjuster['countFrom'] | null): ClickAdjuster | null =>
  positions !== null && countFrom !== null ? { positions, countFrom } : null;

/** The car's adjusters from its columns: each axle's, with its rebound adjuster or null. */
export function damperAdjustersOf(c: CarEntity): Car['damperAdjusters'] {
  const axle = (a: Axle): DamperAdjuster | null => {
    const col = COLUMNS[a];
    const main = clickAdjuster(c[col.positions], c[col.countFrom]);
    return main && { ...main, rebound: clickAdjuster(c[col.reboundPositions], c[col.reboundCountFrom]) };
  };
  return { front: axle('front'), rear: axle('rear') };
}

/** A car's adjusters, read from its row: what the click checks of setups, quick changes and suggestions go by. */
export async function carAdjusters(db: Db, carId: string): Promise<Car['damperAdjusters']> {
  return damperAdjustersOf(await loadCarEntity(db, carId));
}

function columnsFrom(input: Partial<CreateCarInput>): Partial<CarEntity> {
  const out: Partial<CarEntity> = {};
  if (input.name !== undefined) out.name = input.name;
  if (input.classCode !== undefined) out.classCode = input.classCode;
  if (input.carNumber !== undefined) out.carNumber = input.carNumber || null;
  if (input.tyreSize !== undefined) out.tyreSize = input.tyreSize || null;
  if (input.notes !== undefined) out.notes = input.notes || null;
  for (const axle of AXLES) {
    const a = input.damperAdjusters?.[axle];
    if (a === undefined) continue;
    const col = COLUMNS[axle];
    out[col.positions] = a?.positions ?? null;
    out[col.countFrom] = a?.countFrom ?? null;
    // An adjuster given without its rebound keeps the rebound stored; an axle with no adjuster has no rebound either.
    if (a === null || a.rebound !== undefined) {
      out[col.reboundPositions] = a?.rebound?.positions ?? null;
      out[col.reboundCountFrom] = a?.rebound?.countFrom ?? null;
    }
  }
  const m = input.motionRatios;
  if (m?.front !== undefined) out.frontMotionRatio = m.front;
  if (m?.rear !== undefined) out.rearMotionRatio = m.rear;
  return out;
}

async function peopleOf(db: Db, cars: CarEntity[]) {
  if (cars.length === 0) return { names: new Map<string, string>(), coDrivers: new Map<string, Person[]>() };
  const ids = cars.map((c) => c.id);
  const rows: { car_id: string; user_id: string; display_name: string }[] = await db.query(
    `SELECT d.car_id, d.user_id, u.display_name
       FROM car_co_drivers d JOIN users u ON u.id = d.user_id
      WHERE d.car_id = ANY($1) ORDER BY d.created_at`,
    [ids],
  );
  const owners: { id: string; display_name: string }[] = await db.query(
    `SELECT id, display_name FROM users WHERE id = ANY($1)`,
    [[...new Set(cars.map((c) => c.ownerId))]],
  );
  const names = new Map(owners.map((o) => [o.id, o.display_name]));
  const coDrivers = new Map<string, Person[]>();
  for (const r of rows) {
    const list = coDrivers.get(r.car_id) ?? [];
    list.push({ id: r.user_id, displayName: r.display_name });
    coDrivers.set(r.car_id, list);
  }
  return { names, coDrivers };
}

function toCar(c: CarEntity, people: Awaited<ReturnType<typeof peopleOf>>): Car {
  return {
    id: c.id,
    owner: { id: c.ownerId, displayName: people.names.get(c.ownerId) ?? '' },
    coDrivers: people.coDrivers.get(c.id) ?? [],
    name: c.name,
    classCode: c.classCode,
    carNumber: c.carNumber,
    tyreSize: c.tyreSize,
    damperAdjusters: damperAdjustersOf(c),
    motionRatios: { front: c.frontMotionRatio, rear: c.rearMotionRatio },
    notes: c.notes,
    version: c.version,
    createdAt: c.createdAt.toISOString(),
    updatedAt: c.updatedAt.toISOString(),
  };
}

export async function loadCar(db: Db, carId: string): Promise<Car> {
  const car = await db.getRepository(CarEntity).findOneBy({ id: carId });
  if (!car) throw new AppError('not_found', 'That car was not found.');
  return toCar(car, await peopleOf(db, [car]));
}

export async function loadCarEntity(db: Db, carId: string): Promise<CarEntity> {
  const car = await db.getRepository(CarEntity).findOneBy({ id: carId });
  if (!car) throw new AppError('not_found', 'That car was not found.');
  return car;
}

export async function createCar(ds: DataSource, user: User, input: CreateCarInput): Promise<{ car: Car; created: boolean }> {
  const { inserted, id } = await insertUnlessPresent(ds.manager, CarEntity, {
    ...(input.id ? { id: input.id } : {}),
    ...columnsFrom(input),
    ownerId: user.id,
  });
  const carId = id ?? input.id!;
  const stored = await ds.getRepository(CarEntity).findOneBy({ id: carId });
  if (!stored || stored.ownerId !== user.id) throw new AppError('conflict', 'That car id is already in use.');
  return { car: await loadCar(ds, carId), created: inserted };
}

export async function listCars(ds: DataSource, user: User): Promise<Car[]> {
  const ids: { id: string }[] = await ds.query(`SELECT id FROM ${accessibleCarIdsSql('$1')} x`, [user.id]);
  if (ids.length === 0) return [];
  const cars = await ds
    .getRepository(CarEntity)
    .createQueryBuilder('c')
    .where('c.id IN (:...ids)', { ids: ids.map((r) => r.id) })
    .orderBy('c.created_at', 'ASC')
    .getMany();
  const people = await peopleOf(ds, cars);
  return cars.map((c) => toCar(c, people));
}

export async function getCar(ds: DataSource, user: User, carId: string): Promise<Car> {
  await assertCarAccess(ds, user, carId, 'read');
  return loadCar(ds, carId);
}

export async function updateCar(ds: DataSource, user: User, carId: string, input: UpdateCarInput): Promise<Car> {
  await assertCarAccess(ds, user, carId, 'manage');
  const { version, ...rest } = input;
  const result = await ds
    .createQueryBuilder()
    .update(CarEntity)
    .set({ ...columnsFrom(rest), version: () => 'version + 1', updatedAt: () => 'now()' })
    .where('id = :carId AND version = :version', { carId, version })
    .execute();
  if (result.affected !== 1) throw staleVersion(await loadCar(ds, carId));
  return loadCar(ds, carId);
}

export async function deleteCar(ds: DataSource, user: User, carId: string): Promise<void> {
  await assertCarAccess(ds, user, carId, 'manage');
  await ds.getRepository(CarEntity).delete({ id: carId });
}

/**
 * The owner adds a co-driver by e-mail. They are not asked first, so they are told: a notification (and an e-mail)
 * names who added them, and their own page for the car lets them take themselves off it.
 */
export async function addCoDriver(ds: DataSource, mail: MailSettings | undefined, user: User, carId: string, email: string): Promise<Car> {
  await assertCarAccess(ds, user, carId, 'manage');
  const found: { id: string }[] = await ds.query('SELECT id FROM users WHERE email = $1 AND closed_at IS NULL', [email.trim().toLowerCase()]);
  const coDriverId = found[0]?.id;
  if (!coDriverId) {
    throw new AppError('validation_failed', 'No account uses that e-mail.', { email: ['No account uses that e-mail; ask them to register first'] });
  }
  const car = await loadCarEntity(ds, carId);
  if (car.ownerId === coDriverId) {
    throw new AppError('validation_failed', 'The owner already drives this car.', { email: ['That is the car\'s owner'] });
  }
  const outbox = await ds.transaction(async (m) => {
    const inserted: unknown[] = await m.query(
      'INSERT INTO car_co_drivers (car_id, user_id) VALUES ($1, $2) ON CONFLICT DO NOTHING RETURNING car_id',
      [carId, coDriverId],
    );
    if (inserted.length === 0) return [];
    return notify(m, mail, {
      kind: 'co_driver_added',
      actorId: user.id,
      carId,
      summary: `${user.displayName} added you as a co-driver of ${car.name}`,
      detail: 'You can log runs, setups and tread readings for it, and see its season. If this is a mistake, take yourself off it under Drivers on the car\'s page.',
      recipients: [{ userId: coDriverId, link: `/cars/${carId}`, reason: `You get this e-mail because ${user.displayName} added you to a car in Scrubline.` }],
    });
  });
  sendOutbox(mail, outbox);
  return loadCar(ds, carId);
}

export async function removeCoDriver(ds: DataSource, user: User, carId: string, coDriverId: string): Promise<void> {
  // A co-driver may take themselves off a car; otherwise it is the owner's call.
  const relation = await assertCarAccess(ds, user, carId, 'read');
  if (!(relation === 'owner' || coDriverId === user.id)) await assertCarAccess(ds, user, carId, 'manage');
  const res = await ds.getRepository(CarCoDriverEntity).delete({ carId, userId: coDriverId });
  if (!res.affected) throw new AppError('not_found', 'That co-driver was not found on this car.');
}
