// @vitest-environment jsdom
import { act, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import type { OutboxEntry } from '@/lib/outbox';
import { errorResponse, jsonResponse, renderApp, requestsTo, setUpAppTests, stubFetch } from '../../test-utils';
import { CAR, EVENT, IDS, list, user, UUID } from '../../fixtures/season';

const offline = () => Promise.reject(new TypeError('Failed to fetch'));

setUpAppTests([() => import('@/app/routes/cars/cars'), () => import('@/app/routes/home'), () => import('@/app/routes/events/event-day')], {
  clearLocalStorage: true,
});

function stubNoCars() {
  return stubFetch({
    'GET /api/auth/session': jsonResponse(200, { user: user() }),
    'GET /api/cars': list([]),
    'GET /api/events': list([]),
    'POST /api/cars': offline,
  });
}

describe('new car', () => {
  it('when a car is created with no signal, then one outbox entry holds it with its damper adjusters, and the cars list shows it waiting to upload', async () => {
    stubNoCars();
    const { outbox, router } = renderApp('/cars?new=1');
    const u = userEvent.setup();

    await u.type(await screen.findByLabelText(/^Name/), 'Blue hatch');
    await u.type(screen.getByLabelText('Class'), 'hs');
    await u.type(screen.getByLabelText('Car number (optional)'), '12');
    await u.type(screen.getByLabelText('Tyre size (optional)'), '195/55R15');
    const front = screen.getByRole('group', { name: 'Front dampers' });
    await u.type(within(front).getByLabelText('Number of clicks'), '24');
    await u.click(within(front).getByLabelText('Full soft'));
    const rear = screen.getByRole('group', { name: 'Rear dampers' });
    await u.type(within(rear).getByLabelText('Number of clicks'), '16');
    await u.type(screen.getByLabelText('Front motion ratio'), '0,8');
    await u.click(screen.getByRole('button', { name: 'Save car' }));

    await waitFor(() => expect(outbox.getSnapshot()).toHaveLength(1));
    const [entry] = outbox.getSnapshot() as OutboxEntry[];
    const body = entry!.body as Record<string, unknown>;
    expect(body.id).toMatch(UUID);
    expect(entry).toMatchObject({ kind: 'car.create', method: 'POST', path: '/api/cars', recordId: body.id });
    expect(body).toMatchObject({
      name: 'Blue hatch',
      classCode: 'hs',
      carNumber: '12',
      tyreSize: '195/55R15',
      damperAdjusters: { front: { positions: 24, countFrom: 'full_soft' }, rear: { positions: 16, countFrom: 'full_stiff' } },
      motionRatios: { front: 0.8, rear: null },
    });

    await waitFor(() => expect(router.state.location.pathname + router.state.location.search).toBe('/cars'));
    const item = (await screen.findByText('Blue hatch')).closest('li')!;
    expect(within(item).getByText('Waiting to upload')).toBeTruthy();
    // Not a link yet: its page has nothing to show until the server has it.
    expect(within(item).queryByRole('link')).toBeNull();
  });

  it('when the clicks are not a whole number and the class is missing, then both inputs say so and nothing is saved', async () => {
    stubNoCars();
    const { outbox } = renderApp('/cars?new=1');
    const u = userEvent.setup();

    await u.type(await screen.findByLabelText(/^Name/), 'Blue hatch');
    await u.type(within(screen.getByRole('group', { name: 'Rear dampers' })).getByLabelText('Number of clicks'), '12.5');
    await u.click(screen.getByRole('button', { name: 'Save car' }));

    expect(await screen.findByText('Enter the class')).toBeTruthy();
    expect(screen.getByText('Type a whole number of clicks, e.g. 24')).toBeTruthy();
    expect(outbox.getSnapshot()).toHaveLength(0);
  });

  it('when the clicks are typed below zero, then the box gives the range rather than asking for a whole number', async () => {
    stubNoCars();
    const { outbox } = renderApp('/cars?new=1');
    const u = userEvent.setup();

    await u.type(await screen.findByLabelText(/^Name/), 'Blue hatch');
    await u.type(screen.getByLabelText(/^Class/), 'SS');
    await u.type(within(screen.getByRole('group', { name: 'Rear dampers' })).getByLabelText('Number of clicks'), '-3');
    await u.click(screen.getByRole('button', { name: 'Save car' }));

    expect(await within(screen.getByRole('group', { name: 'Rear dampers' })).findByText('Between 1 and 100 clicks')).toBeTruthy();
    expect(screen.queryByText('Type a whole number of clicks, e.g. 24')).toBeNull();
    expect(outbox.getSnapshot()).toHaveLength(0);
  });

  it('when the driver has no cars, then Home offers to add one', async () => {
    stubNoCars();
    renderApp('/');

    const link = await screen.findByRole('link', { name: 'Add a car' });
    expect(link.getAttribute('href')).toBe('/cars?new=1');
  });

  it('when a driver at an event with no car adds one, then saving it goes back to that event with the new car and them chosen, ready to log a run', async () => {
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      'GET /api/cars': list([]),
      [`GET /api/events/${IDS.event}`]: jsonResponse(200, EVENT),
      'POST /api/cars': offline,
    });
    const { outbox, router } = renderApp(`/events/${IDS.event}`);
    const u = userEvent.setup();

    await u.click(await screen.findByRole('link', { name: 'Add a car' }));
    // Its way back names the event, not the car list.
    expect((await screen.findByRole('link', { name: 'Back to the event' })).getAttribute('href')).toBe(`/events/${IDS.event}`);
    await u.type(await screen.findByLabelText(/^Name/), 'Blue hatch');
    await u.type(screen.getByLabelText('Class'), 'hs');
    await u.click(screen.getByRole('button', { name: 'Save car' }));

    await waitFor(() => expect(outbox.getSnapshot()).toHaveLength(1));
    const carId = (outbox.getSnapshot()[0]!.body as { id: string }).id;
    await waitFor(() => expect(router.state.location.pathname).toBe(`/events/${IDS.event}`));
    expect(Object.fromEntries(new URLSearchParams(router.state.location.search))).toEqual({ carId, driverId: user().id });
    // No picker in between: the board is open on the car still waiting to upload.
    expect(await screen.findByRole('region', { name: 'Log a run' })).toBeTruthy();
    expect(screen.getByRole('region', { name: 'Log a run' }).textContent).toContain(user().displayName);
    // Their only car, which only they drive: there is nothing else to change to.
    expect(screen.queryByRole('button', { name: 'Change car or driver' })).toBeNull();
    // Going back from the event is not back into the form.
    expect(screen.queryByRole('button', { name: 'Save car' })).toBeNull();
  });

  it('when the new car is still uploading as its event opens on it, then its setups and runs are asked for only once the server has it, and no "not found" shows', async () => {
    const NEW = 'c9999999-9999-4999-8999-999999999999';
    vi.spyOn(crypto, 'randomUUID').mockReturnValueOnce(NEW);
    const me = user();
    const saved = { ...CAR, id: NEW, name: 'Blue hatch', classCode: 'hs', owner: { id: me.id, displayName: me.displayName }, coDrivers: [] };
    let landed = false;
    let land: () => void = () => undefined;
    // As the server answers: the car's reads are refused until its creation has landed.
    const notYet = (body: unknown) => () => (landed ? list(body as never[]) : errorResponse(404, 'not_found', 'That car was not found.'));
    const SETUPS = `GET /api/cars/${NEW}/setups`;
    const RUNS = `GET /api/runs?carId=${NEW}&eventId=${IDS.event}`;
    const fetchMock = stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: me }),
      'GET /api/cars': () => list(landed ? [saved] : []),
      [`GET /api/events/${IDS.event}`]: jsonResponse(200, EVENT),
      'POST /api/cars': () =>
        new Promise<Response>((resolve) => {
          land = () => {
            landed = true;
            resolve(jsonResponse(201, saved));
          };
        }),
      [SETUPS]: notYet([]),
      [RUNS]: notYet([]),
    });
    renderApp(`/events/${IDS.event}`);
    const u = userEvent.setup();

    await u.click(await screen.findByRole('link', { name: 'Add a car' }));
    await u.type(await screen.findByLabelText(/^Name/), 'Blue hatch');
    await u.type(screen.getByLabelText('Class'), 'hs');
    await u.click(screen.getByRole('button', { name: 'Save car' }));
    expect(await screen.findByRole('region', { name: 'Log a run' })).toBeTruthy();
    await waitFor(() => expect(requestsTo(fetchMock, 'POST /api/cars')).toHaveLength(1));
    // The upload is on its way: nothing about the car is asked of a server that does not have it yet.
    await new Promise((r) => setTimeout(r, 50));
    expect(requestsTo(fetchMock, SETUPS)).toHaveLength(0);
    expect(requestsTo(fetchMock, RUNS)).toHaveLength(0);
    expect(screen.queryByText('Loading runs…')).toBeNull();

    await act(async () => land());
    await waitFor(() => expect(requestsTo(fetchMock, SETUPS)).toHaveLength(1));
    await waitFor(() => expect(requestsTo(fetchMock, RUNS)).toHaveLength(1));
    expect(screen.queryByText('That car was not found.')).toBeNull();
    expect(screen.getByRole('region', { name: 'Log a run' })).toBeTruthy();
  });

  it('when the new-car page is opened with something other than an event id in its state, then saving goes to the car list', async () => {
    stubNoCars();
    const { router } = renderApp('/');
    await screen.findByRole('link', { name: 'Add a car' });
    await act(() => router.navigate('/cars?new=1', { state: '//elsewhere.example/x' }));
    const u = userEvent.setup();

    await u.type(await screen.findByLabelText(/^Name/), 'Blue hatch');
    expect(screen.queryByRole('link', { name: 'Back to the event' })).toBeNull();
    await u.type(screen.getByLabelText('Class'), 'hs');
    await u.click(screen.getByRole('button', { name: 'Save car' }));

    await waitFor(() => expect(router.state.location.pathname + router.state.location.search).toBe('/cars'));
  });
});
