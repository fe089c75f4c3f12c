import { randomUUID } from 'node:crypto';
import { expect } from 'vitest';
import { signedInClient, type TestApp } from '../test-app';

export type Client = Awaited<ReturnType<typeof signedInClient>>['c'];

/** A signed-in driver with one car (5-position adjusters, counted from full soft) and one event. */
export async function driverWithCarAndEvent(t: TestApp, opts: { conePenaltySec?: number } = {}) {
  const driver = await signedInClient(t, { displayName: 'Nell Ashdown' });
  const car = await driver.c.post('/api/cars', {
    name: 'Blue roadster',
    classCode: 'SS',
    carNumber: '42',
    tyreSize: '205/50R15',
    damperAdjusters: { front: { positions: 12, countFrom: 'full_soft' }, rear: { positions: 12, countFrom: 'full_soft' } },
    motionRatios: { front: 0.7, rear: 0.75 },
  });
  expect(car.status).toBe(201);
  const event = await driver.c.post('/api/events', {
    name: 'Spring points round 1',
    date: '2026-04-12',
    venue: 'Harrow Flats airfield',
    conePenaltySec: opts.conePenaltySec ?? 2,
  });
  expect(event.status).toBe(201);
  return { ...driver, carId: car.body.id as string, eventId: event.body.id as string, car: car.body };
}

export function runBody(carId: string, eventId: string, over: Record<string, unknown> = {}) {
  return {
    id: randomUUID(),
    carId,
    eventId,
    runNumber: 1,
    rawTimeSec: 45.678,
    cones: 0,
    status: 'finished',
    recordedAt: '2026-04-12T10:00:00Z',
    ...over,
  };
}

export function setupBody(over: Record<string, unknown> = {}) {
  return {
    label: 'Baseline',
    effectiveFrom: '2026-04-01T00:00:00Z',
    corners: {
      lf: { camberDeg: -1.5, toeMm: 0, damperClicks: 4, coldPressureKpa: 220 },
      rf: { camberDeg: -1.5, toeMm: 0, damperClicks: 4, coldPressureKpa: 220 },
      lr: { camberDeg: -1.0, toeMm: 1, damperClicks: 6, coldPressureKpa: 210 },
      rr: { camberDeg: -1.0, toeMm: 1, damperClicks: 6, coldPressureKpa: 210 },
    },
    axles: { front: { antiRollBar: 'hole 2' }, rear: { antiRollBar: 'disconnected' } },
    ...over,
  };
}
