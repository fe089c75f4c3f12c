import type { Invoice } from '../../../../shared/service/invoice.schema';
import type { MeasuredCorner, WorkOrder } from '../../../../shared/service/work-order.schema';
import type { UnitPreferences } from '../../../../shared/calc/units.calc';
import { COLLAB_IDS, SHOP, SHOP_NAME, staffUser } from '../../fixtures/collab';
import { CAR, IDS, list, user } from '../../fixtures/season';
import { jsonResponse, stubFetch, type StubRoutes } from '../../test-utils';

/** An invented visit: Dusty's shop aligns Maren's roadster. */
export const SERVICE_IDS = {
  workOrder: '0a111111-1111-4111-8111-111111111111',
  invoice: '1a111111-1111-4111-8111-111111111111',
  newSetup: '52222222-2222-4222-8222-222222222222',
} as const;

const emptyCorner = (): MeasuredCorner => ({ camberDeg: null, toeMm: null, casterDeg: null, rideHeightMm: null, cornerWeightKg: null });
const perCorner = <T,>(make: () => T) => ({ lf: make(), rf: make(), lr: make(), rr: make() });

export function workOrder(partial: Partial<WorkOrder> = {}): WorkOrder {
  return {
    id: SERVICE_IDS.workOrder,
    carId: IDS.car,
    carName: 'Grey roadster',
    shop: { id: COLLAB_IDS.shop, name: SHOP_NAME, compressedLengthToleranceMm: 13, currency: 'usd', taxRatePct: 0 },
    openedBy: { id: COLLAB_IDS.dusty, displayName: 'Dusty Okonjo' },
    visitDate: '2026-06-10',
    requestedWork: 'Four-wheel alignment and corner weights',
    notes: null,
    status: 'open',
    handoverAt: null,
    closedBy: null,
    setupId: null,
    lines: [],
    totals: { partsCents: 0, labourCents: 0, subtotalCents: 0 },
    stages: { before: null, after: null },
    diff: perCorner(emptyCorner),
    buildSheet: { motionRatio: { front: null, rear: null }, corners: perCorner(() => null), checks: perCorner(() => null) },
    version: 1,
    createdAt: '2026-06-10T08:00:00.000Z',
    updatedAt: '2026-06-10T08:00:00.000Z',
    ...partial,
  };
}

export function invoice(partial: Partial<Invoice> = {}): Invoice {
  return {
    id: SERVICE_IDS.invoice,
    number: 14,
    workOrderId: SERVICE_IDS.workOrder,
    shopId: COLLAB_IDS.shop,
    carId: IDS.car,
    currency: 'usd',
    lines: [{ kind: 'labour', description: 'Alignment', quantity: 1.5, unitPriceCents: 9000, usedUp: false, amountCents: 13500 }],
    subtotalCents: 13500,
    taxRatePct: 8.875,
    taxCents: 1198,
    totalCents: 14698,
    status: 'open',
    paidAt: null,
    paidMethod: null,
    checkoutStarted: false,
    createdAt: '2026-06-10T17:00:00.000Z',
    issuer: { name: SHOP_NAME, details: '12 Kettle Lane, Brindle\nTel. 555 0143' },
    billTo: 'Maren Holt',
    car: { name: 'Grey roadster', carNumber: '47', classCode: 'SM' },
    visitDate: '2026-06-10',
    requestedWork: 'Four-wheel alignment and corner weights',
    ...partial,
  };
}

export const WO = `/api/work-orders/${SERVICE_IDS.workOrder}`;
export const WORK_ORDER_PATH = `/work-orders/${SERVICE_IDS.workOrder}`;
const MINE = { id: COLLAB_IDS.shop, name: SHOP_NAME, isShopAdmin: true, customerCount: 1 };

/** Signed in as the shop's admin, in the given units, with the open visit. */
export function stubStaff(units: UnitPreferences, extra: StubRoutes = {}) {
  return stubFetch({
    'GET /api/auth/session': jsonResponse(200, { user: { ...staffUser(), preferences: { units } } }),
    'GET /api/shops/mine': list([MINE]),
    [`GET /api/shops/${COLLAB_IDS.shop}`]: jsonResponse(200, SHOP),
    [`GET ${WO}`]: jsonResponse(200, workOrder()),
    ...extra,
  });
}

/** Signed in as the car's owner, who works for no shop. */
export function stubDriver(extra: StubRoutes = {}) {
  return stubFetch({
    'GET /api/auth/session': jsonResponse(200, { user: user() }),
    'GET /api/shops/mine': list([]),
    [`GET /api/cars/${CAR.id}`]: jsonResponse(200, CAR),
    ...extra,
  });
}
