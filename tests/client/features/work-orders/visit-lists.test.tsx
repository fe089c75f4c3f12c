// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import type { CarWorkOrderSummary, ShopWorkOrderRow } from '../../../../shared/service/work-order.schema';
import { jsonResponse, renderApp, requestsTo, setUpAppTests, stubFetch } from '../../test-utils';
import { stubCarPage } from '../../fixtures/car-page';
import { CAR, IDS, list, UUID } from '../../fixtures/season';
import { formatDay } from '@/lib/dates';
import { COLLAB_IDS, SHOP, SHOP_NAME, staffUser } from '../../fixtures/collab';
import { SERVICE_IDS, workOrder } from './service-fixtures';

setUpAppTests([
  () => import('@/app/routes/cars/car'),
  () => import('@/app/routes/shop/shop'),
  () => import('@/app/routes/shop/customer'),
  () => import('@/app/routes/work-orders/work-order'),
]);

const VISIT: CarWorkOrderSummary = {
  id: SERVICE_IDS.workOrder,
  shop: { id: COLLAB_IDS.shop, name: SHOP_NAME },
  visitDate: '2026-06-10',
  requestedWork: 'Four-wheel alignment and corner weights',
  status: 'closed',
  handoverAt: '2026-06-10T16:30:00.000Z',
  setupId: SERVICE_IDS.newSetup,
  invoice: { number: 14, status: 'paid', totalCents: 14698, currency: 'usd' },
};

describe('shop visits on the car page', () => {
  it('when the car has a closed visit, then it links to its work order and to the snapshot it wrote', async () => {
    stubCarPage(undefined, { [`GET /api/cars/${IDS.car}/work-orders`]: list([VISIT]) });
    renderApp(`/cars/${IDS.car}`);
    const visits = await screen.findByRole('list', { name: 'Shop visits' });
    const link = within(visits).getByRole('link', { name: new RegExp(SHOP_NAME) });
    expect(link.getAttribute('href')).toBe(`/work-orders/${SERVICE_IDS.workOrder}`);
    expect(within(visits).getByText('Four-wheel alignment and corner weights')).toBeTruthy();
    expect(within(visits).getByRole('link', { name: 'Setup it wrote' }).getAttribute('href')).toBe(`/cars/${IDS.car}#setup-${SERVICE_IDS.newSetup}`);
    // Where its invoice stands, on a line of its own under its state.
    expect(within(visits).getByText(/^Closed/).textContent).toBe('Closed · Setup it wrote');
    expect(within(visits).getByText(/^Closed/).nextElementSibling?.textContent).toBe('Invoice 14 · $146.98 · paid');
  });
});

describe('the shop’s board', () => {
  it('when the shop has an open work order, then the board lists it with a link to its page', async () => {
    const row: ShopWorkOrderRow = {
      id: SERVICE_IDS.workOrder,
      car: { id: IDS.car, name: CAR.name },
      owner: { id: IDS.maren, displayName: 'Maren Holt' },
      visitDate: '2026-06-10',
      requestedWork: 'Corner weights',
      status: 'open',
      handoverAt: null,
      invoice: null,
    };
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: staffUser() }),
      'GET /api/shops/mine': list([{ id: COLLAB_IDS.shop, name: SHOP_NAME, isShopAdmin: true, customerCount: 1 }]),
      [`GET /api/shops/${COLLAB_IDS.shop}`]: jsonResponse(200, SHOP),
      [`GET /api/shops/${COLLAB_IDS.shop}/customers`]: list([]),
      [`GET /api/shops/${COLLAB_IDS.shop}/work-orders?status=open`]: list([row]),
    });
    renderApp('/shop');
    const board = await screen.findByRole('list', { name: 'Open work orders' });
    expect(within(board).getByRole('link', { name: /Grey roadster/ }).getAttribute('href')).toBe(`/work-orders/${SERVICE_IDS.workOrder}`);
    expect(within(board).getByText('Maren Holt')).toBeTruthy();
    // An open visit is not invoiced yet, and says nothing of it.
    expect(within(board).queryByText(/invoice/i)).toBeNull();
  });
});

