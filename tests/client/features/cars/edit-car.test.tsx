// @vitest-environment jsdom
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import type { Car } from '@shared/season/car.schema';
import { blockingEntry, errorResponse, jsonResponse, renderApp, requestsTo, setUpAppTests, stubFetch } from '../../test-utils';
import { stubCarPage } from '../../fixtures/car-page';
import { CAR, coDriverUser, IDS, list, runOnPhone, user } from '../../fixtures/season';

setUpAppTests([() => import('@/app/routes/cars/car-details-pages'), () => import('@/app/routes/cars/cars'), () => import('@/app/routes/cars/car')]);

const CAR_PATH = `/api/cars/${IDS.car}`;
const EDIT = `/cars/${IDS.car}?edit=1`;

describe('editing a car', () => {
  it('when the owner opens the car, then Edit car leads to its edit page; a co-driver sees no such link', async () => {
    stubCarPage(user());
    renderApp(`/cars/${IDS.car}`);
    expect((await screen.findByRole('link', { name: 'Edit car' })).getAttribute('href')).toBe(EDIT);
    cleanup();

    stubCarPage(coDriverUser());
    renderApp(`/cars/${IDS.car}`);
    await screen.findByText('Only the owner, Maren Holt, can add or remove co-drivers.');
    expect(screen.queryByRole('link', { name: 'Edit car' })).toBeNull();
  });

  it('when the owner opens Edit car, then the form holds what is stored, and saving sends the changes with the version', async () => {
    const saved: Car = { ...CAR, name: 'Grey roadster II', damperAdjusters: { ...CAR.damperAdjusters, rear: { positions: 16, countFrom: 'full_stiff', rebound: null } }, version: 2 };
    let stored = CAR;
    const fetch = stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      [`GET ${CAR_PATH}`]: () => jsonResponse(200, stored),
      [`PATCH ${CAR_PATH}`]: () => {
        stored = saved;
        return jsonResponse(200, saved);
      },
    });
    const { router } = renderApp(EDIT);
    const u = userEvent.setup();

    const name = (await screen.findByLabelText(/^Name/)) as HTMLInputElement;
    expect(name.value).toBe('Grey roadster');
    expect((screen.getByLabelText('Class') as HTMLInputElement).value).toBe('SM');
    expect((screen.getByLabelText('Car number (optional)') as HTMLInputElement).value).toBe('47');
    const rear = screen.getByRole('group', { name: 'Rear dampers' });
    expect((within(rear).getByLabelText('Number of clicks') as HTMLInputElement).value).toBe('24');
    expect((within(rear).getByRole('radio', { name: /Full soft/ }) as HTMLInputElement).checked).toBe(true);

    await u.clear(name);
    await u.type(name, 'Grey roadster II');
    await u.clear(within(rear).getByLabelText('Number of clicks'));
    await u.type(within(rear).getByLabelText('Number of clicks'), '16');
    await u.click(within(rear).getByRole('radio', { name: /Full stiff/ }));
    await u.click(screen.getByRole('button', { name: 'Save changes' }));

    await waitFor(() => expect(router.state.location.pathname).toBe(`/cars/${IDS.car}`));
    // In the edit page's place, so Back does not reopen the form; and said.
    expect(router.state.historyAction).toBe('REPLACE');
    expect(router.state.location.search).toBe('');
    expect(await screen.findByText('Car saved')).toBeTruthy();
    const [patch] = requestsTo(fetch, `PATCH ${CAR_PATH}`);
    expect(patch!.body).toEqual({
      name: 'Grey roadster II',
      classCode: 'SM',
      carNumber: '47',
      tyreSize: '205/50R15',
      damperAdjusters: { front: { positions: 24, countFrom: 'full_soft', rebound: null }, rear: { positions: 16, countFrom: 'full_stiff', rebound: null } },
      motionRatios: { front: null, rear: null },
      notes: null,
      version: 1,
    });
  });

  it('when the front dampers have a rebound adjuster, then the form shows it; unticking it clears it and the rear gains one, sent with the version', async () => {
    const double: Car = {
      ...CAR,
      damperAdjusters: { ...CAR.damperAdjusters, front: { positions: 24, countFrom: 'full_soft', rebound: { positions: 20, countFrom: 'full_stiff' } } },
    };
    const fetch = stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      [`GET ${CAR_PATH}`]: jsonResponse(200, double),
      [`PATCH ${CAR_PATH}`]: jsonResponse(200, { ...double, version: 2 }),
    });
    renderApp(EDIT);
    const u = userEvent.setup();
    const front = await screen.findByRole('group', { name: 'Front dampers' });
    const rear = screen.getByRole('group', { name: 'Rear dampers' });

    expect((within(front).getByRole('checkbox', { name: /Separate rebound adjuster/ }) as HTMLInputElement).checked).toBe(true);
    expect((within(front).getByLabelText('Number of rebound clicks') as HTMLInputElement).value).toBe('20');
    const frontReboundEnd = within(front).getByRole('group', { name: 'Rebound click 0 is at' });
    expect((within(frontReboundEnd).getByRole('radio', { name: /Full stiff/ }) as HTMLInputElement).checked).toBe(true);
    // The damper maker's manual is named where the rebound clicks are asked for.
    expect(within(front).getByText('Check the damper maker’s manual for the count.')).toBeTruthy();
    // The rear has none: its rebound clicks are not asked for until ticked.
    expect((within(rear).getByRole('checkbox', { name: /Separate rebound adjuster/ }) as HTMLInputElement).checked).toBe(false);
    expect(within(rear).queryByLabelText('Number of rebound clicks')).toBeNull();

    await u.click(within(front).getByRole('checkbox', { name: /Separate rebound adjuster/ }));
    expect(within(front).queryByLabelText('Number of rebound clicks')).toBeNull();
    await u.click(within(rear).getByRole('checkbox', { name: /Separate rebound adjuster/ }));
    await u.type(within(rear).getByLabelText('Number of rebound clicks'), '10');
    await u.click(within(within(rear).getByRole('group', { name: 'Rebound click 0 is at' })).getByRole('radio', { name: /Full soft/ }));
    await u.click(screen.getByRole('button', { name: 'Save changes' }));

    await waitFor(() => expect(requestsTo(fetch, `PATCH ${CAR_PATH}`)).toHaveLength(1));
    expect((requestsTo(fetch, `PATCH ${CAR_PATH}`)[0]!.body as { damperAdjusters: unknown }).damperAdjusters).toEqual({
      front: { positions: 24, countFrom: 'full_soft', rebound: null },
      rear: { positions: 24, countFrom: 'full_soft', rebound: { positions: 10, countFrom: 'full_soft' } },
    });
  });

  it('when a ticked rebound adjuster has no clicks, 0 clicks, or stands without the other adjuster\'s clicks, then each box says so and nothing is sent', async () => {
    const fetch = stubFetch({ 'GET /api/auth/session': jsonResponse(200, { user: user() }), [`GET ${CAR_PATH}`]: jsonResponse(200, CAR) });
    renderApp(EDIT);
    const u = userEvent.setup();
    const front = await screen.findByRole('group', { name: 'Front dampers' });
    const rear = screen.getByRole('group', { name: 'Rear dampers' });
    await u.click(within(front).getByRole('checkbox', { name: /Separate rebound adjuster/ }));
    await u.click(within(rear).getByRole('checkbox', { name: /Separate rebound adjuster/ }));
    await u.type(within(rear).getByLabelText('Number of rebound clicks'), '0');
    await u.click(screen.getByRole('button', { name: 'Save changes' }));

    expect(await within(front).findByText('Give the number of rebound clicks, or untick the rebound adjuster')).toBeTruthy();
    expect(within(front).getByLabelText('Number of rebound clicks').getAttribute('aria-invalid')).toBe('true');
    expect(within(rear).getByText('Between 1 and 100 clicks')).toBeTruthy();

    await u.type(within(front).getByLabelText('Number of rebound clicks'), '20');
    await u.clear(within(front).getByLabelText('Number of clicks'));
    await u.click(screen.getByRole('button', { name: 'Save changes' }));
    expect(await within(front).findByText('Give these clicks too, or untick the rebound adjuster')).toBeTruthy();
    expect(requestsTo(fetch, `PATCH ${CAR_PATH}`)).toHaveLength(0);
  });

  it('when the server refuses a rebound adjuster\'s clicks, then the message stands under that box', async () => {
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      [`GET ${CAR_PATH}`]: jsonResponse(200, CAR),
      [`PATCH ${CAR_PATH}`]: errorResponse(400, 'validation_failed', 'Check the marked fields.', { 'damperAdjusters.rear.rebound.positions': ['At most 100'] }),
    });
    renderApp(EDIT);
    const u = userEvent.setup();
    const rear = await screen.findByRole('group', { name: 'Rear dampers' });
    await u.click(within(rear).getByRole('checkbox', { name: /Separate rebound adjuster/ }));
    await u.type(within(rear).getByLabelText('Number of rebound clicks'), '16');
    await u.click(screen.getByRole('button', { name: 'Save changes' }));

    const box = within(rear).getByLabelText('Number of rebound clicks');
    await waitFor(() => expect(box.getAttribute('aria-invalid')).toBe('true'));
    expect(within(rear).getByText('At most 100')).toBeTruthy();
  });

  it('when a click count is not a whole number, then the box says so and nothing is sent', async () => {
    const fetch = stubFetch({ 'GET /api/auth/session': jsonResponse(200, { user: user() }), [`GET ${CAR_PATH}`]: jsonResponse(200, CAR) });
    renderApp(EDIT);
    const u = userEvent.setup();
    const front = await screen.findByRole('group', { name: 'Front dampers' });
    await u.clear(within(front).getByLabelText('Number of clicks'));
    await u.type(within(front).getByLabelText('Number of clicks'), '2.5');
    await u.click(screen.getByRole('button', { name: 'Save changes' }));

    expect(await within(front).findByText('Type a whole number of clicks, e.g. 24')).toBeTruthy();
    expect(requestsTo(fetch, `PATCH ${CAR_PATH}`)).toHaveLength(0);
  });

  it('when someone else saved the car meanwhile (409), then the form says so and starts again from what is stored', async () => {
    const theirs: Car = { ...CAR, classCode: 'STR', version: 2 };
    let stored = CAR;
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      [`GET ${CAR_PATH}`]: () => jsonResponse(200, stored),
      [`PATCH ${CAR_PATH}`]: () => {
        stored = theirs;
        return errorResponse(409, 'conflict', 'Someone changed this since you opened it.');
      },
    });
    renderApp(EDIT);
    const u = userEvent.setup();
    const name = await screen.findByLabelText(/^Name/);
    await u.type(name, ' X');
    await u.click(screen.getByRole('button', { name: 'Save changes' }));

    expect(await screen.findByText(/Someone changed this car since you opened it/)).toBeTruthy();
    await waitFor(() => expect((screen.getByLabelText('Class') as HTMLInputElement).value).toBe('STR'));
  });

  it('when the server refuses a field, then the message stands under that box', async () => {
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      [`GET ${CAR_PATH}`]: jsonResponse(200, CAR),
      [`PATCH ${CAR_PATH}`]: errorResponse(400, 'validation_failed', 'Check the marked fields.', { classCode: ['Use at most 20 characters'] }),
    });
    renderApp(EDIT);
    const u = userEvent.setup();
    await screen.findByLabelText(/^Name/);
    await u.click(screen.getByRole('button', { name: 'Save changes' }));

    const classBox = screen.getByLabelText('Class');
    await waitFor(() => expect(classBox.getAttribute('aria-invalid')).toBe('true'));
    expect(screen.getByText('Use at most 20 characters')).toBeTruthy();
  });

  it('when a co-driver opens the page, then it says who can change the car and offers no form', async () => {
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: { ...user(), id: IDS.tomas, displayName: 'Tomas Reyes' } }),
      [`GET ${CAR_PATH}`]: jsonResponse(200, CAR),
    });
    renderApp(EDIT);

    expect(await screen.findByRole('heading', { name: 'Only Maren Holt can change this car' })).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Save changes' })).toBeNull();
    expect(screen.queryByRole('button', { name: /Delete/ })).toBeNull();
  });
});

