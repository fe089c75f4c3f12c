// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import type { Setup } from '../../../../shared/season/setup.schema';
import { formatDay } from '@/lib/dates';
import { jsonResponse, renderApp, setUpAppTests, storedEntry, stubFetch } from '../../test-utils';
import { stubCarPage } from '../../fixtures/car-page';
import { BASE_SETUP, CAR, IDS, list, user } from '../../fixtures/season';
import { staffUser, suggestion } from '../../fixtures/collab';

setUpAppTests([
  () => import('@/app/routes/cars/car'),
  () => import('@/app/routes/shop/customer'),
  () => import('@/features/comments/components/comment-thread'),
]);

// jsdom draws nothing, so it has no scrollIntoView of its own to spy on.
Element.prototype.scrollIntoView ??= () => {};

/** A season of `count` snapshots, one a fortnight from the baseline on; newest first, as the server lists them. */
function season(count: number): Setup[] {
  return Array.from({ length: count }, (_, i) => {
    const at = new Date(Date.parse(BASE_SETUP.effectiveFrom) + i * 14 * 86_400_000).toISOString();
    return i === 0
      ? BASE_SETUP
      : { ...BASE_SETUP, id: `5${String(i).padStart(7, '0')}-2222-4222-8222-222222222222`, label: `Change ${i}`, effectiveFrom: at, createdAt: at, updatedAt: at };
  }).reverse();
}

const history = () => screen.findByRole('list', { name: 'Setup history, newest first' });
const labels = (ol: HTMLElement) => within(ol).getAllByRole('heading', { level: 3 }).map((h) => h.textContent);

