// @vitest-environment jsdom
import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { errorResponse, jsonResponse, renderApp, requestsTo, setUpAppTests } from '../../test-utils';
import { stubCarPage } from '../../fixtures/car-page';
import { IDS, user } from '../../fixtures/season';

setUpAppTests([() => import('@/app/routes/cars/car')]);

const CAR_PAGE = `/cars/${IDS.car}`;
const NEW_CAR = 'c2222222-2222-4222-8222-222222222222';
const FILE = { format: 'scrubline-season', version: 1, car: { id: 'x', name: 'Old roadster', classCode: 'SM' }, runs: [] };
const jsonFile = (body: unknown, name = 'old-roadster-season-2025.json') => new File([JSON.stringify(body)], name, { type: 'application/json' });

// The whole car page renders before the file is picked: give each test room on a busy machine.
const SLOW = { timeout: 20_000 };

describe('your data, on the car page', () => {
  it('when the car page opens, then both downloads are plain links to the export routes that the browser saves', async () => {
    stubCarPage(user());
    renderApp(CAR_PAGE);
    const csv = await screen.findByRole('link', { name: 'Download runs and setups (CSV)' });
    const json = screen.getByRole('link', { name: 'Download everything (JSON)' });
    expect(csv.getAttribute('href')).toBe(`/api/cars/${IDS.car}/export.csv`);
    expect(json.getAttribute('href')).toBe(`/api/cars/${IDS.car}/export.json`);
    expect(csv.hasAttribute('download')).toBe(true);
    expect(json.hasAttribute('download')).toBe(true);
  });

  it('when a season file is chosen, then it is sent as it is and the new car opens', SLOW, async () => {
    const fetchMock = stubCarPage(user(), { 'POST /api/cars/import': jsonResponse(201, { carId: NEW_CAR }) });
    const { router } = renderApp(CAR_PAGE);
    await userEvent.setup().upload(await screen.findByLabelText('Bring a car in from a Scrubline file'), jsonFile(FILE));

    await waitFor(() => expect(router.state.location.pathname).toBe(`/cars/${NEW_CAR}`));
    const [sent] = requestsTo(fetchMock, 'POST /api/cars/import');
    expect(sent?.body).toEqual(FILE);
    expect(sent?.headers.get('X-CSRF-Token')).toBe('token-1');
  });

  it('when the file is not JSON, then it says so and sends nothing', SLOW, async () => {
    const fetchMock = stubCarPage(user(), { 'POST /api/cars/import': jsonResponse(201, { carId: NEW_CAR }) });
    renderApp(CAR_PAGE);
    await userEvent.setup().upload(
      await screen.findByLabelText('Bring a car in from a Scrubline file'),
      new File(['event,run\nRound 1,1'], 'results.json', { type: 'application/json' }),
    );
    expect(await screen.findByText(/not a Scrubline season file \(it is not JSON\)/)).toBeTruthy();
    expect(requestsTo(fetchMock, 'POST /api/cars/import')).toHaveLength(0);
  });

  it('when the server refuses the file, then its message and the fields it named show beside the picker', SLOW, async () => {
    stubCarPage(user(), {
      'POST /api/cars/import': errorResponse(400, 'validation_failed', 'This season file has records that point at nothing.', {
        'runs.0.eventId': ['No event in the file has this id'],
      }),
    });
    const { router } = renderApp(CAR_PAGE);
    await userEvent.setup().upload(await screen.findByLabelText('Bring a car in from a Scrubline file'), jsonFile(FILE));
    expect(await screen.findByText('This season file has records that point at nothing. · Run 1, event: No event in the file has this id')).toBeTruthy();
    expect(router.state.location.pathname).toBe(CAR_PAGE);
  });

  it('when the server names the same problem as a field and as a whole, then it is said once; places deep in the file are counted from 1', SLOW, async () => {
    const notOurs = 'This is not a Scrubline season file (its "format" should be "scrubline-season").';
    stubCarPage(user(), {
      'POST /api/cars/import': [
        errorResponse(400, 'validation_failed', notOurs, { format: [notOurs] }),
        errorResponse(400, 'validation_failed', 'This season file has values Scrubline cannot read.', {
          'tyreSets.0.readings.11.takenAt': ['Use a date and time'],
        }),
      ],
    });
    renderApp(CAR_PAGE);
    const u = userEvent.setup();
    const picker = await screen.findByLabelText('Bring a car in from a Scrubline file');

    await u.upload(picker, jsonFile(FILE));
    expect((await screen.findByText(/is not a Scrubline season file/)).textContent).toBe(notOurs);
    await u.upload(picker, jsonFile(FILE, 'again.json'));
    expect(
      await screen.findByText('This season file has values Scrubline cannot read. · Tyre set 1, tread reading 12, taken at: Use a date and time'),
    ).toBeTruthy();
  });
});
