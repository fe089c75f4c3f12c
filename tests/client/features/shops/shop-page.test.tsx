// @vitest-environment jsdom
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeAll, beforeEach, describe, expect, it, vi } from 'vitest';
import { dropCsrfToken } from '@/lib/api-client';
import { clearToasts } from '@/lib/toast-store';
import { clearTestOutboxes, errorResponse, jsonResponse, renderApp, requestsTo, stubFetch } from '../../test-utils';
import { IDS, list } from '../../fixtures/season';
import { COLLAB_IDS, customer, SHOP, SHOP_NAME, staffUser } from '../../fixtures/collab';

const NOW = new Date('2026-06-08T12:00:00.000Z');

beforeAll(async () => {
  await import('@/app/routes/shop/shop');
}, 30_000);
beforeEach(() => {
  dropCsrfToken();
  // Only the clock: "2 hours ago" needs a fixed now; timers stay real.
  vi.useFakeTimers({ toFake: ['Date'] });
  vi.setSystemTime(NOW);
});
afterEach(async () => {
  vi.useRealTimers();
  await clearTestOutboxes();
  cleanup();
  clearToasts();
  vi.unstubAllGlobals();
});

const MINE = { id: COLLAB_IDS.shop, name: SHOP_NAME, isShopAdmin: true, customerCount: 1 };

function stubShop(extra: Parameters<typeof stubFetch>[0] = {}) {
  return stubFetch({
    'GET /api/auth/session': jsonResponse(200, { user: staffUser() }),
    'GET /api/shops/mine': list([MINE]),
    [`GET /api/shops/${COLLAB_IDS.shop}`]: jsonResponse(200, SHOP),
    [`GET /api/shops/${COLLAB_IDS.shop}/customers`]: list([
      customer({
        latestActivity: { at: '2026-06-08T10:00:00.000Z', kind: 'run', summary: 'Maren Holt’s run 4 at Harrow Flats — Round 4' },
        openSuggestions: 1,
      }),
    ]),
    ...extra,
  });
}

