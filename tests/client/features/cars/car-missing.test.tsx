// @vitest-environment jsdom
import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { METRIC_PREFERENCES } from '../../../../shared/calc/units.calc';
import { errorResponse, jsonResponse, renderApp, setUpAppTests, stubFetch } from '../../test-utils';
import { IDS, list, user } from '../../fixtures/season';
import { staffUser } from '../../fixtures/collab';

setUpAppTests([
  () => import('@/app/routes/cars/car'),
  () => import('@/app/routes/cars/tread'),
  () => import('@/app/routes/cars/new-setup'),
  () => import('@/app/routes/shop/customer'),
  () => import('@/app/routes/suggestions/new-suggestion'),
]);

describe('a car the account cannot see', () => {
  it.each([
    [404, 'not_found', 'That car was not found.'],
    [403, 'forbidden', 'You do not have access to that car.'],
  ])('when the server answers %i, then the page says the car was not found and offers none of its actions', async (status, code, message) => {
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user(METRIC_PREFERENCES) }),
      [`GET /api/cars/${IDS.car}`]: errorResponse(status, code, message),
      [`GET /api/cars/${IDS.car}/setups`]: errorResponse(status, code, message),
      [`GET /api/cars/${IDS.car}/tyre-sets`]: errorResponse(status, code, message),
      [`GET /api/cars/${IDS.car}/changes`]: list([]),
    });
    renderApp(`/cars/${IDS.car}`);

    expect(await screen.findByRole('heading', { name: 'Car not found' })).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Back to your cars' }).getAttribute('href')).toBe('/cars');
    expect(screen.queryByRole('link', { name: /New setup/ })).toBeNull();
    expect(screen.queryByText(/could not be loaded/)).toBeNull();
  });
});

describe('the pages under a car the account cannot see', () => {
  it.each([
    ['the tread form', `/cars/${IDS.car}/tread`, 'driver'],
    ['a new setup', `/cars/${IDS.car}/setups/new`, 'driver'],
    ["the shop's page of the car", `/shop/customers/${IDS.car}`, 'staff'],
    ['a new suggestion', `/shop/customers/${IDS.car}/suggestions/new`, 'staff'],
  ] as const)('when %s is opened for a car the server does not show, then one refusal says so, with no form and no talk of signal', async (_, path, who) => {
    const notFound = () => errorResponse(404, 'not_found', 'That car was not found.');
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: who === 'staff' ? staffUser() : user(METRIC_PREFERENCES) }),
      [`GET /api/cars/${IDS.car}`]: notFound,
      [`GET /api/cars/${IDS.car}/setups`]: notFound,
      [`GET /api/cars/${IDS.car}/tyre-sets`]: notFound,
      [`GET /api/cars/${IDS.car}/changes`]: notFound,
      [`GET /api/cars/${IDS.car}/work-orders`]: notFound,
      [`GET /api/cars/${IDS.car}/suggestions`]: notFound,
      [`GET /api/cars/${IDS.car}/season?minDepthMm=1.6`]: notFound,
    });
    renderApp(path);

    expect(await screen.findByRole('heading', { name: 'Car not found' })).toBeTruthy();
    const back = screen.getByRole('link', { name: who === 'staff' ? 'Back to the shop' : 'Back to your cars' });
    expect(back.getAttribute('href')).toBe(who === 'staff' ? '/shop' : '/cars');
    expect(screen.queryByRole('form')).toBeNull();
    expect(screen.queryByRole('button', { name: /Open|Save|Send/ })).toBeNull();
    expect(screen.queryByText(/signal|could not be loaded/)).toBeNull();
  });
});
