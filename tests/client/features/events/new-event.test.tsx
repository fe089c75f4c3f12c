// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { IMPERIAL_PREFERENCES, METRIC_PREFERENCES, type UnitPreferences } from '../../../../shared/calc/units.calc';
import type { OutboxEntry } from '@/lib/outbox';
import { jsonResponse, renderApp, requestsTo, setUpAppTests, storedEntry, stubFetch } from '../../test-utils';
import { BASE_SETUP, CAR, IDS, list, user, UUID } from '../../fixtures/season';

const offline = () => Promise.reject(new TypeError('Failed to fetch'));

setUpAppTests([() => import('@/app/routes/events/events'), () => import('@/app/routes/events/event-day')], { clearLocalStorage: true });

function stub(units: UnitPreferences, extra: Parameters<typeof stubFetch>[0] = {}) {
  return stubFetch({
    'GET /api/auth/session': jsonResponse(200, { user: user(units) }),
    'GET /api/cars': list([CAR]),
    // No signal: every upload waits in the outbox.
    'POST /api/events': offline,
    ...extra,
  });
}

describe('new event', () => {
  it('when an event is created with no signal, then one outbox entry holds it with a device-made UUID and temperatures in °C, and its event day opens showing it as waiting', async () => {
    const fetchMock = stub(IMPERIAL_PREFERENCES);
    const { outbox, router } = renderApp('/events?new=1');
    const u = userEvent.setup();

    await u.type(await screen.findByLabelText('Event name'), 'Marsh Lane practice day');
    expect((screen.getByLabelText('Date') as HTMLInputElement).value).toMatch(/^\d{4}-\d{2}-\d{2}$/);
    expect((screen.getByLabelText(/Cone penalty/) as HTMLInputElement).value).toBe('2');
    expect(screen.getByText('2 s per cone is common practice; use your club’s rule.')).toBeTruthy();
    await u.type(screen.getByLabelText('Venue (optional)'), 'Marsh Lane car park');
    await u.type(screen.getByLabelText('Surface (optional)'), 'patched asphalt');
    await u.type(screen.getByLabelText('Air temperature'), '70');
    await u.type(screen.getByLabelText('Track temperature'), '95');
    await u.click(screen.getByRole('button', { name: 'Save and open event day' }));

    await waitFor(() => expect(outbox.getSnapshot()).toHaveLength(1));
    const [entry] = outbox.getSnapshot() as OutboxEntry[];
    const body = entry!.body as Record<string, unknown>;
    expect(body.id).toMatch(UUID);
    expect(entry).toMatchObject({ kind: 'event.create', method: 'POST', path: '/api/events', recordId: body.id, scope: { eventId: body.id } });
    expect(body).toMatchObject({ name: 'Marsh Lane practice day', venue: 'Marsh Lane car park', kind: 'autocross', conePenaltySec: 2, surface: 'patched asphalt' });
    // °C = (°F − 32) × 5/9
    expect(body.airTempC as number).toBeCloseTo(((70 - 32) * 5) / 9, 6);
    expect(body.trackTempC as number).toBeCloseTo(35, 6);

    // Straight to its event day, built from the entry: the server is not asked about an event it cannot know yet.
    await waitFor(() => expect(router.state.location.pathname).toBe(`/events/${body.id as string}`));
    expect(await screen.findByRole('heading', { level: 1, name: 'Marsh Lane practice day' })).toBeTruthy();
    expect(screen.getByText('Waiting to upload')).toBeTruthy();
    const facts = screen.getByText(/Marsh Lane car park · Autocross · 2 s a cone/);
    // The penalty, its unit and "a cone" never part at a line's end: no-break spaces (common typographic practice).
    expect(facts.textContent).toContain('2\u00a0s\u00a0a\u00a0cone');
    // Nor does a wrapped line start with a separating dot: each is held to the words before it.
    expect(facts.textContent).toContain('car park\u00a0· Autocross\u00a0· 2');
    expect(await screen.findByRole('form', { name: 'Car and driver' })).toBeTruthy();
    expect(fetchMock.mock.calls.some(([url]) => String(url).startsWith(`/api/events/`))).toBe(false);
    expect(requestsTo(fetchMock, 'POST /api/events')[0]?.body).toEqual(body);
  });

  it('when a run is logged at an event still on the phone, then it waits in the outbox behind the event and is not sent before it', async () => {
    const eventId = '0e000000-0000-4000-8000-000000000001';
    const eventEntry = storedEntry({
      recordId: eventId,
      kind: 'event.create',
      method: 'POST',
      path: '/api/events',
      scope: { eventId },
      body: { id: eventId, name: 'Evening test session', date: '2026-06-20', kind: 'autocross', conePenaltySec: 1, venue: null },
    });
    localStorage.setItem(`scrubline.event-day.${eventId}`, JSON.stringify({ carId: IDS.car, driverId: IDS.maren }));
    const fetchMock = stub(METRIC_PREFERENCES, {
      [`GET /api/runs?carId=${IDS.car}&eventId=${eventId}`]: list([]),
      [`GET /api/cars/${IDS.car}/setups`]: list([BASE_SETUP]),
      'POST /api/runs': offline,
    });
    const { outbox } = renderApp(`/events/${eventId}?carId=${IDS.car}`, { outboxEntries: [eventEntry] });
    const u = userEvent.setup();

    expect(await screen.findByRole('heading', { level: 1, name: 'Evening test session' })).toBeTruthy();
    expect(screen.getByText(/1 s a cone/)).toBeTruthy();
    await screen.findByRole('form', { name: 'Log a run' });
    const pad = screen.getByRole('group', { name: 'Time keypad' });
    for (const key of ['4', '4', 'Point', '5']) await u.click(within(pad).getByRole('button', { name: key }));
    await u.click(screen.getByRole('button', { name: 'More: Cones' }));
    await u.click(screen.getByRole('button', { name: 'Save run 1' }));

    await waitFor(() => expect(outbox.getSnapshot()).toHaveLength(2));
    expect(outbox.getSnapshot().map((e) => e.kind)).toEqual(['event.create', 'run.create']);
    expect((outbox.getSnapshot()[1]!.body as { eventId: string }).eventId).toBe(eventId);
    // Scored with the pending event's own penalty: 44.5 + 1 cone × 1 s.
    const row = await screen.findByRole('listitem', { name: /^Run 1,/ });
    expect(within(row).getByText('45.500')).toBeTruthy();
    expect(within(row).getByText('Waiting to upload')).toBeTruthy();
    expect(requestsTo(fetchMock, 'POST /api/runs')).toHaveLength(0);
  });

  it('when the name is missing and a temperature is not a number, then each input says so and nothing is saved', async () => {
    stub(METRIC_PREFERENCES);
    const { outbox } = renderApp('/events?new=1');
    const u = userEvent.setup();

    await u.type(await screen.findByLabelText('Air temperature'), 'warm');
    await u.click(screen.getByRole('button', { name: 'Save and open event day' }));

    expect(await screen.findByText('Give the event a name')).toBeTruthy();
    expect(screen.getByText('Type a number, e.g. 21')).toBeTruthy();
    expect(screen.getByLabelText('Event name').getAttribute('aria-invalid')).toBe('true');
    expect(screen.getByLabelText('Air temperature').getAttribute('aria-invalid')).toBe('true');
    expect(outbox.getSnapshot()).toHaveLength(0);
  });

  it('when the user reads temperatures in °F and types words, then the example is a °F one', async () => {
    stub(IMPERIAL_PREFERENCES);
    renderApp('/events?new=1');
    const u = userEvent.setup();

    await u.type(await screen.findByLabelText('Track temperature'), 'hot');
    await u.click(screen.getByRole('button', { name: 'Save and open event day' }));

    // 21 °C = 69.8 °F (°F = °C × 9/5 + 32, NIST SP 811 appendix B), offered as 70: 21 °F is below freezing.
    expect(await screen.findByText('Type a number, e.g. 70')).toBeTruthy();
    expect(screen.queryByText('Type a number, e.g. 21')).toBeNull();
  });
});

describe('new event: the date left empty', () => {
  it('when the date picker is cleared, then the date field says "Pick a date", alone, and nothing is queued', async () => {
    stub(METRIC_PREFERENCES);
    const { outbox } = renderApp('/events?new=1');
    const u = userEvent.setup();

    await u.type(await screen.findByLabelText('Event name'), 'Marsh Lane practice day');
    await u.clear(screen.getByLabelText('Date'));
    await u.click(screen.getByRole('button', { name: 'Save and open event day' }));

    const date = screen.getByLabelText('Date');
    await waitFor(() => expect(date.getAttribute('aria-invalid')).toBe('true'));
    const described = (date.getAttribute('aria-describedby') ?? '').split(' ').map((id) => document.getElementById(id)?.textContent);
    expect(described).toContain('Pick a date');
    expect(described.join(' ')).not.toMatch(/year|2026-06-12/);
    expect(outbox.getSnapshot()).toHaveLength(0);
  });
});