describe('the shop page', () => {
  it('when the shop has a customer, then the car shows with its owner, what happened last and how long ago, and open suggestions', async () => {
    stubShop();
    renderApp('/shop');

    const customers = await screen.findByRole('list', { name: 'Customers' });
    const link = within(customers).getByRole('link');
    expect(link.getAttribute('href')).toBe(`/shop/customers/${IDS.car}`);
    expect(link.textContent).toContain('Grey roadster');
    expect(link.textContent).toContain('Maren Holt');
    // The summary names what happened itself; nothing is put in front of it ("Run: Run 4 …" read twice).
    const lines = [...link.querySelectorAll('span')].map((span) => span.textContent);
    expect(lines).toContain('Maren Holt’s run 4 at Harrow Flats — Round 4 · about 2 hours ago');
    // date-fns formatDistance wording for 2 h (its documented table: 1.5 h to 23.5 h reads "about N hours").
    expect(link.textContent).toContain('about 2 hours ago');
    expect(link.textContent).toContain('1 open suggestion');
  });

  it('when a shop admin invites someone as an admin, then the e-mail and the choice go to the server', async () => {
    const fetchMock = stubShop({
      [`POST /api/shops/${COLLAB_IDS.shop}/invitations`]: jsonResponse(201, { email: 'sam@example.test', asAdmin: true }),
    });
    renderApp('/shop');
    const u = userEvent.setup();

    await u.type(await screen.findByLabelText('E-mail of the person to invite'), ' Sam@Example.test ');
    await u.click(screen.getByRole('checkbox', { name: /Shop admin/ }));
    await u.click(screen.getByRole('button', { name: 'Send invitation' }));

    expect(await screen.findByText('Invitation sent to sam@example.test.')).toBeTruthy();
    expect(requestsTo(fetchMock, `POST /api/shops/${COLLAB_IDS.shop}/invitations`)[0]?.body).toEqual({ email: 'sam@example.test', asAdmin: true });
    expect(within(screen.getByRole('list', { name: 'Pending invitations' })).getByText('newhand@example.test')).toBeTruthy();
  });

  it('when an invitation is refused for its e-mail, then the message shows on the e-mail field', async () => {
    stubShop({
      [`POST /api/shops/${COLLAB_IDS.shop}/invitations`]: errorResponse(400, 'validation_failed', 'Some fields are not valid.', {
        email: ['They already work here'],
      }),
    });
    renderApp('/shop');
    const u = userEvent.setup();

    const email = await screen.findByLabelText('E-mail of the person to invite');
    await u.type(email, 'wren@example.test');
    await u.click(screen.getByRole('button', { name: 'Send invitation' }));

    expect(await screen.findByText('They already work here')).toBeTruthy();
    expect(email.getAttribute('aria-invalid')).toBe('true');
  });

  it('when a shop admin removes a colleague and confirms, then the server is asked', async () => {
    const fetchMock = stubShop({
      'DELETE /api/shops/5a111111-1111-4111-8111-111111111111/staff/a4444444-4444-4444-8444-444444444444': jsonResponse(204),
    });
    renderApp('/shop');
    const u = userEvent.setup();

    // Not oneself: there is no button to remove the signed-in admin.
    await screen.findByRole('list', { name: 'Staff' });
    expect(screen.queryByRole('button', { name: 'Remove Dusty Okonjo' })).toBeNull();
    await u.click(screen.getByRole('button', { name: 'Remove Wren Adeyemi' }));
    await u.click(within(await screen.findByRole('dialog', { name: 'Remove Wren Adeyemi?' })).getByRole('button', { name: 'Remove from staff' }));

    await waitFor(() =>
      expect(requestsTo(fetchMock, `DELETE /api/shops/${COLLAB_IDS.shop}/staff/a4444444-4444-4444-8444-444444444444`)).toHaveLength(1),
    );
  });

  it('when the user is staff but not a shop admin, then they see the staff without invite or remove', async () => {
    stubShop({
      'GET /api/shops/mine': list([{ ...MINE, isShopAdmin: false }]),
      [`GET /api/shops/${COLLAB_IDS.shop}`]: jsonResponse(200, { ...SHOP, isShopAdmin: false }),
    });
    renderApp('/shop');

    await screen.findByRole('list', { name: 'Staff' });
    expect(screen.getByText('Only the shop’s admins can invite or remove staff.')).toBeTruthy();
    expect(screen.queryByLabelText('E-mail of the person to invite')).toBeNull();
    expect(screen.queryByRole('button', { name: /^Remove/ })).toBeNull();
  });

  it('when the user staffs two shops, then a switcher picks which one the page shows', async () => {
    const other = { id: COLLAB_IDS.otherShop, name: 'Spoon Hill Alignment', isShopAdmin: false, customerCount: 0 };
    stubShop({
      'GET /api/shops/mine': list([MINE, other]),
      [`GET /api/shops/${COLLAB_IDS.otherShop}`]: jsonResponse(200, { ...SHOP, id: other.id, name: other.name, isShopAdmin: false }),
      [`GET /api/shops/${COLLAB_IDS.otherShop}/customers`]: list([]),
    });
    const { router } = renderApp('/shop');
    const u = userEvent.setup();

    await u.selectOptions(await screen.findByLabelText('Shop'), 'Spoon Hill Alignment');

    expect(await screen.findByRole('heading', { level: 1, name: 'Spoon Hill Alignment' })).toBeTruthy();
    expect(await screen.findByText(/No cars yet/)).toBeTruthy();
    expect(router.state.location.search).toBe(`?shop=${COLLAB_IDS.otherShop}`);
  });

  it('when the user staffs no shop, then the page explains and opens one with the name given', async () => {
    let opened = false;
    const fetchMock = stubShop({
      'GET /api/shops/mine': () => list(opened ? [MINE] : []),
      'POST /api/shops': () => {
        opened = true;
        return jsonResponse(201, SHOP);
      },
    });
    renderApp('/shop');
    const u = userEvent.setup();

    expect(await screen.findByText(/You do not work for a shop here yet/)).toBeTruthy();
    await u.type(screen.getByLabelText('Shop name'), ' Kettle Lane Chassis Works ');
    await u.click(screen.getByRole('button', { name: 'Open the shop' }));

    expect(await screen.findByRole('heading', { level: 1, name: SHOP_NAME })).toBeTruthy();
    expect(requestsTo(fetchMock, 'POST /api/shops')[0]?.body).toEqual({ name: SHOP_NAME });
  });
});
