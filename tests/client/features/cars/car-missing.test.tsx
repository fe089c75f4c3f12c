// @vitest-environment jsdom
import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { METRIC_PREFERENCES } from '../../../../shared/calc/units.calc';
import { errorResponse, jsonResponse, renderApp, setUpAppTests, stubFetch } from '../../test-utils';
import { IDS, list, user } from '../../fixtures/season';

setUpAppTests([() => import('@/app/routes/cars/car')]);

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