describe('the setup history folds all but the newest snapshots away', () => {
  it('when a car has six snapshots, then the newest three show and one button brings out the rest, moving the reader to the first of them', async () => {
    const setups = season(6);
    stubCarPage(user(), { [`GET /api/cars/${IDS.car}/setups`]: list(setups) });
    renderApp(`/cars/${IDS.car}`);
    const u = userEvent.setup();

    const shown = await history();
    expect(labels(shown)).toEqual(['Change 5', 'Change 4', 'Change 3']);
    // Each shown snapshot still reads its changes against the one before it, folded or not.
    expect(within(shown).getAllByText(/^Changes from/).map((p) => p.textContent)).toEqual([
      'Changes from “Change 4”:',
      'Changes from “Change 3”:',
      'Changes from “Change 2”:',
    ]);
    const more = screen.getByRole('button', { name: 'Show 3 older setups' });
    expect(more.getAttribute('aria-describedby')).toBeTruthy();
    expect(document.getElementById(more.getAttribute('aria-describedby')!)!.textContent).toBe(`back to ${formatDay(BASE_SETUP.effectiveFrom)}`);

    await u.click(more);
    expect(labels(shown)).toEqual(['Change 5', 'Change 4', 'Change 3', 'Change 2', 'Change 1', 'Spring baseline']);
    expect(screen.queryByRole('button', { name: /^Show .* older/ })).toBeNull();
    expect(document.activeElement).toBe(document.getElementById(`setup-${setups[3]!.id}`));
  });

  it('when a car has three snapshots or fewer, then all show and there is nothing to unfold', async () => {
    stubCarPage(user(), { [`GET /api/cars/${IDS.car}/setups`]: list(season(3)) });
    renderApp(`/cars/${IDS.car}`);

    expect(labels(await history())).toEqual(['Change 2', 'Change 1', 'Spring baseline']);
    expect(screen.queryByRole('button', { name: /^Show .* older/ })).toBeNull();
  });

  it('when a link names an old snapshot (#setup-…), then the history is drawn down to it and scrolled there', async () => {
    const scrolled = vi.spyOn(Element.prototype, 'scrollIntoView').mockImplementation(() => {});
    const setups = season(6);
    stubCarPage(user(), { [`GET /api/cars/${IDS.car}/setups`]: list(setups) });
    renderApp(`/cars/${IDS.car}#setup-${setups[4]!.id}`);

    const shown = await history();
    expect(labels(shown)).toEqual(['Change 5', 'Change 4', 'Change 3', 'Change 2', 'Change 1']);
    expect(screen.getByRole('button', { name: 'Show 1 older setup' })).toBeTruthy();
    await waitFor(() => expect(scrolled.mock.contexts).toContain(document.getElementById(`setup-${setups[4]!.id}`)));
    scrolled.mockRestore();
  });

  it('when a driver opens a setup thread’s notification (?comments=…), then that old snapshot shows with its thread open', async () => {
    const setups = season(6);
    stubCarPage(user(), {
      [`GET /api/cars/${IDS.car}/setups`]: list(setups),
      [`GET /api/comments?type=setup&id=${IDS.setupBase}`]: list([]),
    });
    renderApp(`/cars/${IDS.car}?comments=${IDS.setupBase}`);

    const shown = await history();
    expect(labels(shown)).toHaveLength(6);
    const thread = within(shown).getByRole('button', { name: 'Comments on “Spring baseline”' });
    expect(thread.getAttribute('aria-expanded')).toBe('true');
    // Only that snapshot's.
    expect(within(shown).getByRole('button', { name: 'Comments on “Change 5”' }).getAttribute('aria-expanded')).toBe('false');
  });

  it('when the shop opens a customer’s old setup thread, then that snapshot shows with its thread open', async () => {
    const setups = season(5);
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: staffUser() }),
      [`GET /api/cars/${IDS.car}`]: jsonResponse(200, CAR),
      [`GET /api/cars/${IDS.car}/suggestions`]: list([]),
      [`GET /api/cars/${IDS.car}/setups`]: list(setups),
      [`GET /api/cars/${IDS.car}/season?minDepthMm=1.6`]: jsonResponse(200, { carId: IDS.car, events: [], setupChanges: [], changeLog: [], tyreLife: [] }),
      [`GET /api/comments?type=setup&id=${IDS.setupBase}`]: list([]),
    });
    renderApp(`/shop/customers/${IDS.car}?comments=${IDS.setupBase}`);

    const shown = await history();
    expect(labels(shown)).toHaveLength(5);
    expect(within(shown).getByRole('button', { name: 'Comments on “Spring baseline”' }).getAttribute('aria-expanded')).toBe('true');
  });

  it('when a snapshot the server refused is still on the phone, then it shows however old it is, with its way out', async () => {
    const setups = season(5);
    const refused = storedEntry({
      key: 'refused',
      recordId: 'b0000009-0000-4000-8000-000000000000',
      kind: 'setup.create',
      method: 'POST',
      path: `/api/cars/${IDS.car}/setups`,
      body: { id: 'b0000009-0000-4000-8000-000000000000', label: 'Back-dated baseline', effectiveFrom: '2026-03-01T08:00:00.000Z', corners: {} },
      label: 'Setup · Back-dated baseline',
      scope: { carId: IDS.car },
      state: 'failed',
      attempts: 1,
      error: { status: 400, code: 'validation_failed', message: 'Some fields need attention.', fieldErrors: {} },
    });
    stubCarPage(user(), { [`GET /api/cars/${IDS.car}/setups`]: list(setups) });
    renderApp(`/cars/${IDS.car}`, { outboxEntries: [refused] });

    const shown = await history();
    await waitFor(() => expect(labels(shown)).toHaveLength(6));
    expect(labels(shown).at(-1)).toBe('Back-dated baseline');
    expect(within(shown).getByRole('link', { name: 'Fix it' })).toBeTruthy();
    expect(screen.queryByRole('button', { name: /^Show .* older/ })).toBeNull();
    // No field named: the server's summary says why.
    expect(within(shown).getByRole('alert').textContent).toContain('Refused: Some fields need attention.');
  });

  it('when the server named the field it refused, then the line says that once, not the summary as well', async () => {
    const refused = storedEntry({
      key: 'refused',
      recordId: 'b0000009-0000-4000-8000-000000000000',
      kind: 'setup.create',
      method: 'POST',
      path: `/api/cars/${IDS.car}/setups`,
      body: { id: 'b0000009-0000-4000-8000-000000000000', label: 'Too much camber', effectiveFrom: '2026-03-01T08:00:00.000Z', corners: {} },
      label: 'Setup · Too much camber',
      scope: { carId: IDS.car },
      state: 'failed',
      attempts: 1,
      error: { status: 400, code: 'validation_failed', message: 'Some fields need attention.', fieldErrors: { 'corners.lf.camberDeg': ['Camber must be between −10° and 5°'] } },
    });
    stubCarPage(user(), { [`GET /api/cars/${IDS.car}/setups`]: list(season(2)) });
    renderApp(`/cars/${IDS.car}`, { outboxEntries: [refused] });

    const alert = await within(await history()).findByRole('alert');
    expect(alert.textContent).toContain('Refused: Camber must be between −10° and 5°');
    expect(alert.textContent).not.toContain('Some fields need attention');
  });
});

