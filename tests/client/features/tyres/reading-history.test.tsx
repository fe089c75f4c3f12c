// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import type { TreadReading } from '../../../../shared/season/tyre.schema';
import { IMPERIAL_PREFERENCES, METRIC_PREFERENCES, type UnitPreferences } from '../../../../shared/calc/units.calc';
import { formatDateTime } from '@/lib/dates';
import { errorResponse, jsonResponse, renderApp, requestsTo, setUpAppTests, stubFetch } from '../../test-utils';
import { CAR, IDS, list, TYRE_SET, user } from '../../fixtures/season';

setUpAppTests([() => import('@/app/routes/cars/tread'), () => import('@/features/attachments/components/attachment-strip')]);

const LATEST = TYRE_SET.latestReading!;
const READINGS_URL = `GET /api/tyre-sets/${IDS.tyreSet}/readings`;
const HISTORY_BUTTON = 'Earlier readings of Set B (2026)';

function reading(id: string, takenAt: string, lfInnerMm: number, rrOuterMm: number): TreadReading {
  return {
    id,
    tyreSetId: IDS.tyreSet,
    takenAt,
    eventId: null,
    corners: {
      lf: { innerMm: lfInnerMm, middleMm: 7.1, outerMm: 7.2, tyreNumber: 1 },
      rr: { innerMm: 7.0, middleMm: 7.0, outerMm: rrOuterMm, tyreNumber: 4 },
    },
    notes: null,
    createdAt: takenAt,
  };
}

/** Three readings of the set, as the server sends them: oldest first, the latest (shown above the history) last. */
const FIRST = reading('e1111111-1111-4111-8111-111111111111', '2026-04-12T15:00:00.000Z', 6.9, 6.8);
const SECOND = reading('e2222222-2222-4222-8222-222222222222', '2026-05-03T15:00:00.000Z', 6.5, 6.1);

function stub(units: UnitPreferences, readings = list([FIRST, SECOND, LATEST])) {
  return stubFetch({
    'GET /api/auth/session': jsonResponse(200, { user: user(units) }),
    [`GET /api/cars/${IDS.car}`]: jsonResponse(200, CAR),
    [`GET /api/cars/${IDS.car}/tyre-sets`]: list([TYRE_SET]),
    [`GET /api/attachments?targetType=tread_reading&targetId=${LATEST.id}`]: list([]),
    [`GET /api/attachments?targetType=tread_reading&targetId=${SECOND.id}`]: list([]),
    [READINGS_URL]: readings,
  });
}

const cornerText = (item: HTMLElement, corner: RegExp) => within(item).getByRole('group', { name: corner }).textContent;

