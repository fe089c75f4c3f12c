// @vitest-environment jsdom
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeAll, beforeEach, describe, expect, it, vi } from 'vitest';
import type { Setup } from '../../../../shared/season/setup.schema';
import { dropCsrfToken } from '@/lib/api-client';
import { clearToasts } from '@/lib/toast-store';
import { clearTestOutboxes, jsonResponse, renderApp, requestsTo, stubFetch } from '../../test-utils';
import { BASE_SETUP, CAR, IDS, list, user } from '../../fixtures/season';
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

beforeAll(async () => {
  await import('@/app/routes/cars/car');
  await import('@/features/comments/components/comment-thread');
}, 30_000);
beforeEach(() => dropCsrfToken());
afterEach(async () => {
  await clearTestOutboxes();
  cleanup();
  clearToasts();
  vi.unstubAllGlobals();
});

function stubCarPage(extra: Parameters<typeof stubFetch>[0] = {}) {
  return stubFetch({
    'GET /api/auth/me': jsonResponse(200, { user: user() }),
    [`GET /api/cars/${IDS.car}`]: jsonResponse(200, CAR),
    [`GET /api/cars/${IDS.car}/setups`]: list([ACCEPTED, BASE_SETUP]),
    [`GET /api/cars/${IDS.car}/tyre-sets`]: list([]),
    [`GET /api/cars/${IDS.car}/changes`]: list([]),
    [`GET /api/cars/${IDS.car}/shop-grants`]: list([GRANT]),
    [`GET /api/cars/${IDS.car}/suggestions`]: list([suggestion({ status: 'accepted', acceptedSetupId: ACCEPTED.id })]),
    ...extra,
  });
}

const history = () => screen.getByRole('list', { name: 'Setup history, newest first' });

describe('the setup timeline and suggestions on the car page', () => {
  it('when a snapshot came from an accepted suggestion, then it says which shop and which suggestion, and links to it', async () => {
    stubCarPage();
    renderApp(`/cars/${IDS.car}`);

    const badge = await screen.findByRole('link', { name: `from ${SHOP_NAME}: More front camber` });
    expect(badge.getAttribute('href')).toBe(`/suggestions/${COLLAB_IDS.suggestion}`);
    // Only that snapshot: the baseline was recorded by hand.
    expect(within(history()).getAllByRole('link', { name: /^from / })).toHaveLength(1);
    // The snapshot can be reached by the link the suggestion page gives.
    expect(document.getElementById(`setup-${ACCEPTED.id}`)).not.toBeNull();
  });

  it('lists the shops’ suggestions for the car with their status', async () => {
    stubCarPage();
    renderApp(`/cars/${IDS.car}`);

    const suggestions = await screen.findByRole('list', { name: 'Suggestions' });
    const item = within(suggestions).getByRole('link', { name: /More front camber/ });
    expect(item.getAttribute('href')).toBe(`/suggestions/${COLLAB_IDS.suggestion}`);
    expect(item.textContent).toContain('Accepted');
    expect(item.textContent).toContain(SHOP_NAME);
  });

  it('when a snapshot’s comments are opened, then its thread is fetched then, not before', async () => {
    const url = `GET /api/comments?type=setup&id=${ACCEPTED.id}`;
    const fetchMock = stubCarPage({ [url]: list([]) });
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
