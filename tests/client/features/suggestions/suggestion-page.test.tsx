// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import type { Suggestion } from '../../../../shared/collab/suggestion.schema';
import { errorResponse, jsonResponse, renderApp, requestsTo, setUpAppTests, stubFetch } from '../../test-utils';
import { BASE_SETUP, CAR, IDS, list, user, UUID } from '../../fixtures/season';
import { COLLAB_IDS, SHOP_NAME, staffUser, suggestion } from '../../fixtures/collab';

const PAGE = `/suggestions/${COLLAB_IDS.suggestion}`;
const GET = `GET /api/suggestions/${COLLAB_IDS.suggestion}`;
const ACCEPT = `POST /api/suggestions/${COLLAB_IDS.suggestion}/accept`;
const DECLINE = `POST /api/suggestions/${COLLAB_IDS.suggestion}/decline`;

setUpAppTests([() => import('@/app/routes/suggestions/suggestion')]);

function stub(me: object, current: () => Suggestion, extra: Parameters<typeof stubFetch>[0] = {}) {
  return stubFetch({
    'GET /api/auth/session': jsonResponse(200, { user: me }),
    [`GET /api/cars/${IDS.car}`]: jsonResponse(200, CAR),
    [GET]: () => jsonResponse(200, current()),
    ...extra,
  });
}

const decision = () => screen.getByRole('region', { name: 'Decision' });