describe('a change of clicks in the setup history', () => {
  it('when the car counts clicks from full soft and the rear goes up two, then the line says stiffer; down one at the front, softer', async () => {
    // The fixture's car counts both axles from full soft: more clicks are stiffer (common practice).
    const before = { ...BASE_SETUP };
    const after: Setup = {
      ...BASE_SETUP,
      id: '59999999-2222-4222-8222-222222222222',
      label: 'Firmer rear',
      effectiveFrom: '2026-05-01T08:00:00.000Z',
      corners: {
        lf: { ...BASE_SETUP.corners.lf, damperClicks: 7 },
        rf: { ...BASE_SETUP.corners.rf, damperClicks: 7 },
        lr: { ...BASE_SETUP.corners.lr, damperClicks: 12 },
        rr: { ...BASE_SETUP.corners.rr, damperClicks: 12 },
      },
    };
    stubCarPage(user(), { [`GET /api/cars/${IDS.car}/setups`]: list([after, before]) });
    renderApp(`/cars/${IDS.car}`);

    await history();
    const lines = await waitFor(() => {
      const found = within(document.getElementById(`setup-${after.id}`)!).getAllByRole('listitem').map((li) => li.textContent ?? '');
      expect(found.join(' ')).toMatch(/stiffer|softer/);
      return found;
    });
    expect(lines.find((l) => l.startsWith('Rear clicks'))).toMatch(/▲ 2 clicks\s*stiffer/);
    expect(lines.find((l) => l.startsWith('Front clicks'))).toMatch(/▼ 1 click\s*softer/);
  });
});

describe('links into the setup history from the same page', () => {
  it('when a shop visit’s "Setup it wrote" names a folded snapshot, then a tap unfolds the history down to it', async () => {
    const setups = season(6);
    stubCarPage(user(), {
      [`GET /api/cars/${IDS.car}/setups`]: list(setups),
      [`GET /api/cars/${IDS.car}/work-orders`]: list([
        {
          id: 'c1111111-1111-4111-8111-111111111111',
          shop: { id: 'c2222222-2222-4222-8222-222222222222', name: 'Kettle Lane Chassis Works' },
          visitDate: '2026-04-01',
          requestedWork: 'Corner weights',
          status: 'closed',
          handoverAt: '2026-04-01T16:30:00.000Z',
          setupId: IDS.setupBase,
        },
      ]),
    });
    renderApp(`/cars/${IDS.car}`);
    const u = userEvent.setup();

    const shown = await history();
    expect(labels(shown)).not.toContain('Spring baseline');
    await u.click(await screen.findByRole('link', { name: 'Setup it wrote' }));
    await waitFor(() => expect(labels(shown)).toContain('Spring baseline'));
  });
});

describe('suggestions as the driver reads them', () => {
  it('when a shop’s suggestion waits for an answer, then the car page says it waits for the driver reading it', async () => {
    stubCarPage(user(), {
      [`GET /api/cars/${IDS.car}/suggestions`]: list([suggestion({ status: 'open' })]),
    });
    renderApp(`/cars/${IDS.car}`);
    // Listed at the top of the page, where it waits for an answer, and in the full list further down.
    const items = await screen.findAllByRole('link', { name: /More front camber/ });
    expect(items).toHaveLength(2);
    for (const item of items) {
      expect(item.textContent).toContain('Waiting for you: accept or decline');
      expect(item.textContent).not.toContain('Waiting for the driver');
    }
  });
});
