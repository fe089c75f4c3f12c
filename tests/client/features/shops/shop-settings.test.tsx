// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { IMPERIAL_PREFERENCES, METRIC_PREFERENCES, type UnitPreferences } from '../../../../shared/calc/units.calc';
import type { UpdateShopSettingsInput } from '../../../../shared/collab/shop.schema';
import { errorResponse, jsonResponse, renderApp, requestsTo, setUpAppTests, stubFetch, type StubRoutes } from '../../test-utils';
import { list } from '../../fixtures/season';
import { COLLAB_IDS, SHOP, SHOP_NAME, staffUser } from '../../fixtures/collab';

setUpAppTests([() => import('@/app/routes/shop/shop')]);

const PATCH = `PATCH /api/shops/${COLLAB_IDS.shop}/settings`;

function stubShop({ admin = true, units = METRIC_PREFERENCES, extra = {} }: { admin?: boolean; units?: UnitPreferences; extra?: StubRoutes } = {}) {
  return stubFetch({
    'GET /api/auth/session': jsonResponse(200, { user: { ...staffUser(), preferences: { units } } }),
    'GET /api/shops/mine': list([{ id: COLLAB_IDS.shop, name: SHOP_NAME, isShopAdmin: admin, customerCount: 0 }]),
    [`GET /api/shops/${COLLAB_IDS.shop}`]: jsonResponse(200, { ...SHOP, isShopAdmin: admin }),
    [`GET /api/shops/${COLLAB_IDS.shop}/customers`]: list([]),
    ...extra,
  });
}

describe('the shop settings', () => {
  it('when an admin sets 8.875 % tax in euros, then exactly that is sent and the page confirms it', async () => {
    const saved = { ...SHOP, settings: { taxRatePct: 8.875, currency: 'eur', compressedLengthToleranceMm: 15, invoiceDetails: '' } };
    const fetchMock = stubShop({ extra: { [PATCH]: jsonResponse(200, saved) } });
    renderApp('/shop');
    const u = userEvent.setup();
    const form = await screen.findByRole('form', { name: 'Shop settings' });
    await u.clear(within(form).getByLabelText('Tax rate'));
    await u.type(within(form).getByLabelText('Tax rate'), '8.875');
    await u.clear(within(form).getByLabelText('Currency'));
    await u.type(within(form).getByLabelText('Currency'), 'eur');
    await u.click(within(form).getByRole('button', { name: 'Save the settings' }));

    await waitFor(() => expect(requestsTo(fetchMock, PATCH)).toHaveLength(1));
    expect(requestsTo(fetchMock, PATCH)[0]!.body as UpdateShopSettingsInput).toEqual({
      taxRatePct: 8.875,
      currency: 'eur',
      compressedLengthToleranceMm: 15,
      invoiceDetails: '',
    });
    expect(await within(form).findByText('Saved.')).toBeTruthy();
  });

  it('when an admin writes the lines for under the shop\'s name, then they are sent with their line breaks; a ninth line is refused beside the box', async () => {
    const fetchMock = stubShop({ extra: { [PATCH]: jsonResponse(200, SHOP) } });
    renderApp('/shop');
    const u = userEvent.setup();
    const form = await screen.findByRole('form', { name: 'Shop settings' });
    const box = within(form).getByLabelText('Under the shop’s name on invoices');
    await u.type(box, Array.from({ length: 9 }, (_, i) => `Line ${i + 1}`).join('{Enter}'));
    await u.click(within(form).getByRole('button', { name: 'Save the settings' }));
    expect(await within(form).findByText('Use at most 8 lines')).toBeTruthy();
    expect(box.getAttribute('aria-invalid')).toBe('true');
    expect(requestsTo(fetchMock, PATCH)).toHaveLength(0);

    await u.clear(box);
    await u.type(box, '12 Kettle Lane, Brindle{Enter}Tel. 555 0143');
    await u.click(within(form).getByRole('button', { name: 'Save the settings' }));
    await waitFor(() => expect(requestsTo(fetchMock, PATCH)).toHaveLength(1));
    expect((requestsTo(fetchMock, PATCH)[0]!.body as UpdateShopSettingsInput).invoiceDetails).toBe('12 Kettle Lane, Brindle\nTel. 555 0143');
  });

  it('when the tolerance is typed in inches, then it is sent in millimetres', async () => {
    const fetchMock = stubShop({ units: IMPERIAL_PREFERENCES, extra: { [PATCH]: jsonResponse(200, SHOP) } });
    renderApp('/shop');
    const u = userEvent.setup();
    const form = await screen.findByRole('form', { name: 'Shop settings' });
    const tolerance = within(form).getByLabelText('Compressed-length tolerance');
    await u.clear(tolerance);
    await u.type(tolerance, '0.5');
    await u.click(within(form).getByRole('button', { name: 'Save the settings' }));

    await waitFor(() => expect(requestsTo(fetchMock, PATCH)).toHaveLength(1));
    // 1 in = 25.4 mm exactly (NIST SP 811, 2008 edition, Appendix B.8, "inch to meter").
    expect((requestsTo(fetchMock, PATCH)[0]!.body as UpdateShopSettingsInput).compressedLengthToleranceMm).toBeCloseTo(12.7, 9);
  });

  it('when the rate is out of range or the currency is not three letters, then each field says so and nothing is sent', async () => {
    const fetchMock = stubShop({ extra: { [PATCH]: jsonResponse(200, SHOP) } });
    renderApp('/shop');
    const u = userEvent.setup();
    const form = await screen.findByRole('form', { name: 'Shop settings' });
    await u.clear(within(form).getByLabelText('Tax rate'));
    await u.type(within(form).getByLabelText('Tax rate'), '75');
    await u.clear(within(form).getByLabelText('Currency'));
    await u.type(within(form).getByLabelText('Currency'), 'E1');
    await u.click(within(form).getByRole('button', { name: 'Save the settings' }));

    expect(await within(form).findByText('The tax rate must be between 0 and 50 %')).toBeTruthy();
    expect(within(form).getByText('Use a three-letter currency code such as USD or EUR')).toBeTruthy();
    expect(within(form).getByLabelText('Tax rate').getAttribute('aria-invalid')).toBe('true');
    expect(requestsTo(fetchMock, PATCH)).toHaveLength(0);
  });

  it('when the server refuses a field, then its message shows beside that field', async () => {
    stubShop({
      extra: { [PATCH]: errorResponse(400, 'validation_failed', 'Some fields need attention.', { taxRatePct: ['Use at most three decimals, e.g. 8.875'] }) },
    });
    renderApp('/shop');
    const u = userEvent.setup();
    const form = await screen.findByRole('form', { name: 'Shop settings' });
    await u.click(within(form).getByRole('button', { name: 'Save the settings' }));
    expect(await within(form).findByText('Use at most three decimals, e.g. 8.875')).toBeTruthy();
  });

  it('when a staff member who is not an admin opens the shop, then the settings read as a sentence with nothing to edit', async () => {
    stubShop({ admin: false });
    renderApp('/shop');
    expect(await screen.findByText(/Invoices are in USD with 0 % tax/)).toBeTruthy();
    expect(screen.queryByRole('form', { name: 'Shop settings' })).toBeNull();
  });
});
