// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { errorResponse, jsonResponse, renderApp, requestsTo, setUpAppTests, type StubRoutes } from '../../test-utils';
import { stubCarPage } from '../../fixtures/car-page';
import { coDriverUser, IDS, list, user, type SignedInUser } from '../../fixtures/season';
import { COLLAB_IDS, GRANT, SHOP_NAME } from '../../fixtures/collab';

const CAR_PAGE = `/cars/${IDS.car}`;
const GRANTS = `/api/cars/${IDS.car}/shop-grants`;

setUpAppTests([() => import('@/app/routes/cars/car')]);

/** The car page with Kettle Lane already let in. */
function stubGranted(me: SignedInUser = user(), extra: StubRoutes = {}) {
  return stubCarPage(me, { [`GET ${GRANTS}`]: list([GRANT]), ...extra });
}

const section = () => screen.getByRole('region', { name: 'Shop access' });

describe('shop access on the car page', () => {
  it('says in one sentence what a shop can and cannot do', async () => {
    stubGranted();
    renderApp(CAR_PAGE);
    await screen.findByRole('list', { name: 'Shops with access' });
    expect(
      within(section()).getByText(/can see this car’s season, comment on it and suggest setup changes .* it can never edit your runs or setups\./),
    ).toBeTruthy();
  });

  it('when the owner finds a shop and grants it, then the server gets that shop’s id and the list shows it', async () => {
    let granted = false;
    const other = { id: COLLAB_IDS.otherShop, name: 'Spoon Hill Alignment' };
    const fetchMock = stubGranted(user(), {
      [`GET ${GRANTS}`]: () => list(granted ? [GRANT, { ...GRANT, shop: other }] : [GRANT]),
      'GET /api/shops?q=Spoon': list([other]),
      [`POST ${GRANTS}`]: () => {
        granted = true;
        return jsonResponse(201, { ...GRANT, shop: other });
      },
    });
    renderApp(CAR_PAGE);
    const u = userEvent.setup();

    await u.click(await screen.findByLabelText('Find a shop'));
    await u.paste('Spoon');
    const found = await screen.findByRole('list', { name: 'Shops found' });
    await u.click(within(found).getByRole('button', { name: 'Grant access to Spoon Hill Alignment' }));

    expect(await screen.findByText('Spoon Hill Alignment can now see this car’s season.')).toBeTruthy();
    await waitFor(() => expect(screen.getByRole('list', { name: 'Shops with access' }).textContent).toContain('Spoon Hill Alignment'));
    expect(requestsTo(fetchMock, `POST ${GRANTS}`)[0]?.body).toEqual({ shopId: COLLAB_IDS.otherShop });
  });

  it('when a grant is refused with a field error, then the message shows where the owner asked', async () => {
    const other = { id: COLLAB_IDS.otherShop, name: 'Spoon Hill Alignment' };
    stubGranted(user(), {
      'GET /api/shops?q=Spoon': list([other]),
      [`POST ${GRANTS}`]: errorResponse(400, 'validation_failed', 'Some fields are not valid.', { shopId: ['That shop was not found'] }),
    });
    renderApp(CAR_PAGE);
    const u = userEvent.setup();

    await u.click(await screen.findByLabelText('Find a shop'));
    await u.paste('Spoon');
    await u.click(await screen.findByRole('button', { name: 'Grant access to Spoon Hill Alignment' }));

    expect((await within(section()).findByRole('alert')).textContent).toContain('That shop was not found');
  });

  it('when the owner revokes a shop and confirms, then the server is asked and the shop leaves the list', async () => {
    let revoked = false;
    const fetchMock = stubGranted(user(), {
      [`GET ${GRANTS}`]: () => list(revoked ? [] : [GRANT]),
      [`DELETE ${GRANTS}/${COLLAB_IDS.shop}`]: () => {
        revoked = true;
        return jsonResponse(204);
      },
    });
    renderApp(CAR_PAGE);
    const u = userEvent.setup();

    await u.click(await screen.findByRole('button', { name: `Revoke ${SHOP_NAME}` }));
    const dialog = await screen.findByRole('dialog', { name: `Revoke ${SHOP_NAME}’s access?` });
    await u.click(within(dialog).getByRole('button', { name: 'Revoke access' }));

    expect(await within(section()).findByText('No shop can see this car.')).toBeTruthy();
    expect(requestsTo(fetchMock, `DELETE ${GRANTS}/${COLLAB_IDS.shop}`)).toHaveLength(1);
  });

  it('when the signed-in user is a co-driver, then the shops are listed without grant or revoke', async () => {
    stubGranted(coDriverUser());
    renderApp(CAR_PAGE);

    const granted = await screen.findByRole('list', { name: 'Shops with access' });
    expect(within(granted).getByText(SHOP_NAME)).toBeTruthy();
    expect(within(section()).getByText('Only the owner, Maren Holt, can let shops in or take them out.')).toBeTruthy();
    expect(screen.queryByLabelText('Find a shop')).toBeNull();
    expect(screen.queryByRole('button', { name: /^Revoke/ })).toBeNull();
  });
});
