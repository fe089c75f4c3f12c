// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { WaitingSuggestion } from '../../../../shared/collab/suggestion.schema';
import { jsonResponse, renderApp, requestsTo, setUpAppTests, stubFetch } from '../../test-utils';
import { CAR, IDS, list, user } from '../../fixtures/season';
import { COLLAB_IDS, SHOP_NAME, suggestion } from '../../fixtures/collab';
import { stubCarPage } from '../../fixtures/car-page';

// Home loads the list of waiting suggestions on use; loaded here first so the tests do not wait on the import.
setUpAppTests(
  [() => import('@/app/routes/home'), () => import('@/features/suggestions/components/waiting-suggestions'), () => import('@/app/routes/cars/car')],
  { clearLocalStorage: true },
);

const WAITING = 'GET /api/suggestions/waiting';
const waiting: WaitingSuggestion = {
  id: COLLAB_IDS.suggestion,
  title: 'More front camber',
  car: { id: IDS.car, name: CAR.name },
  shop: { id: COLLAB_IDS.shop, name: SHOP_NAME },
  createdAt: '2026-06-08T09:00:00.000Z',
};

function stub(cars: unknown[], items: WaitingSuggestion[]) {
  return stubFetch({
    'GET /api/auth/session': jsonResponse(200, { user: user() }),
    'GET /api/cars': list(cars),
    'GET /api/events': list([]),
    [WAITING]: jsonResponse(200, { items, count: items.length }),
  });
}

describe('Home: suggestions waiting for the driver', () => {
  it('when a shop has an open suggestion for the driver\'s car, then Home shows one line for it, linked to it, after the event and before the rest', async () => {
    stub([CAR], [waiting]);
    renderApp('/');

    const card = await screen.findByRole('region', { name: 'Waiting for you: 1 setup suggestion' });
    const link = within(card).getByRole('link', { name: /More front camber/ });
    expect(link.getAttribute('href')).toBe(`/suggestions/${COLLAB_IDS.suggestion}`);
    expect(link.textContent).toContain(`${CAR.name} · from ${SHOP_NAME} · accept or decline`);
    // At the track logging comes first: after the event card, before sync and the cars.
    const eventDay = screen.getByRole('region', { name: 'Event day' });
    expect(card.compareDocumentPosition(eventDay) & Node.DOCUMENT_POSITION_PRECEDING).toBeTruthy();
    for (const later of ['Sync', 'Your cars']) {
      expect(card.compareDocumentPosition(screen.getByRole('region', { name: later })) & Node.DOCUMENT_POSITION_FOLLOWING, later).toBeTruthy();
    }
  });

  it('when nothing waits, then Home shows no such card', async () => {
    const fetchMock = stub([CAR], []);
    renderApp('/');

    await screen.findByRole('region', { name: 'Your cars' });
    await waitFor(() => expect(requestsTo(fetchMock, WAITING).length).toBeGreaterThan(0));
    expect(screen.queryByRole('region', { name: /Waiting for you/ })).toBeNull();
  });

  it('when the user has no car, then Home never asks for waiting suggestions', async () => {
    const fetchMock = stub([], [waiting]);
    renderApp('/');

    await screen.findByText(/No cars yet/);
    await new Promise((r) => setTimeout(r, 50));
    expect(requestsTo(fetchMock, WAITING)).toHaveLength(0);
    expect(screen.queryByRole('region', { name: /Waiting for you/ })).toBeNull();
  });
});

describe('the car page: suggestions waiting for the driver', () => {
  it('when the car has an open suggestion, then it shows right under the car\'s header, before the setup history, tyres, drivers and shop access', async () => {
    stubCarPage(user(), {
      [`GET /api/cars/${IDS.car}/suggestions`]: list([
        suggestion({ id: '9e000000-0000-4000-8000-000000000002', title: 'Softer rear', status: 'declined' }),
        suggestion(),
      ]),
    });
    renderApp(`/cars/${IDS.car}`);

    const card = await screen.findByRole('region', { name: 'Waiting for you: 1 setup suggestion' });
    expect(within(card).getByRole('link', { name: /More front camber/ }).getAttribute('href')).toBe(`/suggestions/${COLLAB_IDS.suggestion}`);
    expect(within(card).queryByText('Softer rear')).toBeNull();
    for (const later of ['Setup history', 'Tyres', 'Drivers', 'Shop access']) {
      const section = screen.getByRole('region', { name: later });
      expect(card.compareDocumentPosition(section) & Node.DOCUMENT_POSITION_FOLLOWING, later).toBeTruthy();
    }
  });

  it('when no suggestion is open, then nothing is added at the top', async () => {
    stubCarPage(user(), { [`GET /api/cars/${IDS.car}/suggestions`]: list([suggestion({ status: 'declined' })]) });
    renderApp(`/cars/${IDS.car}`);

    await screen.findByRole('region', { name: 'Suggestions from shops' });
    await screen.findByText('Declined');
    expect(screen.queryByRole('region', { name: /Waiting for you/ })).toBeNull();
  });
});