describe('a suggestion', () => {
  it('shows what the shop proposes and why, each corner from → to, and who sent it', async () => {
    stub(user(), () => suggestion());
    renderApp(PAGE);

    expect(await screen.findByRole('heading', { level: 1, name: 'More front camber' })).toBeTruthy();
    expect(screen.getByText(SHOP_NAME)).toBeTruthy();
    expect(screen.getByText('The outside front edges are wearing faster than the middle.')).toBeTruthy();
    expect(screen.getByText('Front pair camber: change by −0.50°')).toBeTruthy();
    const grid = screen.getByRole('group', { name: 'Camber' });
    const lf = within(grid).getByRole('group', { name: 'Left front' });
    expect(lf.textContent).toContain('\u22121.20°');
    expect(lf.textContent).toContain('→ \u22121.70°');
    expect(within(grid).getByRole('group', { name: 'Left rear' }).textContent).toContain('unchanged');
  });

  it('when it changes clicks by one, then the change reads in the singular ("+1 click"), and by more in the plural', async () => {
    stub(user(), () =>
      suggestion({
        changes: [
          { field: 'damperClicks', corners: ['lr', 'rr'], delta: 1 },
          { field: 'damperReboundClicks', corners: ['lf', 'rf'], delta: -2 },
        ],
        preview: [
          { field: 'damperClicks', corner: 'lr', from: 10, to: 11 },
          { field: 'damperClicks', corner: 'rr', from: 10, to: 11 },
        ],
      }),
    );
    renderApp(PAGE);
    // The setups' own names for the two adjusters: "Clicks" (bump, or the only one) and "Rebound clicks".
    expect(await screen.findByText('Rear pair clicks: change by +1 click')).toBeTruthy();
    expect(screen.getByText('Front pair rebound clicks: change by −2 clicks')).toBeTruthy();
    expect(within(screen.getByRole('group', { name: 'Clicks' })).getByRole('group', { name: 'Left rear' }).textContent).toContain('→ 11 clicks');
    expect(screen.queryByText(/bump/i)).toBeNull();
  });

  it('when a driver accepts it with a time and a label, then the server gets a device-made setup id, and the new setup is one tap away', async () => {
    let current = suggestion();
    const fetchMock = stub(user(), () => current, {
      [ACCEPT]: ({ body }) => {
        const { setupId } = body as { setupId: string };
        current = suggestion({ status: 'accepted', acceptedSetupId: setupId, decidedBy: { id: IDS.maren, displayName: 'Maren Holt' }, decidedAt: '2026-06-08T10:00:00.000Z' });
        return jsonResponse(200, { suggestion: current, setup: { ...BASE_SETUP, id: setupId } });
      },
      [`GET /api/cars/${IDS.car}/setups`]: list([BASE_SETUP]),
    });
    renderApp(PAGE);
    const u = userEvent.setup();

    await u.click(await within(await screen.findByRole('region', { name: 'Decision' })).findByRole('button', { name: 'Accept' }));
    const when = screen.getByLabelText('Takes effect from') as HTMLInputElement;
    // Now, to the minute, unless the driver says otherwise.
    expect(when.value).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/);
    await u.clear(when);
    await u.type(when, '2026-06-08T09:30');
    await u.type(screen.getByLabelText('Label for the new setup (optional)'), 'Shop camber');
    await u.click(screen.getByRole('button', { name: 'Accept and record the setup' }));

    expect(await within(decision()).findByText('Accepted. The new setup is recorded.')).toBeTruthy();
    const body = requestsTo(fetchMock, ACCEPT)[0]!.body as { setupId: string; effectiveFrom: string; label: string };
    expect(body.setupId).toMatch(UUID);
    expect(body.effectiveFrom).toBe(new Date('2026-06-08T09:30').toISOString());
    expect(body.label).toBe('Shop camber');
    const link = within(decision()).getByRole('link', { name: 'Open the new setup on the car’s page' });
    expect(link.getAttribute('href')).toBe(`/cars/${IDS.car}#setup-${body.setupId}`);
    await waitFor(() => expect(within(decision()).queryByRole('button', { name: 'Accept' })).toBeNull());
  });

  it('when the car\'s setup changed after the shop wrote it, then accepting shows what it will really record, worked on the setup in force then; with the base still in force, no such notice', async () => {
    // The driver took 0.3° more camber on both fronts after the shop wrote its change against the spring baseline.
    const since = { ...BASE_SETUP, id: '5e7e7e7e-0000-4000-8000-0000000000c1', label: 'More camber at the track', effectiveFrom: '2026-06-01T10:00:00.000Z',
      corners: { ...BASE_SETUP.corners, lf: { ...BASE_SETUP.corners.lf, camberDeg: -1.5 }, rf: { ...BASE_SETUP.corners.rf, camberDeg: -1.5 } } };
    stub(user(), () => suggestion(), { [`GET /api/cars/${IDS.car}/setups`]: list([since, BASE_SETUP]) });
    renderApp(PAGE);
    const u = userEvent.setup();

    await u.click(await within(await screen.findByRole('region', { name: 'Decision' })).findByRole('button', { name: 'Accept' }));
    const notice = await screen.findByRole('region', { name: 'What accepting records now' });
    expect(notice.textContent).toContain('At the time you chose, the car runs on “More camber at the track”, not on “Spring baseline”, the setup the shop wrote this for.');
    expect(notice.textContent).not.toContain('at that time the car has');
    // −1.5° − 0.5° = −2.0°, not the −1.7° the shop's page shows against the baseline.
    const lf = within(within(notice).getByRole('group', { name: 'Camber' })).getByRole('group', { name: 'Left front' });
    expect(lf.textContent).toContain('\u22121.50°');
    expect(lf.textContent).toContain('→ \u22122.00°');

    // Taking effect before the driver's change, the base is in force then: nothing to point out.
    const when = screen.getByLabelText('Takes effect from');
    await u.clear(when);
    await u.type(when, '2026-05-20T09:30');
    expect(screen.queryByRole('region', { name: 'What accepting records now' })).toBeNull();
  });

  it('when the car runs on a newer setup than the one the shop wrote for, then the page says so on first view and shows what accepting now records beside what was suggested', async () => {
    // Suggested on the spring baseline (LF −1.20° → −1.70°); the car was since handed back with −1.80°: −1.80° − 0.50° = −2.30°.
    const handedBack = { id: '5e7e7e7e-0000-4000-8000-0000000000c2', label: 'As handed back', effectiveFrom: '2026-06-20T10:00:00.000Z' };
    stub(staffUser(), () =>
      suggestion({
        now: {
          setup: handedBack,
          preview: [
            { field: 'camberDeg', corner: 'lf', from: -1.8, to: -2.3 },
            { field: 'camberDeg', corner: 'rf', from: -1.8, to: -2.3 },
          ],
          problems: [],
        },
      }),
    );
    renderApp(PAGE);

    const notice = await screen.findByRole('region', { name: 'What accepting would record now' });
    expect(notice.textContent).toContain('The car runs on another setup now than the one the shop wrote this for.');
    expect(notice.textContent).toContain('The car now runs “As handed back”');
    const now = within(within(notice).getByRole('group', { name: 'Camber' })).getByRole('group', { name: 'Left front' });
    expect(now.textContent).toContain('\u22121.80°');
    expect(now.textContent).toContain('→ \u22122.30°');
    const suggested = screen.getByRole('region', { name: 'What the shop suggested' });
    expect(suggested.textContent).toContain('As the shop suggested it, on “Spring baseline”');
    const then = within(within(suggested).getByRole('group', { name: 'Camber' })).getByRole('group', { name: 'Left front' });
    expect(then.textContent).toContain('→ \u22121.70°');
  });

  it('when the setup the car runs on now cannot take the changes, then the page says accepting would be refused and why, instead of a preview', async () => {
    const handedBack = { id: '5e7e7e7e-0000-4000-8000-0000000000c2', label: 'As handed back', effectiveFrom: '2026-06-20T10:00:00.000Z' };
    stub(staffUser(), () =>
      suggestion({
        now: {
          setup: handedBack,
          preview: [{ field: 'toeMm', corner: 'lf', from: null, to: null }],
          problems: ['No current toe on LF to change; give a value instead'],
        },
      }),
    );
    renderApp(PAGE);

    const notice = await screen.findByRole('region', { name: 'What accepting would record now' });
    expect(notice.textContent).toContain('That setup cannot take them as they are, so accepting now would be refused:');
    expect(within(notice).getByRole('listitem').textContent).toBe('No current toe on LF to change; give a value instead');
    expect(within(notice).queryByRole('group', { name: 'Toe' })).toBeNull();
  });

  it('when a suggestion was accepted on a newer setup, then the page shows the values recorded, not only those suggested', async () => {
    const handedBack = { id: '5e7e7e7e-0000-4000-8000-0000000000c2', label: 'As handed back', effectiveFrom: '2026-06-20T10:00:00.000Z' };
    const recorded = { id: '5e7e7e7e-0000-4000-8000-0000000000c3', label: 'Shop camber', effectiveFrom: '2026-06-21T08:00:00.000Z' };
    stub(user(), () =>
      suggestion({
        status: 'accepted',
        acceptedSetupId: recorded.id,
        decidedBy: { id: IDS.maren, displayName: 'Maren Holt' },
        decidedAt: '2026-06-21T08:00:00.000Z',
        recorded: {
          setup: recorded,
          from: handedBack,
          preview: [
            { field: 'camberDeg', corner: 'lf', from: -1.8, to: -2.3 },
            { field: 'camberDeg', corner: 'rf', from: -1.8, to: -2.3 },
          ],
        },
      }),
    );
    renderApp(PAGE);

    const done = await screen.findByRole('region', { name: 'What accepting recorded' });
    expect(done.textContent).toContain('Accepted into “Shop camber”');
    expect(done.textContent).toContain('What it holds now:');
    expect(done.textContent).toContain('made from “As handed back”');
    const lf = within(within(done).getByRole('group', { name: 'Camber' })).getByRole('group', { name: 'Left front' });
    expect(lf.textContent).toContain('\u22121.80°');
    expect(lf.textContent).toContain('→ \u22122.30°');
    expect(screen.queryByRole('region', { name: 'What accepting would record now' })).toBeNull();
  });

  it('when a driver declines without a note, then nothing is sent and the note is asked for; with one, the shop gets it', async () => {
    let current = suggestion();
    const fetchMock = stub(user(), () => current, {
      [DECLINE]: ({ body }) => {
        current = suggestion({ status: 'declined', decisionNote: (body as { note: string }).note, decidedBy: { id: IDS.maren, displayName: 'Maren Holt' } });
        return jsonResponse(200, current);
      },
    });
    renderApp(PAGE);
    const u = userEvent.setup();

    await u.click(await within(await screen.findByRole('region', { name: 'Decision' })).findByRole('button', { name: 'Decline' }));
    await u.click(screen.getByRole('button', { name: 'Decline' }));
    expect(await screen.findByText('Say why, so the shop knows')).toBeTruthy();
    expect(screen.getByLabelText('Why not?').getAttribute('aria-invalid')).toBe('true');
    expect(requestsTo(fetchMock, DECLINE)).toHaveLength(0);

    await u.type(screen.getByLabelText('Why not?'), 'Already at the class limit for camber.');
    await u.click(screen.getByRole('button', { name: 'Decline' }));

    expect(await within(decision()).findByText('Already at the class limit for camber.')).toBeTruthy();
    expect(requestsTo(fetchMock, DECLINE)[0]?.body).toEqual({ note: 'Already at the class limit for camber.' });
    expect(within(decision()).getByText(/Declined by Maren Holt/)).toBeTruthy();
  });

  it('when accepting is refused with a field error, then it shows on its field', async () => {
    stub(user(), () => suggestion(), {
      [ACCEPT]: errorResponse(400, 'validation_failed', 'Some fields are not valid.', { effectiveFrom: ['Pick a time after the base setup'] }),
    });
    renderApp(PAGE);
    const u = userEvent.setup();

    await u.click(await within(await screen.findByRole('region', { name: 'Decision' })).findByRole('button', { name: 'Accept' }));
    await u.click(screen.getByRole('button', { name: 'Accept and record the setup' }));

    expect(await screen.findByText('Pick a time after the base setup')).toBeTruthy();
    expect(screen.getByLabelText('Takes effect from').getAttribute('aria-invalid')).toBe('true');
  });

  it('when shop staff open a declined suggestion, then they see the status and the driver’s note, and no accept or decline', async () => {
    stub(staffUser(), () =>
      suggestion({ status: 'declined', decisionNote: 'Already at the class limit.', decidedBy: { id: IDS.maren, displayName: 'Maren Holt' }, decidedAt: '2026-06-08T10:00:00.000Z' }),
    );
    renderApp(PAGE);

    await screen.findByRole('heading', { level: 1, name: 'More front camber' });
    expect(within(decision()).getByText('Declined')).toBeTruthy();
    expect(within(decision()).getByText('Already at the class limit.')).toBeTruthy();
    expect(within(decision()).queryByRole('button', { name: /Accept|Decline/ })).toBeNull();
  });

  it('when a driver of the car opens an open suggestion, then it says it waits for their answer, not for "the car\'s drivers"', async () => {
    stub(user(), () => suggestion());
    renderApp(PAGE);

    await screen.findByRole('heading', { level: 1, name: 'More front camber' });
    await waitFor(() => expect(within(decision()).getByText('Waiting for your answer: accept it or decline it below.')).toBeTruthy());
    expect(within(decision()).queryByText(/drivers have not decided/)).toBeNull();
  });

  it('when shop staff open an open suggestion, then it waits for the drivers and offers them nothing to press', async () => {
    stub(staffUser(), () => suggestion());
    renderApp(PAGE);

    await screen.findByRole('heading', { level: 1, name: 'More front camber' });
    await waitFor(() => expect(within(decision()).getByText('The car’s drivers have not decided yet.')).toBeTruthy());
    expect(within(decision()).queryByRole('button')).toBeNull();
  });
});
