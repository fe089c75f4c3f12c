// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { endOfDay, parseISO } from 'date-fns';
import { beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { CLOSED_ACCOUNT_NAME } from '../../../../shared/auth/person-name';
import { IMPERIAL_PREFERENCES, KPA_PER_PSI, METRIC_PREFERENCES, type UnitPreferences } from '../../../../shared/calc/units.calc';
import type { Run } from '../../../../shared/season/run.schema';
import type { Setup } from '../../../../shared/season/setup.schema';
import { formatDay, todayIsoDate } from '@/lib/dates';
import type { OutboxEntry } from '@/lib/outbox';
import { blockingEntry, errorResponse, jsonResponse, NOBODY_SIGNED_IN, renderApp, requestsTo, setUpAppTests, SIGNED_OUT, storedEntry, stubFetch } from '../../test-utils';
import { BASE_SETUP, CAR, EVENT, IDS, list, runOnPhone, RUNS_URL, savedRun, user, UUID } from '../../fixtures/season';

const PATH = `/events/${IDS.event}?carId=${IDS.car}`;
const offline = () => Promise.reject(new TypeError('Failed to fetch'));

beforeAll(() => {
  // jsdom has no pointer capture; Radix toasts ask for it when a toast's button is pressed.
  Element.prototype.hasPointerCapture ??= () => false;
  Element.prototype.releasePointerCapture ??= () => undefined;
});
setUpAppTests([() => import('@/app/routes/events/event-day'), () => import('@/features/setups/components/quick-change-panel')], {
  clearLocalStorage: true,
});
// Car and driver were chosen at this event before: straight to logging.
beforeEach(() => localStorage.setItem(`scrubline.event-day.${IDS.event}`, JSON.stringify({ carId: IDS.car, driverId: IDS.maren })));

// The runs URL is a GET; stubFetch keys are "METHOD path".
const RUNS = `GET ${RUNS_URL}`;
const UUID_TOMAS_RUN = 'b3333333-3333-4333-8333-333333333333';
const UUID_FOURTH_RUN = 'b4444444-4444-4444-8444-444444444444';

interface StubOptions {
  units?: UnitPreferences;
  setups?: Setup[];
  extra?: Parameters<typeof stubFetch>[0];
}

/** The event, the car, its setups and its runs at the event, as the server would answer; uploads of runs find no signal. */
function stubWithRuns(runs: Run[] | Response[], opts: StubOptions = {}) {
  return stubFetch({
    'GET /api/auth/session': jsonResponse(200, { user: user(opts.units ?? METRIC_PREFERENCES) }),
    [`GET /api/events/${IDS.event}`]: jsonResponse(200, EVENT),
    'GET /api/cars': list([CAR]),
    [RUNS]: runs.length && runs[0] instanceof Response ? (runs as Response[]) : list(runs as Run[]),
    [`GET /api/cars/${IDS.car}/setups`]: list(opts.setups ?? [BASE_SETUP]),
    'POST /api/runs': offline,
    ...opts.extra,
  });
}

async function keypad(userE: ReturnType<typeof userEvent.setup>, time: string) {
  const names: Record<string, string> = { ':': 'Colon', '.': 'Point' };
  const pad = screen.getByRole('group', { name: 'Time keypad' });
  for (const k of time) await userE.click(within(pad).getByRole('button', { name: names[k] ?? k }));
}

// A quick change is made on the event's day; the fixture's event is long past.
const TODAY_EVENT = () => ({ [`GET /api/events/${IDS.event}`]: jsonResponse(200, { ...EVENT, date: todayIsoDate() }) });

const runItem = (n: number) => screen.getByRole('listitem', { name: new RegExp(`^Run ${n},`) });

interface Drawing {
  /** The header names the event. */
  named: boolean;
  /** The keypad's form is on screen. */
  form: boolean;
  /** The run list is on screen. */
  list: boolean;
}

/**
 * Renders the page and records what the document shows after each drawing (each batch of changes the
 * MutationObserver reports, one per commit), until run 2 is on screen.
 */
async function drawingOrder(): Promise<Drawing[]> {
  const drawings: Drawing[] = [];
  const observer = new MutationObserver(() =>
    drawings.push({
      named: document.querySelector('h1')?.textContent === EVENT.name,
      form: document.querySelector('form[aria-label="Log a run"]') !== null,
      list: document.querySelector('ol[aria-label$="newest first"]') !== null,
    }),
  );
  observer.observe(document.body, { childList: true, subtree: true, characterData: true });
  renderApp(PATH);
  await screen.findByRole('listitem', { name: /^Run 2,/ });
  observer.disconnect();
  return drawings;
}

/** The first drawing that shows it. */
const firstShowing = (drawings: Drawing[], what: keyof Drawing) => drawings.findIndex((d) => d[what]);

describe('event day', () => {
  it('when the page opens, then the car\'s setups and runs are asked for at once, without waiting for the event and the car to arrive', async () => {
    const never = () => new Promise<Response>(() => undefined);
    const fetchMock = stubWithRuns([savedRun({ id: IDS.run1, runNumber: 1 })], {
      extra: { [`GET /api/events/${IDS.event}`]: never, 'GET /api/cars': never },
    });
    renderApp(PATH);
    await waitFor(() => expect(requestsTo(fetchMock, RUNS)).toHaveLength(1));
    expect(requestsTo(fetchMock, `GET /api/cars/${IDS.car}/setups`)).toHaveLength(1);
    // Still waiting on the event: the runs arrived first and are kept for when it does.
    expect(screen.queryByRole('listitem', { name: /^Run 1,/ })).toBeNull();
  });

  it('when the device is still reading what it keeps, then who is signed in and the car list are asked for already, and the event\'s reads wait for it', async () => {
    const fetchMock = stubWithRuns([savedRun({ id: IDS.run1, runNumber: 1 })]);
    let deviceDone: () => void = () => undefined;
    renderApp(PATH, { deviceRead: new Promise<void>((resolve) => (deviceDone = resolve)) });
    await waitFor(() => expect(requestsTo(fetchMock, 'GET /api/cars')).toHaveLength(1));
    expect(requestsTo(fetchMock, 'GET /api/auth/session')).toHaveLength(1);
    // Whether this event is still only on the phone is not known yet: nothing about it is asked.
    expect(requestsTo(fetchMock, `GET /api/events/${IDS.event}`)).toHaveLength(0);
    expect(requestsTo(fetchMock, RUNS)).toHaveLength(0);
    deviceDone();
    await waitFor(() => expect(requestsTo(fetchMock, RUNS)).toHaveLength(1));
    expect(requestsTo(fetchMock, `GET /api/events/${IDS.event}`)).toHaveLength(1);
    expect(await screen.findByRole('listitem', { name: /^Run 1,/ })).toBeTruthy();
    // Each was asked once: the sign-in check found the answer already on its way.
    expect(requestsTo(fetchMock, 'GET /api/auth/session')).toHaveLength(1);
  });

  it('when the page first draws on the event\'s day with its runs known, then the event\'s name goes on screen first, the keypad in a later drawing, and the run list after it', async () => {
    stubWithRuns([savedRun({ id: IDS.run1, runNumber: 1 }), savedRun({ id: IDS.run2, runNumber: 2 })], { extra: TODAY_EVENT() });
    // One drawing bringing two of them would mean the later one held the earlier back.
    const drawings = await drawingOrder();
    const named = firstShowing(drawings, 'named');
    expect(named).toBeGreaterThanOrEqual(0);
    expect(firstShowing(drawings, 'form')).toBeGreaterThan(named);
    expect(firstShowing(drawings, 'list')).toBeGreaterThan(firstShowing(drawings, 'form'));
  });

  it('when the event is opened on its day, then the keypad comes before the runs, with no heading of its own', async () => {
    stubWithRuns([savedRun({ id: IDS.run1, runNumber: 1 })], { extra: TODAY_EVENT() });
    renderApp(PATH);
    const list = await screen.findByRole('list', { name: 'Today’s runs, newest first' });
    const form = screen.getByRole('form', { name: 'Log a run' });

    expect(form.compareDocumentPosition(list) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
    expect(screen.queryByRole('heading', { name: 'Add a run from that day' })).toBeNull();
  });

  it('when the event is opened, then its header links to all events, for another event or a new one', async () => {
    stubWithRuns([], { extra: TODAY_EVENT() });
    renderApp(PATH);
    await screen.findByRole('form', { name: 'Log a run' });
    const header = screen.getByRole('heading', { level: 1 }).closest('header')!;
    const link = within(header).getByRole('link', { name: 'All events' });
    expect(link.getAttribute('href')).toBe('/events');
  });

  it('when a past event is opened, then its name goes on screen first, and its runs and the keypad under a heading of its own follow, both in one drawing', async () => {
    stubWithRuns([savedRun({ id: IDS.run1, runNumber: 1 }), savedRun({ id: IDS.run2, runNumber: 2 })]);
    // Drawn later than the keypad, a list above it would push the keypad down under the thumb.
    const drawings = await drawingOrder();

    const list = screen.getByRole('list', { name: `Runs on ${formatDay(EVENT.date)}, newest first` });
    const form = screen.getByRole('form', { name: 'Log a run' });
    expect(list.compareDocumentPosition(form) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
    const heading = screen.getByRole('heading', { name: 'Add a run from that day' });
    expect(heading.compareDocumentPosition(form) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
    expect(list.compareDocumentPosition(heading) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
    const named = firstShowing(drawings, 'named');
    expect(named).toBeGreaterThanOrEqual(0);
    expect(firstShowing(drawings, 'list')).toBeGreaterThan(named);
    expect(firstShowing(drawings, 'list')).toBe(firstShowing(drawings, 'form'));
  });

  it('when the car\'s setups are still on their way, then the keypad waits for them, so it does not move when the setup line fills in, and "none recorded" is never shown', async () => {
    let answer: (r: Response) => void = () => undefined;
    stubWithRuns([], { extra: { [`GET /api/cars/${IDS.car}/setups`]: () => new Promise<Response>((resolve) => (answer = resolve)) } });
    renderApp(PATH);
    // The event and the car are known: the header is drawn.
    await screen.findByRole('button', { name: 'Change car or driver' });
    expect(screen.queryByRole('form', { name: 'Log a run' })).toBeNull();
    expect(screen.queryByText('none recorded')).toBeNull();
    answer(list([BASE_SETUP]));
    const setup = await screen.findByRole('region', { name: 'Setup' });
    expect(within(setup).getByText('Spring baseline')).toBeTruthy();
    expect(screen.getByRole('form', { name: 'Log a run' })).toBeTruthy();
  });

  it('when the car\'s setups cannot be had (no signal), then the keypad is there and the setup line says the setup is not known, not that there is none', async () => {
    stubWithRuns([], { extra: { [`GET /api/cars/${IDS.car}/setups`]: offline } });
    renderApp(PATH);
    const setup = await screen.findByRole('region', { name: 'Setup' });
    expect(within(setup).getByText('not known yet')).toBeTruthy();
    expect(within(setup).queryByText('none recorded')).toBeNull();
    expect(screen.getByRole('form', { name: 'Log a run' })).toBeTruthy();
  });

  it('when the event is still on its way, then the car line waits with it, so it is not pushed down when the event\'s facts arrive', async () => {
    let answer: (r: Response) => void = () => undefined;
    const fetchMock = stubWithRuns([], { extra: { [`GET /api/events/${IDS.event}`]: () => new Promise<Response>((resolve) => (answer = resolve)) } });
    renderApp(PATH);
    await waitFor(() => expect(requestsTo(fetchMock, `GET /api/events/${IDS.event}`)).toHaveLength(1));
    await waitFor(() => expect(requestsTo(fetchMock, 'GET /api/cars')).toHaveLength(1));
    await screen.findByText('Loading the event…');
    expect(screen.queryByRole('button', { name: 'Change car or driver' })).toBeNull();
    answer(jsonResponse(200, EVENT));
    expect(await screen.findByRole('button', { name: 'Change car or driver' })).toBeTruthy();
  });

  it('when a run is logged with the keypad, then exactly one outbox entry holds it in SI with a device-made id, and it shows at once as waiting with its adjusted time', async () => {
    const fetchMock = stubWithRuns([], { units: IMPERIAL_PREFERENCES });
    const { outbox } = renderApp(PATH);
    const u = userEvent.setup();
    await screen.findByRole('form', { name: 'Log a run' });

    await keypad(u, '45.678');
    await u.click(screen.getByRole('button', { name: 'More: Cones' }));
    await u.click(screen.getByRole('button', { name: /Hot pressures and note/ }));
    await u.type(screen.getByLabelText('Left front hot pressure'), '32');
    await u.click(screen.getByRole('button', { name: 'Save run 1' }));

    // Stored on the phone; the upload failed for want of signal and waits.
    await waitFor(() => expect(outbox.getSnapshot()).toHaveLength(1));
    const [entry] = outbox.getSnapshot() as OutboxEntry[];
    expect(entry).toMatchObject({ kind: 'run.create', method: 'POST', path: '/api/runs', scope: { carId: IDS.car, eventId: IDS.event } });
    // The cone in words, here and in the sync list.
    expect(entry!.label).toBe('Run 1 · 45.678 +1 cone');
    expect(screen.getByText('Run 1 · 45.678 +1 cone saved on this phone.')).toBeTruthy();
    const body = entry!.body as Record<string, unknown>;
    expect(body.id).toMatch(UUID);
    expect(entry!.recordId).toBe(body.id);
    expect(body).toMatchObject({ carId: IDS.car, eventId: IDS.event, driverId: IDS.maren, runNumber: 1, rawTimeSec: 45.678, cones: 1, status: 'finished' });
    expect((body.hotPressuresKpa as { lf: number }).lf).toBeCloseTo(32 * KPA_PER_PSI, 6);
    expect(Number.isNaN(Date.parse(body.recordedAt as string))).toBe(false);
    expect(requestsTo(fetchMock, 'POST /api/runs')[0]?.body).toEqual(body);

    const row = runItem(1);
    expect(within(row).getByText('Waiting to upload')).toBeTruthy();
    expect(within(row).getByText('45.678')).toBeTruthy();
    expect(within(row).getByText('47.678')).toBeTruthy(); // + 1 cone × 2 s
    expect(within(row).getByText('Setup: Spring baseline')).toBeTruthy();
    // The form is ready for the next one.
    expect(screen.getByRole('button', { name: 'Save run 2' })).toBeTruthy();
  });

  it('when DNF is pressed on the keypad, then it stays pressed, the note says a time is optional, Off course takes its place, a second press undoes it, and the run saved is a DNF', async () => {
    stubWithRuns([]);
    const { outbox } = renderApp(PATH);
    const u = userEvent.setup();
    await screen.findByRole('form', { name: 'Log a run' });
    const pad = within(screen.getByRole('group', { name: 'Time keypad' }));
    const dnf = pad.getByRole('button', { name: 'DNF' });
    const off = pad.getByRole('button', { name: 'Off course' });
    expect([dnf.getAttribute('aria-pressed'), off.getAttribute('aria-pressed')]).toEqual(['false', 'false']);

    await u.click(off);
    expect(screen.getByText('Off course: a time is optional.')).toBeTruthy();
    await u.click(dnf);
    expect([dnf.getAttribute('aria-pressed'), off.getAttribute('aria-pressed')]).toEqual(['true', 'false']);
    await u.click(dnf);
    expect(dnf.getAttribute('aria-pressed')).toBe('false');
    expect(screen.queryByText(/a time is optional/)).toBeNull();

    await u.click(dnf);
    await u.click(screen.getByRole('button', { name: 'Save run 1' }));
    await waitFor(() => expect(outbox.getSnapshot()).toHaveLength(1));
    expect((outbox.getSnapshot()[0] as OutboxEntry).body).toMatchObject({ runNumber: 1, rawTimeSec: null, status: 'dnf' });
    // Ready for the next run, which starts as finished.
    expect(screen.getByText('Run 1 · DNF saved on this phone.')).toBeTruthy();
    expect(dnf.getAttribute('aria-pressed')).toBe('false');
  });

  it('when a run uploads before the list has refreshed, then it stays in view as saved, never blinking out', async () => {
    let posted: Record<string, unknown> | null = null;
    let releaseRefresh: () => void = () => undefined;
    stubWithRuns([], {
      extra: {
        // The refreshed list arrives only when the test says so (a slow signal).
        [RUNS]: () =>
          posted
            ? new Promise<Response>((resolve) => {
                releaseRefresh = () =>
                  resolve(list([savedRun({ ...(posted as object), id: posted!.id as string, runNumber: 1, rawTimeSec: 45.5, adjustedTimeSec: 45.5 })]));
              })
            : list([]),
        'POST /api/runs': ({ body }) => {
          posted = body as Record<string, unknown>;
          return jsonResponse(201, {});
        },
      },
    });
    const { outbox } = renderApp(PATH);
    const u = userEvent.setup();
    await screen.findByRole('form', { name: 'Log a run' });

    await keypad(u, '45.5');
    await u.click(screen.getByRole('button', { name: 'Save run 1' }));
    await waitFor(() => expect(posted).not.toBeNull());
    await waitFor(() => expect(outbox.getSnapshot()).toHaveLength(0));

    const row = runItem(1);
    expect(within(row).queryByText('Waiting to upload')).toBeNull();
    expect(within(row).getAllByText('45.500')).toHaveLength(2); // raw and adjusted

    releaseRefresh();
    await waitFor(() => expect(runItem(1)).toBeTruthy());
    expect(screen.getAllByRole('listitem', { name: /^Run 1,/ })).toHaveLength(1);
  });

  it('when the time cannot be read, then nothing is saved and what was typed stays with the parser’s message', async () => {
    stubWithRuns([]);
    const { outbox } = renderApp(PATH);
    const u = userEvent.setup();
    await screen.findByRole('form', { name: 'Log a run' });

    await keypad(u, '1:5.4');
    await u.click(screen.getByRole('button', { name: 'Save run 1' }));

    expect(await screen.findByText('After the minutes, give the seconds as two digits, e.g. 1:05.432')).toBeTruthy();
    expect((screen.getByLabelText(/Raw time/) as HTMLInputElement).value).toBe('1:5.4');
    expect(outbox.getSnapshot()).toHaveLength(0);
  });

  it.each([
    ['-3', 'Run numbers start at 1'],
    ['−3', 'Run numbers start at 1'],
    ['2.5', 'Run numbers are whole numbers from 1 to 999'],
    // Number() would read these as 100 and 16.
    ['1e2', 'Run numbers are whole numbers from 1 to 999'],
    ['0x10', 'Run numbers are whole numbers from 1 to 999'],
  ])('when the run number is typed as %s, then it stays as typed and is refused at its field, above the keypad, as the run editor refuses it, and nothing is saved', async (typed, message) => {
    stubWithRuns([]);
    const { outbox } = renderApp(PATH);
    const u = userEvent.setup();
    await screen.findByRole('form', { name: 'Log a run' });

    await keypad(u, '45.2');
    await u.type(screen.getByLabelText('Run number'), typed);
    expect((screen.getByLabelText('Run number') as HTMLInputElement).value).toBe(typed);
    // The button names no run number it cannot read.
    await u.click(screen.getByRole('button', { name: 'Save run' }));

    const note = await screen.findByText(message);
    const field = screen.getByLabelText('Run number');
    expect(field.getAttribute('aria-invalid')).toBe('true');
    // The message is the field's own, read with it, and drawn over the row it is typed in, not under the keypad.
    expect(document.getElementById(field.getAttribute('aria-describedby')!)).toBe(note);
    expect(note.compareDocumentPosition(screen.getByRole('group', { name: 'Time keypad' })) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
    expect(outbox.getSnapshot()).toHaveLength(0);
  });

  it('when a run number is typed as 07, then the Save button names run 7 and run 7 is stored', async () => {
    stubWithRuns([]);
    const { outbox } = renderApp(PATH);
    const u = userEvent.setup();
    await screen.findByRole('form', { name: 'Log a run' });

    await keypad(u, '45.2');
    await u.type(screen.getByLabelText('Run number'), '07');
    await u.click(screen.getByRole('button', { name: 'Save run 7' }));

    await waitFor(() => expect(outbox.getSnapshot()).toHaveLength(1));
    expect((outbox.getSnapshot()[0]!.body as { runNumber: number }).runNumber).toBe(7);
  });

  it('when a faster run is still waiting to upload, then it is scored with the saved ones and marked best instead', async () => {
    const waitingRun = runOnPhone({ cones: 1 });
    stubWithRuns([savedRun({ id: IDS.run1, runNumber: 1, rawTimeSec: 46.5, adjustedTimeSec: 46.5, isBest: true, pctOffBest: 0 })]);
    renderApp(PATH, { outboxEntries: [waitingRun] });

    await screen.findByRole('listitem', { name: 'Run 1, Maren Holt' });
    const second = screen.getByRole('listitem', { name: 'Run 2, Maren Holt, best' });
    expect(within(second).getByText('Maren’s best')).toBeTruthy();
    expect(within(second).getByText('46.100')).toBeTruthy(); // 44.1 + 2 s
    expect(within(second).getByText('Waiting to upload')).toBeTruthy();
    const first = screen.getByRole('listitem', { name: 'Run 1, Maren Holt' });
    expect(within(first).queryByText('Maren’s best')).toBeNull();
    // (46.5 − 46.1) / 46.1 = 0.87 %
    expect(within(first).getByText('+0.87 % off Maren’s best')).toBeTruthy();
    expect(screen.getByText(/Maren Holt’s best:/).textContent).toContain('46.100');
  });

  it('when two drivers share the car, then each one’s best says whose it is, and a slower run says whose best it is off', async () => {
    const tomas = { id: IDS.tomas, displayName: 'Tomas Reyes' };
    stubWithRuns([
      savedRun({ id: IDS.run1, runNumber: 1, rawTimeSec: 46.5, adjustedTimeSec: 46.5 }),
      savedRun({ id: IDS.run2, runNumber: 2, rawTimeSec: 47, adjustedTimeSec: 47, isBest: false, recordedAt: '2026-06-07T10:00:00.000Z' }),
      savedRun({ id: UUID_TOMAS_RUN, runNumber: 1, driver: tomas, rawTimeSec: 45.9, adjustedTimeSec: 45.9, recordedAt: '2026-06-07T09:45:00.000Z' }),
    ]);
    renderApp(PATH);

    // Scored per driver (co-drivers are classed apart): Maren's 46.500 and Tomas's 45.900 are each a best.
    const marenBest = await screen.findByRole('listitem', { name: 'Run 1, Maren Holt, best' });
    const tomasBest = screen.getByRole('listitem', { name: 'Run 1, Tomas Reyes, best' });
    expect(within(marenBest).getByText('Maren’s best')).toBeTruthy();
    expect(within(tomasBest).getByText('Tomas’s best')).toBeTruthy();
    expect(screen.queryByText('Best')).toBeNull();
    // (47.0 − 46.5) / 46.5 = 1.08 %, off Maren's own best, not the car's (45.9, which would be 2.40 %).
    expect(within(screen.getByRole('listitem', { name: 'Run 2, Maren Holt' })).getByText('+1.08 % off Maren’s best')).toBeTruthy();
  });

  it('when a run is clean, coned, a DNF or a DNF after a cone, then only the finished clean one says “Clean”', async () => {
    stubWithRuns([
      savedRun({ id: IDS.run1, runNumber: 1, rawTimeSec: 46.5, adjustedTimeSec: 46.5 }),
      savedRun({ id: IDS.run2, runNumber: 2, rawTimeSec: 46.1, cones: 1, adjustedTimeSec: 48.1, isBest: false, recordedAt: '2026-06-07T10:00:00.000Z' }),
      savedRun({ id: UUID_TOMAS_RUN, runNumber: 3, rawTimeSec: null, status: 'dnf', adjustedTimeSec: null, isBest: false, pctOffBest: null, recordedAt: '2026-06-07T10:10:00.000Z' }),
      savedRun({ id: UUID_FOURTH_RUN, runNumber: 4, rawTimeSec: null, status: 'dnf', cones: 2, adjustedTimeSec: null, isBest: false, pctOffBest: null, recordedAt: '2026-06-07T10:20:00.000Z' }),
    ]);
    renderApp(PATH);

    const run = async (n: number) => within(await screen.findByRole('listitem', { name: new RegExp(`^Run ${n}, Maren Holt`) }));
    expect((await run(1)).getByText('Clean')).toBeTruthy();
    expect((await run(2)).getByText('+1 cone')).toBeTruthy();
    expect((await run(3)).queryByText('Clean')).toBeNull();
    expect((await run(3)).getByText('DNF')).toBeTruthy();
    expect((await run(4)).getByText('+2 cones')).toBeTruthy();
  });

  it('when a co-driver has closed their account, then their runs say “Closed account’s best”, not a first name that is not one', async () => {
    const closed = { id: IDS.tomas, displayName: CLOSED_ACCOUNT_NAME };
    stubWithRuns([
      savedRun({ id: IDS.run1, runNumber: 1, rawTimeSec: 46.5, adjustedTimeSec: 46.5 }),
      savedRun({ id: UUID_TOMAS_RUN, runNumber: 1, driver: closed, rawTimeSec: 45.9, adjustedTimeSec: 45.9, recordedAt: '2026-06-07T09:45:00.000Z' }),
      savedRun({ id: IDS.run2, runNumber: 2, driver: closed, rawTimeSec: 47, adjustedTimeSec: 47, isBest: false, recordedAt: '2026-06-07T10:00:00.000Z' }),
    ]);
    renderApp(PATH);

    const best = await screen.findByRole('listitem', { name: 'Run 1, Closed account, best' });
    expect(within(best).getByText('Closed account’s best')).toBeTruthy();
    // (47.0 − 45.9) / 45.9 = 2.40 %.
    expect(within(screen.getByRole('listitem', { name: 'Run 2, Closed account' })).getByText('+2.40 % off Closed account’s best')).toBeTruthy();
    expect(screen.queryByText(/Closed’s best/)).toBeNull();
  });

  it('when the event was on an earlier day, then its runs are headed with its date, not as today’s', async () => {
    stubWithRuns([savedRun({ id: IDS.run1, runNumber: 1 })], { extra: { [`GET /api/events/${IDS.event}`]: jsonResponse(200, { ...EVENT, date: '2025-05-03' }) } });
    renderApp(PATH);

    const heading = await screen.findByRole('heading', { level: 2, name: /runs/i });
    expect(heading.textContent).toBe(`Runs on ${formatDay('2025-05-03')}`);
    expect(heading.textContent).toMatch(/2025/);
    expect(screen.queryByText(/today/i)).toBeNull();
    expect(await screen.findByRole('list', { name: `Runs on ${formatDay('2025-05-03')}, newest first` })).toBeTruthy();
  });

  it('when the event\'s day is over, then the setup line shows the setup the car ended that day with, a run logged now is tied to it at the day\'s last moment with no time of day shown, and there is no quick change', async () => {
    // Three snapshots: the spring baseline, one made during the event (local 14:00 on its day) and one a month later.
    const onTheDay: Setup = { ...BASE_SETUP, id: '5e7e7e7e-0000-4000-8000-000000000002', label: 'Softer rear at the event', effectiveFrom: new Date(2026, 5, 7, 14, 0).toISOString() };
    const later: Setup = { ...BASE_SETUP, id: '5e7e7e7e-0000-4000-8000-000000000003', label: 'New springs in July', effectiveFrom: new Date(2026, 6, 7, 10, 0).toISOString() };
    stubWithRuns([], { setups: [later, onTheDay, BASE_SETUP] });
    const { outbox } = renderApp(PATH, { outboxEntries: [blockingEntry()] });
    const u = userEvent.setup();
    await screen.findByRole('form', { name: 'Log a run' });

    const setup = screen.getByRole('region', { name: 'Setup' });
    expect(within(setup).getByText('Setup that day:')).toBeTruthy();
    expect(within(setup).getByText('Softer rear at the event')).toBeTruthy();
    expect(within(setup).queryByText('New springs in July')).toBeNull();
    expect(within(setup).queryByRole('button', { name: 'Quick change' })).toBeNull();
    // A change made that day goes in the setup editor, with its own time, starting from that day's setup.
    expect(within(setup).getByRole('link', { name: 'Add a change' }).getAttribute('href')).toBe(`/cars/${IDS.car}/setups/new?from=${onTheDay.id}`);

    await keypad(u, '45.2');
    await u.click(screen.getByRole('button', { name: 'Save run 1' }));
    await waitFor(() => expect(outbox.getSnapshot()).toHaveLength(2));
    const body = outbox.getSnapshot()[1]!.body as { recordedAt: string };
    // The last millisecond of 7 June 2026 on this device, as date-fns' endOfDay gives it (an independent library).
    expect(body.recordedAt).toBe(endOfDay(parseISO(EVENT.date)).toISOString());
    const row = await screen.findByRole('listitem', { name: /^Run 1,/ });
    expect(within(row).getByText('Setup: Softer rear at the event')).toBeTruthy();
    expect(within(row).queryByText(/\d{1,2}:\d{2}/)).toBeNull();
  });

  it('when the event is today, then the setup line shows the setup on the car now, with a quick change, and a run logged is timed now', async () => {
    const later: Setup = { ...BASE_SETUP, id: '5e7e7e7e-0000-4000-8000-000000000003', label: 'Changed an hour ago', effectiveFrom: new Date(Date.now() - 3_600_000).toISOString() };
    stubWithRuns([], { setups: [later, BASE_SETUP], extra: TODAY_EVENT() });
    const { outbox } = renderApp(PATH, { outboxEntries: [blockingEntry()] });
    const u = userEvent.setup();
    await screen.findByRole('form', { name: 'Log a run' });

    const setup = screen.getByRole('region', { name: 'Setup' });
    expect(within(setup).getByText('Setup now:')).toBeTruthy();
    expect(within(setup).getByText('Changed an hour ago')).toBeTruthy();
    expect(within(setup).getByRole('button', { name: 'Quick change' })).toBeTruthy();
    expect(within(setup).queryByRole('link', { name: 'Add a change' })).toBeNull();

    const before = Date.now();
    await keypad(u, '45.2');
    await u.click(screen.getByRole('button', { name: 'Save run 1' }));
    await waitFor(() => expect(outbox.getSnapshot()).toHaveLength(2));
    const at = Date.parse((outbox.getSnapshot()[1]!.body as { recordedAt: string }).recordedAt);
    expect(at).toBeGreaterThanOrEqual(before);
    expect(at).toBeLessThanOrEqual(Date.now());
  });

  it('when the event is today, then its runs are headed as today’s', async () => {
    stubWithRuns([], { extra: { [`GET /api/events/${IDS.event}`]: jsonResponse(200, { ...EVENT, date: todayIsoDate() }) } });
    renderApp(PATH);

    expect((await screen.findByRole('heading', { level: 2, name: /runs/i })).textContent).toBe('Today’s runs');
    // On the day, the conditions stay off the header, which would push the keypad under the Save bar.
    expect(screen.queryByText(/old concrete/)).toBeNull();
  });

  it('when a past event is read back, then its header gives the conditions it was run in, in the reader\'s units', async () => {
    stubWithRuns([savedRun({ id: IDS.run1, runNumber: 1 })], { units: IMPERIAL_PREFERENCES });
    renderApp(PATH);

    const header = (await screen.findByRole('heading', { level: 1, name: EVENT.name })).closest('header')!;
    // 22 °C = 71.6 °F and 36 °C = 96.8 °F (°F = °C × 9/5 + 32, NIST SP 811).
    expect(within(header).getByText(/old concrete/).textContent).toMatch(/^old concrete\u00a0· air 72\s°F\u00a0· track 97\s°F$/);
  });

  it('when a saved run is deleted and the deletion has not left the phone, then Undo cancels it and nothing is sent', async () => {
    const fetchMock = stubWithRuns([savedRun({ id: IDS.run1, runNumber: 1 })]);
    const { outbox } = renderApp(PATH, { outboxEntries: [blockingEntry()] });
    const u = userEvent.setup();
    await screen.findByRole('listitem', { name: /^Run 1,/ });

    await u.click(screen.getByRole('button', { name: 'Edit run 1' }));
    // The edit form loads on first use.
    await u.click(await screen.findByRole('button', { name: 'Delete run' }));

    await waitFor(() => expect(screen.queryByRole('listitem', { name: /^Run 1,/ })).toBeNull());
    expect(outbox.getSnapshot().map((e) => e.kind)).toEqual(['change.create', 'run.delete']);

    await u.click(await screen.findByRole('button', { name: 'Undo' }));

    await screen.findByRole('listitem', { name: /^Run 1,/ });
    expect(outbox.getSnapshot().map((e) => e.kind)).toEqual(['change.create']);
    expect(fetchMock.mock.calls.some(([, init]) => init?.method === 'DELETE' || init?.method === 'POST')).toBe(false);
  });

  it('when a run still waiting on the phone is deleted, then both cancel out, and Undo puts the same run back in the outbox', async () => {
    stubWithRuns([]);
    const { outbox } = renderApp(PATH, { outboxEntries: [blockingEntry()] });
    const u = userEvent.setup();
    await screen.findByRole('form', { name: 'Log a run' });
    await keypad(u, '44.9');
    await u.click(screen.getByRole('button', { name: 'Save run 1' }));
    await waitFor(() => expect(outbox.getSnapshot()).toHaveLength(2));
    const logged = outbox.getSnapshot()[1]!.body;

    await u.click(screen.getByRole('button', { name: 'Edit run 1' }));
    // The edit form loads on first use.
    await u.click(await screen.findByRole('button', { name: 'Delete run' }));
    // Nothing left to send for that run: the upload and the deletion cancelled each other.
    await waitFor(() => expect(outbox.getSnapshot().map((e) => e.kind)).toEqual(['change.create']));
    expect(screen.queryByRole('listitem', { name: /^Run 1,/ })).toBeNull();

    await u.click(await screen.findByRole('button', { name: 'Undo' }));

    await waitFor(() => expect(outbox.getSnapshot().map((e) => e.kind)).toEqual(['change.create', 'run.create']));
    expect(outbox.getSnapshot()[1]!.body).toEqual(logged);
    expect(within(await screen.findByRole('listitem', { name: /^Run 1,/ })).getByText('Waiting to upload')).toBeTruthy();
  });

  it('when a deletion already reached the server, then Undo posts the same run again with the same id', async () => {
    const run = savedRun({ id: IDS.run1, runNumber: 1, rawTimeSec: 45.9, adjustedTimeSec: 47.9, cones: 1, notes: 'Late on the brakes' });
    // The server, as far as this run goes: there, deleted, or posted again.
    let onServer = true;
    const fetchMock = stubWithRuns([], {
      extra: {
        [RUNS]: () => list(onServer ? [run] : []),
        [`DELETE /api/runs/${IDS.run1}`]: () => {
          onServer = false;
          return jsonResponse(204);
        },
        'POST /api/runs': () => {
          onServer = true;
          return jsonResponse(201, run);
        },
      },
    });
    const { outbox } = renderApp(PATH);
    const u = userEvent.setup();
    await screen.findByRole('listitem', { name: /^Run 1,/ });

    await u.click(screen.getByRole('button', { name: 'Edit run 1' }));
    // The edit form loads on first use.
    await u.click(await screen.findByRole('button', { name: 'Delete run' }));
    await waitFor(() => expect(requestsTo(fetchMock, `DELETE /api/runs/${IDS.run1}`)).toHaveLength(1));
    await waitFor(() => expect(outbox.getSnapshot()).toHaveLength(0));

    await u.click(await screen.findByRole('button', { name: 'Undo' }));

    await waitFor(() => expect(requestsTo(fetchMock, 'POST /api/runs')).toHaveLength(1));
    expect(requestsTo(fetchMock, 'POST /api/runs')[0]?.body).toEqual({
      id: IDS.run1, carId: IDS.car, eventId: IDS.event, runNumber: 1, rawTimeSec: 45.9, cones: 1, status: 'finished',
      recordedAt: run.recordedAt, driverId: IDS.maren, notes: 'Late on the brakes',
    });
    await screen.findByRole('listitem', { name: /^Run 1,/ });
  });

  it('when a saved run’s hot pressures are changed in psi and one is cleared, then the edit sends them in kPa with its other fields as they were', async () => {
    const run = savedRun({ id: IDS.run1, runNumber: 1, rawTimeSec: 45.9, adjustedTimeSec: 47.9, cones: 1, notes: 'Late on the brakes', hotPressuresKpa: { lf: 250, rf: 252, lr: 240, rr: 241 } });
    // The server, as far as this run goes.
    let onServer: Run = run;
    const fetchMock = stubWithRuns([], {
      units: IMPERIAL_PREFERENCES,
      extra: {
        [RUNS]: () => list([onServer]),
        [`PATCH /api/runs/${IDS.run1}`]: (r) => {
          onServer = { ...run, ...(r.body as Partial<Run>), version: 2 };
          return jsonResponse(200, onServer);
        },
      },
    });
    renderApp(PATH);
    const u = userEvent.setup();
    await screen.findByRole('listitem', { name: /^Run 1,/ });

    await u.click(screen.getByRole('button', { name: 'Edit run 1' }));
    const lf = await screen.findByLabelText('Left front hot pressure');
    await u.clear(lf);
    await u.type(lf, '37.0');
    await u.clear(screen.getByLabelText('Right rear hot pressure'));
    await u.click(screen.getByRole('button', { name: 'Save changes' }));

    await waitFor(() => expect(requestsTo(fetchMock, `PATCH /api/runs/${IDS.run1}`)).toHaveLength(1));
    const body = requestsTo(fetchMock, `PATCH /api/runs/${IDS.run1}`)[0]!.body as Record<string, unknown> & { hotPressuresKpa: Record<string, number> };
    expect(body).toMatchObject({ version: 1, runNumber: 1, rawTimeSec: 45.9, cones: 1, status: 'finished', notes: 'Late on the brakes' });
    // 37.0 psi × 6.894 757 293 168 kPa/psi = 255.106 kPa (NIST SP 811, worked by hand); the untouched corners exactly as saved.
    expect(Object.keys(body.hotPressuresKpa).sort()).toEqual(['lf', 'lr', 'rf']);
    expect(body.hotPressuresKpa.lf).toBeCloseTo(255.106, 3);
    expect(body.hotPressuresKpa).toMatchObject({ rf: 252, lr: 240 });
    // 255.106 kPa = 37.0 psi in the run's hot pressures.
    const item = await screen.findByRole('listitem', { name: /^Run 1,/ });
    await waitFor(() => expect(within(item).queryByRole('form')).toBeNull());
    const shown = within(within(item).getByRole('group', { name: 'Hot pressures' }));
    expect(within(shown.getByRole('group', { name: 'Left front' })).getByText('37.0 psi')).toBeTruthy();
    expect(within(shown.getByRole('group', { name: 'Right rear' })).getByText('—')).toBeTruthy();
  });

  it('when the car\'s dampers are fixed, then a quick change starts on cold pressures all round and offers no clicks', async () => {
    const fixed = { ...CAR, damperAdjusters: { front: null, rear: null } };
    const noClicks = { ...BASE_SETUP, corners: Object.fromEntries(Object.entries(BASE_SETUP.corners).map(([c, v]) => [c, { ...v, damperClicks: null, damperReboundClicks: null }])) };
    stubWithRuns([], { setups: [noClicks as typeof BASE_SETUP], extra: { ...TODAY_EVENT(), 'GET /api/cars': list([fixed]) } });
    renderApp(PATH);
    const u = userEvent.setup();
    await screen.findByRole('form', { name: 'Log a run' });
    await u.click(screen.getByRole('button', { name: 'Quick change' }));
    const form = await screen.findByRole('form', { name: 'Quick change' });

    const what = within(form).getByLabelText('What') as HTMLSelectElement;
    expect(what.value).toBe('coldPressureKpa');
    expect([...what.options].map((o) => o.value)).not.toContain('damperClicks');
    expect([...what.options].map((o) => o.value)).not.toContain('damperReboundClicks');
    expect(within(form).getByRole('button', { name: 'All four' }).getAttribute('aria-pressed')).toBe('true');
  });

  it('when the setup in force records no rebound clicks, then a quick change offers clicks but not rebound clicks; once it records them, both', async () => {
    const offered = async () => {
      const u = userEvent.setup();
      await screen.findByRole('form', { name: 'Log a run' });
      await u.click(screen.getByRole('button', { name: 'Quick change' }));
      const form = await screen.findByRole('form', { name: 'Quick change' });
      return [...(within(form).getByLabelText('What') as HTMLSelectElement).options].map((o) => o.value);
    };
    stubWithRuns([], { extra: TODAY_EVENT() });
    const first = renderApp(PATH);
    const single = await offered();
    expect(single).toContain('damperClicks');
    expect(single).not.toContain('damperReboundClicks');
    first.unmount();

    const withRebound = { ...BASE_SETUP, corners: Object.fromEntries(Object.entries(BASE_SETUP.corners).map(([c, v]) => [c, { ...v, damperReboundClicks: 6 }])) };
    stubWithRuns([], { setups: [withRebound as typeof BASE_SETUP], extra: TODAY_EVENT() });
    renderApp(PATH);
    expect(await offered()).toEqual(expect.arrayContaining(['damperClicks', 'damperReboundClicks']));
  });

  it.each([
    ['front', 'Front', { front: CAR.damperAdjusters.front, rear: null }],
    ['rear', 'Rear', { front: null, rear: CAR.damperAdjusters.rear }],
  ])('when only the %s dampers adjust, then a quick change starts on those clicks', async (_axle, preset, damperAdjusters) => {
    const oneAxle = { ...CAR, damperAdjusters };
    stubWithRuns([], { extra: { ...TODAY_EVENT(), 'GET /api/cars': list([oneAxle]) } });
    renderApp(PATH);
    const u = userEvent.setup();
    await screen.findByRole('form', { name: 'Log a run' });
    await u.click(screen.getByRole('button', { name: 'Quick change' }));
    const form = await screen.findByRole('form', { name: 'Quick change' });

    expect((within(form).getByLabelText('What') as HTMLSelectElement).value).toBe('damperClicks');
    expect(within(form).getByRole('button', { name: preset }).getAttribute('aria-pressed')).toBe('true');
    expect(within(form).getByRole('button', { name: 'All four' }).getAttribute('aria-pressed')).toBe('false');
  });

  it('when a quick change moves clicks, then it says stiffer or softer from the end the car\'s adjusters count from, and nothing when the chosen corners count from different ends', async () => {
    // Clicks counted from full soft grow stiffer, from full stiff softer (common practice; the damper maker's manual says which end).
    const car = { ...CAR, damperAdjusters: { front: { positions: 24, countFrom: 'full_soft' as const }, rear: { positions: 24, countFrom: 'full_stiff' as const } } };
    stubWithRuns([], { extra: { ...TODAY_EVENT(), 'GET /api/cars': list([car]) } });
    renderApp(PATH, { outboxEntries: [blockingEntry()] });
    const u = userEvent.setup();
    await screen.findByRole('form', { name: 'Log a run' });
    await u.click(screen.getByRole('button', { name: 'Quick change' }));
    const form = await screen.findByRole('form', { name: 'Quick change' });

    await u.click(within(form).getByRole('button', { name: 'Front' }));
    // The words go into a live region that is there before them, so a screen reader announces them.
    const live = form.querySelector('[aria-live="polite"]');
    expect(live?.textContent).toBe('');
    await u.click(within(form).getByRole('button', { name: 'More clicks' }));
    expect(within(form).getByText('Stiffer (clicks count from full soft)')).toBe(live);
    await u.click(within(form).getByRole('button', { name: 'Less clicks' }));
    await u.click(within(form).getByRole('button', { name: 'Less clicks' }));
    expect(within(form).getByText('Softer (clicks count from full soft)')).toBeTruthy();

    await u.click(within(form).getByRole('button', { name: 'Rear' }));
    await u.click(within(form).getByRole('button', { name: 'More clicks' }));
    await u.click(within(form).getByRole('button', { name: 'More clicks' }));
    expect(within(form).getByText('Softer (clicks count from full stiff)')).toBeTruthy();
    // Set to 12 from 10 at the rear: two clicks more, softer again.
    await u.click(within(form).getByRole('button', { name: 'Set to' }));
    await u.type(within(form).getByLabelText(/^Set clicks to/), '12');
    expect(within(form).getByText('Softer (clicks count from full stiff)')).toBeTruthy();

    await u.click(within(form).getByRole('button', { name: 'All four' }));
    expect(within(form).queryByText(/^(Stiffer|Softer) \(/)).toBeNull();
  });

  it('when the front dampers have a rebound adjuster counted from the other end, then a quick change of rebound clicks says stiffer or softer by that adjuster\'s end', async () => {
    // Bump clicks from full soft, rebound clicks from full stiff: more rebound clicks are softer (common practice; the
    // damper maker's manual says which end each adjuster counts from).
    const car = { ...CAR, damperAdjusters: { ...CAR.damperAdjusters, front: { positions: 24, countFrom: 'full_soft' as const, rebound: { positions: 20, countFrom: 'full_stiff' as const } } } };
    const withRebound: Setup = { ...BASE_SETUP, corners: { ...BASE_SETUP.corners, lf: { ...BASE_SETUP.corners.lf, damperReboundClicks: 8 }, rf: { ...BASE_SETUP.corners.rf, damperReboundClicks: 8 } } };
    stubWithRuns([], { setups: [withRebound], extra: { ...TODAY_EVENT(), 'GET /api/cars': list([car]) } });
    renderApp(PATH, { outboxEntries: [blockingEntry()] });
    const u = userEvent.setup();
    await screen.findByRole('form', { name: 'Log a run' });
    await u.click(screen.getByRole('button', { name: 'Quick change' }));
    const form = await screen.findByRole('form', { name: 'Quick change' });

    await u.selectOptions(within(form).getByLabelText('What'), 'Rebound clicks');
    await u.click(within(form).getByRole('button', { name: 'Front' }));
    await u.click(within(form).getByRole('button', { name: 'More rebound clicks' }));
    expect(within(form).getByText('Softer (rebound clicks count from full stiff)')).toBeTruthy();
    await u.click(within(form).getByRole('button', { name: 'Less rebound clicks' }));
    await u.click(within(form).getByRole('button', { name: 'Less rebound clicks' }));
    expect(within(form).getByText('Stiffer (rebound clicks count from full stiff)')).toBeTruthy();
  });

  it('when rebound clicks are picked where the setup records none, then the change starts on "Set to"; a change by an amount says once which corners have nothing to change from', async () => {
    const car = { ...CAR, damperAdjusters: { ...CAR.damperAdjusters, front: { positions: 24, countFrom: 'full_soft' as const, rebound: { positions: 20, countFrom: 'full_stiff' as const } } } };
    stubWithRuns([], { extra: { ...TODAY_EVENT(), 'GET /api/cars': list([car]) } });
    renderApp(PATH, { outboxEntries: [blockingEntry()] });
    const u = userEvent.setup();
    await screen.findByRole('form', { name: 'Log a run' });
    await u.click(screen.getByRole('button', { name: 'Quick change' }));
    const form = await screen.findByRole('form', { name: 'Quick change' });
    const pressed = () => within(within(form).getByRole('group', { name: 'Change by or set to' })).getAllByRole('button', { pressed: true }).map((b) => b.textContent);

    // Clicks are recorded: a change by an amount. Rebound clicks are not: set a value.
    expect(pressed()).toEqual(['Change by']);
    await u.selectOptions(within(form).getByLabelText('What'), 'Rebound clicks');
    expect(pressed()).toEqual(['Set to']);
    await u.selectOptions(within(form).getByLabelText('What'), 'Clicks');
    expect(pressed()).toEqual(['Change by']);

    await u.selectOptions(within(form).getByLabelText('What'), 'Rebound clicks');
    await u.click(within(form).getByRole('button', { name: 'Front' }));
    await u.click(within(form).getByRole('button', { name: 'Change by' }));
    await u.click(within(form).getByRole('button', { name: 'More rebound clicks' }));
    expect(within(form).getAllByText(/recorded at the/).map((e) => e.textContent)).toEqual([
      'No rebound clicks recorded at the left front and right front to change by; use “Set to”',
    ]);
  });

  it('when a quick change sets the rear to one click, then its label reads "1 click", not "1 clicks"', async () => {
    stubWithRuns([], { extra: TODAY_EVENT() });
    const { outbox } = renderApp(PATH, { outboxEntries: [blockingEntry()] });
    const u = userEvent.setup();
    await screen.findByRole('form', { name: 'Log a run' });
    await u.click(screen.getByRole('button', { name: 'Quick change' }));
    const form = await screen.findByRole('form', { name: 'Quick change' });
    await u.click(within(form).getByRole('button', { name: 'Rear' }));
    await u.click(within(form).getByRole('button', { name: 'Set to' }));
    await u.type(within(form).getByLabelText(/^Set clicks to/), '1');
    await u.click(within(form).getByRole('button', { name: 'Save quick change' }));

    await waitFor(() => expect(outbox.getSnapshot()).toHaveLength(2));
    const body = outbox.getSnapshot()[1]!.body as { label: string; changes: unknown[] };
    expect(body.changes).toEqual([{ field: 'damperClicks', corners: ['lr', 'rr'], value: 1 }]);
    expect(body.label).toBe('Quick change: rear clicks = 1 click');
  });

  /** Today's board, its quick change open on a line that sets the front cold pressure to a value yet to be typed. */
  async function setFrontColdPressure() {
    stubWithRuns([], { extra: TODAY_EVENT() });
    const { outbox } = renderApp(PATH);
    const u = userEvent.setup();
    await screen.findByRole('form', { name: 'Log a run' });
    await u.click(screen.getByRole('button', { name: 'Quick change' }));
    const form = await screen.findByRole('form', { name: 'Quick change' });
    await u.selectOptions(within(form).getByLabelText('What'), 'coldPressureKpa');
    await u.click(within(form).getByRole('button', { name: 'Front' }));
    await u.click(within(form).getByRole('button', { name: 'Set to' }));
    return { u, outbox, form };
  }

  it('when a quick change sets the front to the cold pressure it already has, then the line says that changes nothing, and nothing is saved', async () => {
    const { u, outbox, form } = await setFrontColdPressure();
    // Both front corners of the setup in force are at 200 kPa.
    await u.type(within(form).getByLabelText(/Set cold pressure to/), '200');
    await u.click(within(form).getByRole('button', { name: 'Save quick change' }));

    expect(await within(form).findByText('Each corner chosen already has this value: that changes nothing')).toBeTruthy();
    expect(outbox.getSnapshot()).toHaveLength(0);
    // One corner that differs makes it a change: the rear is at 190 kPa.
    await u.click(within(form).getByRole('button', { name: 'All four' }));
    await u.click(within(form).getByRole('button', { name: 'Save quick change' }));
    await waitFor(() => expect(outbox.getSnapshot()).toHaveLength(1));
    expect((outbox.getSnapshot()[0]!.body as { label: string }).label).toBe('Quick change: all four cold pressure = 200 kPa');
  });

  it('when a quick change is made in psi, then its body carries the change in kPa, the device time, a client id, and the next run shows the new setup', async () => {
    const fetchMock = stubWithRuns([], { units: IMPERIAL_PREFERENCES, extra: TODAY_EVENT() });
    const { outbox } = renderApp(PATH, { outboxEntries: [blockingEntry()] });
    const u = userEvent.setup();
    await screen.findByRole('form', { name: 'Log a run' });
    const before = Date.now();

    await u.click(screen.getByRole('button', { name: 'Quick change' }));
    const form = await screen.findByRole('form', { name: 'Quick change' });
    // Change 1: rear clicks +2.
    await u.click(within(form).getByRole('button', { name: 'Rear' }));
    await u.click(within(form).getByRole('button', { name: 'More clicks' }));
    await u.click(within(form).getByRole('button', { name: 'More clicks' }));
    // Change 2: all four cold pressures −1.0 psi.
    await u.click(within(form).getByRole('button', { name: /Another change/ }));
    await u.selectOptions(within(form).getAllByLabelText('What')[1]!, 'coldPressureKpa');
    await u.click(within(form).getAllByRole('button', { name: 'Less cold pressure' })[0]!);
    await u.click(within(form).getAllByRole('button', { name: 'Less cold pressure' })[0]!);
    await u.click(within(form).getByRole('button', { name: 'Save quick change' }));

    await waitFor(() => expect(outbox.getSnapshot()).toHaveLength(2));
    const entry = outbox.getSnapshot()[1]!;
    expect(entry).toMatchObject({ kind: 'setup.quickChange', method: 'POST', path: `/api/cars/${IDS.car}/setups/quick-change`, scope: { carId: IDS.car } });
    const body = entry.body as { id: string; effectiveFrom: string; label: string; changes: { field: string; corners: string[]; delta: number }[] };
    expect(body.id).toMatch(UUID);
    expect(entry.recordId).toBe(body.id);
    expect(Date.parse(body.effectiveFrom)).toBeGreaterThanOrEqual(before - 1000);
    expect(Date.parse(body.effectiveFrom)).toBeLessThanOrEqual(Date.now());
    expect(body.changes[0]).toEqual({ field: 'damperClicks', corners: ['lr', 'rr'], delta: 2 });
    expect(body.changes[1]!.field).toBe('coldPressureKpa');
    expect(body.changes[1]!.corners).toEqual(['lf', 'rf', 'lr', 'rr']);
    expect(body.changes[1]!.delta).toBeCloseTo(-KPA_PER_PSI, 5); // −1.0 psi = −6.894757 kPa
    expect(body.label).toBe('Quick change: rear clicks +2, all four cold pressure −1.0 psi');
    expect(fetchMock.mock.calls.some(([url]) => String(url).includes('quick-change'))).toBe(false);

    // Beside the Quick change button the line starts with what changed; the run keeps the snapshot's whole name.
    const setupNow = screen.getByRole('region', { name: 'Setup' });
    expect(within(setupNow).getByText('rear clicks +2, all four cold pressure −1.0 psi')).toBeTruthy();
    expect(within(setupNow).getByText('Waiting to upload')).toBeTruthy();

    await keypad(u, '45.2');
    await u.click(screen.getByRole('button', { name: 'Save run 1' }));
    const row = await screen.findByRole('listitem', { name: /^Run 1,/ });
    expect(within(row).getByText(`Setup: ${body.label}`)).toBeTruthy();
  });

  it('when a quick change would take a corner out of range, then the line says which as it is typed, with the caution beside it, and nothing is saved', async () => {
    const { u, outbox, form } = await setFrontColdPressure();
    expect(within(form).getByRole('complementary', { name: 'Before you change the car' }).textContent).toMatch(/stands/);
    const amount = within(form).getByLabelText(/Set cold pressure to/);
    await u.type(amount, '900');

    // Cold pressure is held to 50–450 kPa, as the server holds it; said per corner before Save.
    expect(amount.getAttribute('aria-invalid')).toBe('true');
    expect(within(form).getByText(/Left front: .*between 50 and 450 kPa.*Right front: /)).toBeTruthy();
    await u.click(within(form).getByRole('button', { name: 'Save quick change' }));
    expect(outbox.getSnapshot()).toHaveLength(0);
  });

  it('when a run cannot be saved, then the Save bar says so and the first marked field takes the focus', async () => {
    stubWithRuns([]);
    const { outbox } = renderApp(PATH);
    const u = userEvent.setup();
    await screen.findByRole('form', { name: 'Log a run' });

    await keypad(u, '45.2');
    await u.click(screen.getByRole('button', { name: /Hot pressures and note/ }));
    await u.type(screen.getByLabelText('Left rear hot pressure'), '3o');
    await u.click(screen.getByRole('button', { name: 'Save run 1' }));

    expect(await screen.findByText('Not saved: fix what is marked.')).toBeTruthy();
    await waitFor(() => expect(document.activeElement).toBe(screen.getByLabelText('Left rear hot pressure')));
    expect(screen.getByText('Type a number, e.g. 224 kPa')).toBeTruthy();
    expect(outbox.getSnapshot()).toHaveLength(0);
  });

  it('when the car and driver have not been chosen at this event, then they are asked once and remembered', async () => {
    localStorage.clear();
    stubWithRuns([], { extra: TODAY_EVENT() });
    const { router } = renderApp(`/events/${IDS.event}`);
    const u = userEvent.setup();

    await u.click(await screen.findByRole('radio', { name: /Grey roadster/ }));
    await u.click(screen.getByRole('radio', { name: /Tomas Reyes/ }));
    await u.click(screen.getByRole('button', { name: 'Start logging' }));

    await screen.findByRole('form', { name: 'Log a run' });
    expect(JSON.parse(localStorage.getItem(`scrubline.event-day.${IDS.event}`)!)).toEqual({ carId: IDS.car, driverId: IDS.tomas });
    expect(screen.getByRole('form', { name: 'Log a run' }).textContent).toContain('Tomas Reyes');
    // The address holds the choice too.
    const search = new URLSearchParams(router.state.location.search);
    expect([search.get('carId'), search.get('driverId')]).toEqual([IDS.car, IDS.tomas]);
  });

  it('when the driver has one car that nobody else drives, then the board opens without asking, and there is nothing to change', async () => {
    localStorage.clear();
    stubWithRuns([], { extra: { 'GET /api/cars': list([{ ...CAR, coDrivers: [] }]) } });
    renderApp(`/events/${IDS.event}`);

    const form = await screen.findByRole('form', { name: 'Log a run' });
    expect(form.textContent).toContain(CAR.owner.displayName);
    expect(screen.queryByRole('button', { name: 'Start logging' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Change car or driver' })).toBeNull();
  });

  it('when the driver has two cars, each driven by its owner alone, then which car is still asked', async () => {
    localStorage.clear();
    stubWithRuns([], { extra: { 'GET /api/cars': list([{ ...CAR, coDrivers: [] }, { ...CAR, id: 'c2222222-2222-4222-8222-222222222222', name: 'Blue hatch', coDrivers: [] }]) } });
    renderApp(`/events/${IDS.event}`);

    // The event was on an earlier day: choosing leads to that day's runs, not to logging now.
    expect(await screen.findByRole('button', { name: 'Open that day’s runs' })).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Start logging' })).toBeNull();
    expect(screen.queryByRole('form', { name: 'Log a run' })).toBeNull();
  });

  it('when the page is opened from an address with the car and the driver, then it goes straight to logging for them, even on a phone that never chose them', async () => {
    localStorage.clear();
    stubWithRuns([]);
    renderApp(`/events/${IDS.event}?carId=${IDS.car}&driverId=${IDS.tomas}`);

    const form = await screen.findByRole('form', { name: 'Log a run' });
    expect(form.textContent).toContain('Tomas Reyes');
    expect(screen.queryByRole('button', { name: 'Start logging' })).toBeNull();
  });

  it('when the address names a driver who does not drive that car, then the car and driver are asked for', async () => {
    localStorage.clear();
    stubWithRuns([]);
    renderApp(`/events/${IDS.event}?carId=${IDS.car}&driverId=${IDS.event}`);

    expect(await screen.findByRole('button', { name: 'Open that day’s runs' })).toBeTruthy();
    expect(screen.queryByRole('form', { name: 'Log a run' })).toBeNull();
  });

  it('when the server refused a run, then it stays on screen with its error and can be fixed and sent again', async () => {
    const refused = storedEntry({
      key: 'refused-run',
      recordId: IDS.run2,
      kind: 'run.create',
      method: 'POST',
      path: '/api/runs',
      scope: { carId: IDS.car, eventId: IDS.event },
      state: 'failed',
      attempts: 1,
      error: { status: 409, code: 'conflict', message: 'Run 1 is already logged for this driver and car at this event.', fieldErrors: { runNumber: ['Run 1 is already logged; use the next number'] } },
      body: {
        id: IDS.run2, carId: IDS.car, eventId: IDS.event, driverId: IDS.maren, runNumber: 1,
        rawTimeSec: 47.2, cones: 0, status: 'finished', recordedAt: '2026-06-07T10:05:00.000Z',
      },
    });
    const fetchMock = stubWithRuns([], { extra: { 'POST /api/runs': offline } });
    const { outbox } = renderApp(PATH, { outboxEntries: [refused] });
    const u = userEvent.setup();

    const row = await screen.findByRole('listitem', { name: /^Run 1,/ });
    expect(within(row).getByText('Needs attention')).toBeTruthy();
    // Said once: the field's message, not the summary and then the same again.
    expect((await within(row).findAllByText(/Run 1 is already logged/)).map((p) => p.textContent)).toEqual([
      'Not accepted: Run 1 is already logged; use the next number',
    ]);

    await u.click(within(row).getByRole('button', { name: 'Fix' }));
    const number = await within(row).findByLabelText('Run number');
    // The next number free on this phone is offered, and said to be.
    expect((number as HTMLInputElement).value).toBe('2');
    expect(within(row).getByText(/run 2 is filled in: the next number free here/)).toBeTruthy();
    await u.clear(number);
    await u.type(number, '3');
    await u.click(within(row).getByRole('button', { name: 'Fix and send again' }));

    await waitFor(() => expect(requestsTo(fetchMock, 'POST /api/runs')).toHaveLength(1));
    expect((requestsTo(fetchMock, 'POST /api/runs')[0]?.body as { runNumber: number }).runNumber).toBe(3);
    expect(outbox.getSnapshot()[0]?.state).toBe('waiting');
  });

  it('when a refused run is discarded, then it leaves the list and the outbox, and Undo puts it back in line to be judged again', async () => {
    const refused = storedEntry({
      key: 'refused-run',
      recordId: IDS.run2,
      kind: 'run.create',
      method: 'POST',
      path: '/api/runs',
      label: 'Run 1 · 43.333',
      scope: { carId: IDS.car, eventId: IDS.event },
      state: 'failed',
      attempts: 1,
      error: { status: 409, code: 'conflict', message: 'Run 1 is already logged for this driver and car at this event.' },
      body: {
        id: IDS.run2, carId: IDS.car, eventId: IDS.event, driverId: IDS.maren, runNumber: 1,
        rawTimeSec: 43.333, cones: 0, status: 'finished', recordedAt: '2026-06-07T10:05:00.000Z',
      },
    });
    stubWithRuns([], { extra: { 'POST /api/runs': offline } });
    const { outbox } = renderApp(PATH, { outboxEntries: [refused] });
    const u = userEvent.setup();

    const row = await screen.findByRole('listitem', { name: /^Run 1,/ });
    await u.click(await within(row).findByRole('button', { name: 'Discard this run' }));
    await waitFor(() => expect(screen.queryByRole('listitem', { name: /^Run 1,/ })).toBeNull());
    expect(outbox.getSnapshot()).toHaveLength(0);
    expect(await screen.findByText('Run 1 discarded')).toBeTruthy();

    await u.click(screen.getByRole('button', { name: 'Undo' }));
    await waitFor(() => expect(outbox.getSnapshot()).toHaveLength(1));
    expect(outbox.getSnapshot()[0]).toMatchObject({ recordId: IDS.run2, method: 'POST', body: { runNumber: 1, rawTimeSec: 43.333 } });
    expect(await screen.findByRole('listitem', { name: /^Run 1,/ })).toBeTruthy();
  });

  it('when an upload finds the session over, then the page goes to sign in, and the run stays on the phone for the driver', async () => {
    stubWithRuns([], {
      extra: { 'GET /api/auth/session': [jsonResponse(200, { user: user(METRIC_PREFERENCES) }), NOBODY_SIGNED_IN], 'POST /api/runs': SIGNED_OUT },
    });
    const { router, storage } = renderApp(PATH);
    const u = userEvent.setup();
    await screen.findByRole('form', { name: 'Log a run' });

    await keypad(u, '47.2');
    await u.click(screen.getByRole('button', { name: /^Save run/ }));

    await waitFor(() => expect(router.state.location.pathname).toBe('/sign-in'), { timeout: 5000 });
    expect(storage.saved.map((e) => [e.kind, e.owner])).toEqual([['run.create', IDS.maren]]);
  });

  it('when the server answers that the event is not there, then the page says so, not that it is waiting for signal; with no signal it says that', async () => {
    stubWithRuns([], { extra: { [`GET /api/events/${IDS.event}`]: errorResponse(404, 'not_found', 'That event was not found.') } });
    const first = renderApp(PATH);
    expect(await screen.findByText('This event was not found: it may have been deleted, or it is not one you can open.')).toBeTruthy();
    expect(screen.queryByText(/Open it once with signal/)).toBeNull();
    first.unmount();

    stubWithRuns([], { extra: { [`GET /api/events/${IDS.event}`]: offline } });
    const second = renderApp(PATH);
    expect(await screen.findByText('This event is not on this phone yet. Open it once with signal to use it offline.')).toBeTruthy();
    second.unmount();

    // A server in trouble is not a missing event: its own words are shown.
    stubWithRuns([], { extra: { [`GET /api/events/${IDS.event}`]: errorResponse(503, 'unavailable', 'Scrubline is restarting; try again in a minute.') } });
    renderApp(PATH);
    expect(await screen.findByText('Scrubline is restarting; try again in a minute.', { selector: 'p' })).toBeTruthy();
    expect(screen.queryByText(/This event was not found/)).toBeNull();
  });
});