describe('finding a visit again once it is closed', () => {
  const closedRow = (n: number): ShopWorkOrderRow => ({
    id: `0c0c0c0c-0000-4000-8000-${String(n).padStart(12, '0')}`,
    car: { id: IDS.car, name: CAR.name },
    owner: { id: IDS.maren, displayName: 'Maren Holt' },
    visitDate: `2026-05-${String(30 - n).padStart(2, '0')}`,
    requestedWork: `Visit ${n}`,
    status: 'closed',
    handoverAt: `2026-05-${String(30 - n).padStart(2, '0')}T16:00:00.000Z`,
    invoice: n === 1 ? null : { number: 20 - n, status: n === 2 ? 'open' : 'paid', totalCents: 10000 + n, currency: 'usd' },
  });

  it('when the shop has closed visits, then its page lists the latest eight, newest first, each one card-sized link with its handover day, and shows the rest on request', async () => {
    const rows = Array.from({ length: 10 }, (_, i) => closedRow(i + 1));
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: staffUser() }),
      'GET /api/shops/mine': list([{ id: COLLAB_IDS.shop, name: SHOP_NAME, isShopAdmin: true, customerCount: 1 }]),
      [`GET /api/shops/${COLLAB_IDS.shop}`]: jsonResponse(200, SHOP),
      [`GET /api/shops/${COLLAB_IDS.shop}/customers`]: list([]),
      [`GET /api/shops/${COLLAB_IDS.shop}/work-orders?status=open`]: list([]),
      [`GET /api/shops/${COLLAB_IDS.shop}/work-orders?status=closed`]: list(rows),
    });
    renderApp('/shop');
    const u = userEvent.setup();

    const closed = await screen.findByRole('list', { name: 'Closed visits' });
    const links = within(closed).getAllByRole('link');
    expect(links.map((l) => l.getAttribute('href'))).toEqual(rows.slice(0, 8).map((r) => `/work-orders/${r.id}`));
    // The whole card is the link, with the day it was handed over.
    expect(links[0]!.textContent).toContain('Visit 1');
    expect(links[0]!.textContent).toContain(`handed over ${formatDay(rows[0]!.handoverAt!)}`);
    // Each says where its invoice stands, so one not made or not paid is seen from the list.
    expect(within(links[0]!).getByText('No invoice yet')).toBeTruthy();
    expect(within(links[1]!).getByText('Invoice 18 · $100.02 · not paid').className).toContain('font-semibold');
    expect(within(links[2]!).getByText('Invoice 17 · $100.03 · paid').className).toContain('text-ink-muted');
    expect(screen.getByText('No open work orders. Open one from a customer’s car.')).toBeTruthy();

    await u.click(screen.getByRole('button', { name: 'Show all 10 closed visits' }));
    expect(within(closed).getAllByRole('link')).toHaveLength(10);
    expect(screen.queryByRole('button', { name: /Show all/ })).toBeNull();
  });

  it('when staff open a customer\'s car, then its visits to the shop are listed, newest first, each linking to its work order', async () => {
    const older: CarWorkOrderSummary = { ...VISIT, id: '0c0c0c0c-0000-4000-8000-0000000000aa', visitDate: '2026-03-02', requestedWork: 'Coilovers fitted', setupId: null };
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: staffUser() }),
      [`GET /api/cars/${IDS.car}`]: jsonResponse(200, CAR),
      [`GET /api/cars/${IDS.car}/setups`]: list([]),
      [`GET /api/cars/${IDS.car}/season?minDepthMm=1.6`]: jsonResponse(200, { carId: IDS.car, events: [], setupChanges: [], changeLog: [], tyreLife: [] }),
      [`GET /api/cars/${IDS.car}/suggestions`]: list([]),
      [`GET /api/cars/${IDS.car}/work-orders`]: list([older, VISIT]),
      'GET /api/shops/mine': list([{ id: COLLAB_IDS.shop, name: SHOP_NAME, isShopAdmin: true, customerCount: 1 }]),
    });
    renderApp(`/shop/customers/${IDS.car}`);

    const visits = await screen.findByRole('list', { name: 'Shop visits' });
    const items = within(visits).getAllByRole('listitem');
    expect(items.map((li) => within(li).getByText(/Four-wheel|Coilovers/).textContent)).toEqual(['Four-wheel alignment and corner weights', 'Coilovers fitted']);
    expect(within(items[1]!).getByRole('link', { name: new RegExp(SHOP_NAME) }).getAttribute('href')).toBe(`/work-orders/${older.id}`);
  });
});

describe('opening a work order from a customer’s car', () => {
  it('when staff open one, then it is sent with an id made here and the work order page opens', async () => {
    const POST = `POST /api/cars/${IDS.car}/work-orders`;
    const fetchMock = stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: staffUser() }),
      [`GET /api/cars/${IDS.car}`]: jsonResponse(200, CAR),
      [`GET /api/cars/${IDS.car}/setups`]: list([]),
      [`GET /api/cars/${IDS.car}/season?minDepthMm=1.6`]: jsonResponse(200, { carId: IDS.car, events: [], setupChanges: [], changeLog: [], tyreLife: [] }),
      [`GET /api/cars/${IDS.car}/suggestions`]: list([]),
      [POST]: ({ body }) => jsonResponse(201, workOrder({ id: (body as { id: string }).id })),
      [`GET /api/work-orders/${SERVICE_IDS.workOrder}`]: jsonResponse(200, workOrder()),
      'GET /api/shops/mine': list([{ id: COLLAB_IDS.shop, name: SHOP_NAME, isShopAdmin: true, customerCount: 1 }]),
      [`GET /api/shops/${COLLAB_IDS.shop}`]: jsonResponse(200, SHOP),
    });
    const { router } = renderApp(`/shop/customers/${IDS.car}`);
    const u = userEvent.setup();
    const form = await screen.findByRole('form', { name: 'Open a work order' });
    const date = within(form).getByLabelText('Visit date');
    expect((date as HTMLInputElement).value).toMatch(/^\d{4}-\d{2}-\d{2}$/);
    await u.clear(date);
    await u.type(date, '2026-06-12');
    await u.type(within(form).getByLabelText('Requested work'), 'Fit coilovers and align');
    await u.click(within(form).getByRole('button', { name: 'Open a work order' }));

    await waitFor(() => expect(requestsTo(fetchMock, POST)).toHaveLength(1));
    const body = requestsTo(fetchMock, POST)[0]!.body as { id: string; visitDate: string; requestedWork: string };
    expect(body.id).toMatch(UUID);
    expect(body).toMatchObject({ visitDate: '2026-06-12', requestedWork: 'Fit coilovers and align' });
    await waitFor(() => expect(router.state.location.pathname).toBe(`/work-orders/${body.id}`));
  });
});
