// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import type { Setup } from '../../../../shared/season/setup.schema';
import { renderApp, requestsTo, setUpAppTests, type StubRoutes } from '../../test-utils';
import { stubCarPage } from '../../fixtures/car-page';
import { BASE_SETUP, IDS, list, user } from '../../fixtures/season';
import { COLLAB_IDS, GRANT, SHOP_NAME, suggestion } from '../../fixtures/collab';

const ACCEPTED: Setup = {
  ...BASE_SETUP,
  id: '52222222-2222-4222-8222-222222222222',
  label: 'Shop camber',
  effectiveFrom: '2026-06-08T09:30:00.000Z',
  derivedFromId: IDS.setupBase,
  suggestion: { id: COLLAB_IDS.suggestion, title: 'More front camber', shopName: SHOP_NAME },
  corners: { ...BASE_SETUP.corners, lf: { ...BASE_SETUP.corners.lf, camberDeg: -1.7 }, rf: { ...BASE_SETUP.corners.rf, camberDeg: -1.7 } },
};

setUpAppTests([() => import('@/app/routes/cars/car'), () => import('@/features/comments/components/comment-thread')]);

/** The car page with the accepted suggestion's snapshot on top of the baseline. */
function stubTimeline(extra: StubRoutes = {}) {
  return stubCarPage(user(), {
    [`GET /api/cars/${IDS.car}/setups`]: list([ACCEPTED, BASE_SETUP]),
    [`GET /api/cars/${IDS.car}/shop-grants`]: list([GRANT]),
    [`GET /api/cars/${IDS.car}/suggestions`]: list([suggestion({ status: 'accepted', acceptedSetupId: ACCEPTED.id })]),
    ...extra,
  });
}

const history = () => screen.getByRole('list', { name: 'Setup history, newest first' });

describe('the setup timeline and suggestions on the car page', () => {
  it('when a snapshot came from an accepted suggestion, then it says which shop and which suggestion, and links to it', async () => {
    stubTimeline();
    renderApp(`/cars/${IDS.car}`);

    const badge = await screen.findByRole('link', { name: `from ${SHOP_NAME}: More front camber` });
    expect(badge.getAttribute('href')).toBe(`/suggestions/${COLLAB_IDS.suggestion}`);
    // Only that snapshot: the baseline was recorded by hand.
    expect(within(history()).getAllByRole('link', { name: /^from / })).toHaveLength(1);
    // The snapshot can be reached by the link the suggestion page gives.
    expect(document.getElementById(`setup-${ACCEPTED.id}`)).not.toBeNull();
  });

  it('lists the shops’ suggestions for the car with their status', async () => {
    stubTimeline();
    renderApp(`/cars/${IDS.car}`);

    const suggestions = await screen.findByRole('list', { name: 'Suggestions' });
    const item = within(suggestions).getByRole('link', { name: /More front camber/ });
    expect(item.getAttribute('href')).toBe(`/suggestions/${COLLAB_IDS.suggestion}`);
    expect(item.textContent).toContain('Accepted');
    expect(item.textContent).toContain(SHOP_NAME);
  });

  it('when a snapshot’s comments are opened, then its thread is fetched then, not before', async () => {
    const url = `GET /api/comments?type=setup&id=${ACCEPTED.id}`;
    const fetchMock = stubTimeline({ [url]: list([]) });
    renderApp(`/cars/${IDS.car}`);
    const u = userEvent.setup();

    await screen.findByRole('link', { name: `from ${SHOP_NAME}: More front camber` });
    expect(requestsTo(fetchMock, url)).toHaveLength(0);
    const [first] = within(history()).getAllByRole('button', { name: /^Comments/ });
    expect(first!.getAttribute('aria-expanded')).toBe('false');
    await u.click(first!);

    expect(first!.getAttribute('aria-expanded')).toBe('true');
    await waitFor(() => expect(requestsTo(fetchMock, url).length).toBeGreaterThan(0));
    expect(await within(history()).findByLabelText('Add a comment')).toBeTruthy();
  });
});