describe('reading history', () => {
  it('when the tread page opens, then the earlier readings are folded and not asked for; the button opens them, newest first, without the latest', async () => {
    const fetchMock = stub(METRIC_PREFERENCES);
    renderApp(`/cars/${IDS.car}/tread`);
    const u = userEvent.setup();

    const button = await screen.findByRole('button', { name: HISTORY_BUTTON });
    expect(button.getAttribute('aria-expanded')).toBe('false');
    expect(screen.queryByRole('list', { name: 'Earlier readings of Set B (2026)' })).toBeNull();
    expect(requestsTo(fetchMock, READINGS_URL)).toHaveLength(0);

    await u.click(button);
    expect(button.getAttribute('aria-expanded')).toBe('true');
    const history = await screen.findByRole('list', { name: 'Earlier readings of Set B (2026)' });
    const items = within(history).getAllByRole('listitem').filter((li) => li.parentElement === history);
    expect(items).toHaveLength(2);
    // Newest first: 3 May, then 12 April; the 24 May reading is the one shown above.
    expect(items[0]!.textContent).toContain(formatDateTime(SECOND.takenAt));
    expect(cornerText(items[0]!, /Left front/)).toContain('inner 6.5 mm');
    expect(cornerText(items[0]!, /Right rear/)).toContain('outer 6.1 mm');
    expect(items[1]!.textContent).toContain(formatDateTime(FIRST.takenAt));
    expect(cornerText(items[1]!, /Left front/)).toContain('inner 6.9 mm');
    expect(cornerText(items[1]!, /Right rear/)).toContain('outer 6.8 mm');
    // A corner not measured says so rather than showing a blank.
    expect(cornerText(items[1]!, /Right front/)).toContain('Not measured');
    expect(history.textContent).not.toContain(formatDateTime(LATEST.takenAt));

    await u.click(button);
    expect(button.getAttribute('aria-expanded')).toBe('false');
    expect(document.getElementById(button.getAttribute('aria-controls')!)!.hidden).toBe(true);
  });

  it('when the server counts the runs made on the set up to each reading, then the latest and each earlier reading say after how many', async () => {
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user(METRIC_PREFERENCES) }),
      [`GET /api/cars/${IDS.car}`]: jsonResponse(200, CAR),
      [`GET /api/cars/${IDS.car}/tyre-sets`]: list([{ ...TYRE_SET, latestReading: { ...LATEST, runsOnSet: 20 } }]),
      [`GET /api/attachments?targetType=tread_reading&targetId=${LATEST.id}`]: list([]),
      [READINGS_URL]: list([{ ...FIRST, runsOnSet: 1 }, { ...SECOND, runsOnSet: 12 }, { ...LATEST, runsOnSet: 20 }]),
    });
    renderApp(`/cars/${IDS.car}/tread`);
    const u = userEvent.setup();

    const latest = within(await screen.findByRole('list', { name: 'Latest reading of each set' }));
    expect(latest.getByText(`· ${formatDateTime(LATEST.takenAt)}, after 20 runs on this set`)).toBeTruthy();
    await u.click(await screen.findByRole('button', { name: HISTORY_BUTTON }));
    const history = await screen.findByRole('list', { name: 'Earlier readings of Set B (2026)' });
    const items = within(history).getAllByRole('listitem').filter((li) => li.parentElement === history);
    expect(items.map((li) => li.querySelector('p')!.textContent)).toEqual([
      `${formatDateTime(SECOND.takenAt)}, after 12 runs on this set`,
      `${formatDateTime(FIRST.takenAt)}, after 1 run on this set`,
    ]);
  });

  it('when the driver reads tread in 1/32 in, then the earlier depths are shown in 1/32 in', async () => {
    stub(IMPERIAL_PREFERENCES);
    renderApp(`/cars/${IDS.car}/tread`);
    const u = userEvent.setup();

    await u.click(await screen.findByRole('button', { name: HISTORY_BUTTON }));
    const history = await screen.findByRole('list', { name: 'Earlier readings of Set B (2026)' });
    const [newest, oldest] = within(history).getAllByRole('listitem').filter((li) => li.parentElement === history);
    // 1 in = 25.4 mm exactly (NIST SP 811): 6.5 mm × 32 / 25.4 = 8.19/32 in; 6.1 mm → 7.69; 6.9 mm → 8.69.
    expect(cornerText(newest!, /Left front/)).toContain('inner 8.2/32 in');
    expect(cornerText(newest!, /Right rear/)).toContain('outer 7.7/32 in');
    expect(cornerText(oldest!, /Left front/)).toContain('inner 8.7/32 in');
    expect(cornerText(oldest!, /Left front/)).not.toContain('mm');
  });

  it('when an earlier reading’s photos are opened, then that reading’s files are asked for', async () => {
    const fetchMock = stub(METRIC_PREFERENCES);
    renderApp(`/cars/${IDS.car}/tread`);
    const u = userEvent.setup();
    const url = `GET /api/attachments?targetType=tread_reading&targetId=${SECOND.id}`;

    await u.click(await screen.findByRole('button', { name: HISTORY_BUTTON }));
    const history = await screen.findByRole('list', { name: 'Earlier readings of Set B (2026)' });
    const photos = within(history).getByRole('button', { name: `Photos and files on the Set B (2026) reading of ${formatDateTime(SECOND.takenAt)}` });
    expect(photos.getAttribute('aria-expanded')).toBe('false');
    expect(requestsTo(fetchMock, url)).toHaveLength(0);

    await u.click(photos);
    await waitFor(() => expect(requestsTo(fetchMock, url).length).toBeGreaterThan(0));
  });

  it('when the readings cannot be fetched, then the opened history says so instead of looking empty', async () => {
    stub(METRIC_PREFERENCES, errorResponse(500, 'internal', 'Something went wrong.'));
    renderApp(`/cars/${IDS.car}/tread`);
    const u = userEvent.setup();

    await u.click(await screen.findByRole('button', { name: HISTORY_BUTTON }));
    expect(await screen.findByText('Earlier readings could not be loaded. Try again when you have signal.')).toBeTruthy();
  });

  it('when the set has only its latest reading, then the opened history says there is nothing earlier', async () => {
    stub(METRIC_PREFERENCES, list([LATEST]));
    renderApp(`/cars/${IDS.car}/tread`);
    const u = userEvent.setup();

    await u.click(await screen.findByRole('button', { name: HISTORY_BUTTON }));
    expect(await screen.findByText('No earlier readings: the one above is the first of this set.')).toBeTruthy();
    expect(screen.queryByRole('list', { name: 'Earlier readings of Set B (2026)' })).toBeNull();
  });
});
