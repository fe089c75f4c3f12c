import { randomUUID } from 'node:crypto';
import type { TestApp } from '../test-app';
import type { startFakePayments } from '../../../scripts/lib/fake-payments';
import { createPaymentSettings } from '../../../server/features/payments/payment-settings';

export interface Line {
  kind: 'part' | 'labour';
  description: string;
  quantity: number;
  unitPriceCents: number;
  /** A part used up in the work rather than fitted; false when left out. */
  usedUp?: boolean;
}

/** Two camber arms, two and a half hours of fitting and alignment, a third of a tin of grease (invented prices). */
export const LINES: Line[] = [
  { kind: 'part', description: 'Adjustable front camber arm', quantity: 2, unitPriceCents: 18950 },
  { kind: 'labour', description: 'Fit arms and four-wheel alignment', quantity: 2.5, unitPriceCents: 9500 },
  { kind: 'part', description: 'Assembly grease', quantity: 0.33, unitPriceCents: 1999 },
];

/**
 * A visit written straight into the tables, as the work-order feature leaves it: `closed`
 * (handed over) or still `open`, with its lines.
 */
export async function visit(
  t: TestApp,
  g: { shopId: string; carId: string; staffId: string },
  opts: { status?: 'open' | 'closed'; lines?: Line[] } = {},
) {
  const id = randomUUID();
  const closed = (opts.status ?? 'closed') === 'closed';
  await t.ds.query(
    `INSERT INTO work_orders (id, shop_id, car_id, opened_by, visit_date, requested_work, status, handover_at, closed_by)
     VALUES ($1, $2, $3, $4, '2026-06-12', 'Fit camber arms and align', $5, $6, $7)`,
    [id, g.shopId, g.carId, g.staffId, closed ? 'closed' : 'open', closed ? '2026-06-12T16:00:00Z' : null, closed ? g.staffId : null],
  );
  for (const [position, line] of (opts.lines ?? LINES).entries()) {
    await t.ds.query(
      `INSERT INTO work_order_lines (work_order_id, kind, description, quantity, unit_price_cents, used_up, position) VALUES ($1, $2, $3, $4, $5, $6, $7)`,
      [id, line.kind, line.description, line.quantity, line.unitPriceCents, line.usedUp ?? false, position],
    );
  }
  return id;
}

/** Payment settings pointing the SDK at a running local fake. */
export function fakeSettings(fake: Awaited<ReturnType<typeof startFakePayments>>, publicUrl = 'http://scrubline.test') {
  return createPaymentSettings({ secretKey: fake.secretKey, webhookSecret: fake.webhookSecret, apiUrl: fake.url, publicUrl });
}