describe('deleting a car', () => {
  it('when the name typed is not the car’s, then nothing is deleted; when it is, then the car goes and the cars list opens', async () => {
    const fetch = stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      [`GET ${CAR_PATH}`]: jsonResponse(200, CAR),
      [`DELETE ${CAR_PATH}`]: () => new Response(null, { status: 204 }),
      'GET /api/cars': list([]),
    });
    const { router, outbox } = renderApp(EDIT, { outboxEntries: [blockingEntry(), runOnPhone()] });
    const u = userEvent.setup();
    const confirm = await screen.findByLabelText('Type Grey roadster to confirm');
    const button = screen.getByRole('button', { name: 'Delete Grey roadster and its season' });

    await u.type(confirm, 'grey');
    await u.click(button);
    expect(await screen.findByText("Type the car's name, Grey roadster, exactly as shown")).toBeTruthy();
    expect(requestsTo(fetch, `DELETE ${CAR_PATH}`)).toHaveLength(0);

    await u.clear(confirm);
    await u.type(confirm, 'Grey roadster');
    await u.click(button);
    await waitFor(() => expect(router.state.location.pathname).toBe('/cars'));
    expect(requestsTo(fetch, `DELETE ${CAR_PATH}`)).toHaveLength(1);
    // The run still waiting on the phone for this car has nowhere to go; another car's change stays.
    expect(outbox.getSnapshot().map((e) => e.scope.carId)).toEqual(['elsewhere']);
  });
});
