// @vitest-environment jsdom
import { screen, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { METRIC_PREFERENCES } from '../../../../shared/calc/units.calc';
import { jsonResponse, renderApp, setUpAppTests, stubFetch } from '../../test-utils';
import { BASE_SETUP, CAR, IDS, list, user, type SignedInUser } from '../../fixtures/season';

setUpAppTests([() => import('@/app/routes/cars/car'), () => import('@/app/routes/setups/setup-sheet')]);

/** Staff of a shop the car was shared with: they may read it, but not drive it. */
const STAFF = { ...user(METRIC_PREFERENCES), id: '5a5a5a5a-0000-4000-8000-00000000005a', email: 'bench@example.test', displayName: 'Bench Hand', roles: ['driver', 'shop_staff'] };

function stub(me: SignedInUser) {
  return stubFetch({
    'GET /api/auth/session': jsonResponse(200, { user: me }),
    [`GET /api/cars/${IDS.car}`]: jsonResponse(200, CAR),
    [`GET /api/cars/${IDS.car}/setups`]: list([BASE_SETUP]),
    [`GET /api/setups/${BASE_SETUP.id}`]: jsonResponse(200, BASE_SETUP),
  });
}

describe('a customer\'s car opened by shop staff', () => {
  it('when staff open the driver\'s address of a car, then they land on the shop\'s page of it, with the setup and thread asked for, never on the driver\'s actions', async () => {
    stub(STAFF);
    const { router } = renderApp(`/cars/${IDS.car}?comments=${BASE_SETUP.id}#setup-${BASE_SETUP.id}`);

    await waitFor(() => expect(router.state.location.pathname).toBe(`/shop/customers/${IDS.car}`));
    expect(router.state.location.search).toBe(`?comments=${BASE_SETUP.id}`);
    expect(router.state.location.hash).toBe(`#setup-${BASE_SETUP.id}`);
    expect(screen.queryByRole('link', { name: /New setup/ })).toBeNull();
    expect(screen.queryByRole('link', { name: /Enter tread/ })).toBeNull();
  });

  it('when the car\'s driver opens it, then the car page stays, with its actions', async () => {
    stub(user(METRIC_PREFERENCES));
    const { router } = renderApp(`/cars/${IDS.car}`);

    expect(await screen.findByRole('link', { name: /New setup/ })).toBeTruthy();
    expect(router.state.location.pathname).toBe(`/cars/${IDS.car}`);
  });

  it('when staff go back from a setup\'s printable sheet, then the link leads to the shop\'s page of the car at that setup', async () => {
    stub(STAFF);
    renderApp(`/setups/${BASE_SETUP.id}/sheet`);
    expect((await screen.findByRole('link', { name: CAR.name })).getAttribute('href')).toBe(`/shop/customers/${IDS.car}#setup-${BASE_SETUP.id}`);
  });

  it('when the driver goes back from the sheet, then the link leads to the car page at that setup', async () => {
    stub(user(METRIC_PREFERENCES));
    renderApp(`/setups/${BASE_SETUP.id}/sheet`);
    expect((await screen.findByRole('link', { name: CAR.name })).getAttribute('href')).toBe(`/cars/${IDS.car}#setup-${BASE_SETUP.id}`);
  });
});
