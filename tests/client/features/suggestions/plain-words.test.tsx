// @vitest-environment jsdom
import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { Setup } from '../../../../shared/season/setup.schema';
import { formatDay } from '@/lib/dates';
import { jsonResponse, renderApp, setUpAppTests, stubFetch } from '../../test-utils';
import { stubCarPage } from '../../fixtures/car-page';
import { BASE_SETUP, CAR, IDS, list, user } from '../../fixtures/season';
import { COLLAB_IDS, GRANT, SHOP_NAME, staffUser } from '../../fixtures/collab';

setUpAppTests([
  () => import('@/app/routes/cars/car'),
  () => import('@/app/routes/suggestions/new-suggestion'),
  () => import('@/app/more-routes'),
]);

const HANDED_BACK: Setup = {
  ...BASE_SETUP,
  id: '53333333-3333-4333-8333-333333333333',
  label: `${SHOP_NAME}: Corner balance`,
  effectiveFrom: '2026-09-03T16:00:00.000Z',
  derivedFromId: IDS.setupBase,
  workOrder: { id: '7e000000-0000-4000-8000-000000000001', shopName: SHOP_NAME, visitDate: '2026-09-03' },
};

describe('plain words on the car page and the shop’s suggestion form', () => {
  it('when a snapshot was handed back by a shop, then its link names the shop and the visit’s day, not "the work order"', async () => {
    stubCarPage(user(), { [`GET /api/cars/${IDS.car}/setups`]: list([HANDED_BACK, BASE_SETUP]) });
    renderApp(`/cars/${IDS.car}`);

    const badge = await screen.findByRole('link', { name: `handed back by ${SHOP_NAME} after the visit of ${formatDay('2026-09-03')}` });
    expect(badge.getAttribute('href')).toBe(`/work-orders/${HANDED_BACK.workOrder!.id}`);
    expect(screen.queryByText(/the work order$/)).toBeNull();
  });

  it('when the driver reads Shop access, then the date says when access was given, not "Since"', async () => {
    stubCarPage(user(), { [`GET /api/cars/${IDS.car}/shop-grants`]: list([GRANT]) });
    renderApp(`/cars/${IDS.car}`);

    const access = await screen.findByRole('region', { name: 'Shop access' });
    expect(await within(access).findByText(`Access given ${formatDay(GRANT.createdAt)} by Maren Holt`)).toBeTruthy();
    expect(within(access).queryByText(/^Since /)).toBeNull();
  });

  it('when shop staff open the suggestion form, then it names the setup plainly and the bottom bar marks Shop, not Cars', async () => {
    const base = { ...BASE_SETUP, label: `From ${SHOP_NAME}: More front camber` };
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: staffUser() }),
      [`GET /api/cars/${IDS.car}`]: jsonResponse(200, CAR),
      [`GET /api/cars/${IDS.car}/setups`]: list([base]),
      'GET /api/shops/mine': list([{ id: COLLAB_IDS.shop, name: SHOP_NAME, isShopAdmin: true, customerCount: 1 }]),
    });
    const { router } = renderApp(`/cars/${IDS.car}/suggestions/new?from=${IDS.setupBase}`);

    const form = await screen.findByRole('form', { name: 'Suggest a setup change' });
    expect(router.state.location.pathname).toBe(`/shop/customers/${IDS.car}/suggestions/new`);
    expect(form.textContent).toContain(`For the setup “From ${SHOP_NAME}: More front camber”`);
    expect(form.textContent).not.toContain('Changes to From');
    const bar = screen.getAllByRole('navigation', { name: 'Main' }).at(-1)!;
    expect(within(bar).getByRole('link', { name: 'Shop' }).className).toContain('text-link');
    expect(within(bar).getByRole('link', { name: 'Cars' }).className).not.toContain('text-link');
  });
});
