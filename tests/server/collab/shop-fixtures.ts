import { randomUUID } from 'node:crypto';
import { expect } from 'vitest';
import { signedInClient, type TestApp } from '../test-app';
import { driverWithCarAndEvent, type Client } from '../season/season-fixtures';

export const SHOP_NAME = 'Kettle Lane Chassis Works';

export interface Staff {
  c: Client;
  user: { id: string; displayName: string };
  email: string;
}

/** A signed-in user who opens a shop (so is its admin). */
export async function shopWithAdmin(t: TestApp, name = SHOP_NAME, displayName = 'Dusty Okonjo') {
  const admin = await signedInClient(t, { displayName });
  const res = await admin.c.post('/api/shops', { name });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return { shopId: res.body.id as string, admin: admin as Staff };
}

/** Another account put on the shop's staff directly (invitations are another feature's). */
export async function addStaff(t: TestApp, shopId: string, displayName = 'Wren Iyer', isShopAdmin = false): Promise<Staff> {
  const s = await signedInClient(t, { displayName });
  await t.ds.query('INSERT INTO shop_members (shop_id, user_id, is_shop_admin) VALUES ($1, $2, $3)', [shopId, s.user.id, isShopAdmin]);
  return s;
}

/**
 * A driver's car (with an event) granted to a shop: the driver is Nell Ashdown, the
 * shop's admin Dusty Okonjo. `staff` is the shop admin.
 */
export async function grantedCar(t: TestApp, opts: { shopName?: string } = {}) {
  const driver = await driverWithCarAndEvent(t);
  const { shopId, admin } = await shopWithAdmin(t, opts.shopName ?? SHOP_NAME);
  const res = await driver.c.post(`/api/cars/${driver.carId}/shop-grants`, { shopId });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return { driver, staff: admin, shopId };
}

export const depth = (innerMm: number, middleMm: number, outerMm: number) => ({ innerMm, middleMm, outerMm });

/** A tyre set on the car with one tread reading; returns the reading's id. */
export async function postTreadReading(c: Client, carId: string, takenAt = '2026-04-12T16:00:00Z') {
  const set = await c.post(`/api/cars/${carId}/tyre-sets`, { label: 'Set A', size: '205/50R15', boughtOn: '2026-03-01', startTreadMm: 7 });
  expect(set.status, JSON.stringify(set.body)).toBe(201);
  const reading = await c.post(`/api/tyre-sets/${set.body.id}/readings`, { id: randomUUID(), takenAt, corners: { lf: depth(6.1, 6.5, 6.6) } });
  expect(reading.status, JSON.stringify(reading.body)).toBe(201);
  return reading.body.id as string;
}
