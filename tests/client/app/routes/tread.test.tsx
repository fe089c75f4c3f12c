// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { IMPERIAL_PREFERENCES, METRIC_PREFERENCES, type UnitPreferences } from '../../../../shared/calc/units.calc';
import { blockingEntry, jsonResponse, renderApp, requestsTo, setUpAppTests, stubFetch } from '../../test-utils';
import { CAR, IDS, list, TYRE_SET, user, UUID } from '../../fixtures/season';

setUpAppTests([() => import('@/app/routes/cars/tread')]);

function stub(units: UnitPreferences) {
  return stubFetch({
    'GET /api/auth/session': jsonResponse(200, { user: user(units) }),
    [`GET /api/cars/${IDS.car}`]: jsonResponse(200, CAR),
    [`GET /api/cars/${IDS.car}/tyre-sets`]: list([TYRE_SET]),
  });
}

const changeUnder = (input: HTMLElement) => document.getElementById(input.getAttribute('aria-describedby')!.split(' ')[1]!)!.textContent;

describe('tread entry', () => {
  it('when a depth is typed, then the change since the last reading of that position shows beside it', async () => {
    stub(METRIC_PREFERENCES);
    renderApp(`/cars/${IDS.car}/tread?set=${IDS.tyreSet}`);
    const u = userEvent.setup();

    const inner = await screen.findByLabelText('Left front inner');
    // Before typing: the last reading under the box, in words, not as faint text inside it.
    expect(changeUnder(inner)).toBe('was 6.0');
    expect(inner.getAttribute('placeholder')).toBeNull();
    await u.type(inner, '5.2');
    await u.type(screen.getByLabelText('Left front outer'), '6.6');

    expect(changeUnder(inner)).toBe('▼ 0.8 mm'); // 6.0 → 5.2
    expect(changeUnder(screen.getByLabelText('Left front outer'))).toBe('no change');
    // A position never measured before has nothing to compare with.
    await u.type(screen.getByLabelText('Left rear inner'), '6.9');
    expect(changeUnder(screen.getByLabelText('Left rear inner')).trim()).toBe('');
  });

  it('when a depth is typed well deeper than the last reading of that spot, then the form asks for a second look, naming it, without refusing it', async () => {
    stub(METRIC_PREFERENCES);
    renderApp(`/cars/${IDS.car}/tread?set=${IDS.tyreSet}`);
    const u = userEvent.setup();
    const inner = await screen.findByLabelText('Left front inner');
    // Last 6.0 mm: 6.4 is within a gauge's spot-to-spot variation (0.5 mm, from memory), 6.7 is not.
    await u.type(inner, '6.4');
    expect(screen.queryByText(/Deeper than the last reading/)).toBeNull();
    await u.clear(inner);
    await u.type(inner, '6.7');
    expect(screen.getByText(/^Deeper than the last reading/).textContent).toBe(
      'Deeper than the last reading: left front inner (▲ 0.7 mm). Tread does not grow back; check the gauge, the spot measured and that this is the same set.',
    );
    expect(inner.getAttribute('aria-invalid')).toBeNull();
  });

  it('when a depth at or below the wear bars is typed, then the form says which position in words, not by colour alone', async () => {
    stub(METRIC_PREFERENCES);
    renderApp(`/cars/${IDS.car}/tread?set=${IDS.tyreSet}`);
    const u = userEvent.setup();

    await u.type(await screen.findByLabelText('Left rear outer'), '2.0');
    expect(screen.queryByText(/At or below the wear bars/)).toBeNull();
    await u.clear(screen.getByLabelText('Left rear outer'));
    // Wear bars at 2/32 in, 1.6 mm (FMVSS 109/119; EU minimum 1.6 mm, from memory): 1.2 mm and 1.6 mm are worn to them.
    await u.type(screen.getByLabelText('Left rear outer'), '1.2');
    await u.type(screen.getByLabelText('Right front inner'), '1.6');
    const status = screen.getAllByRole('status').find((el) => el.textContent?.startsWith('At or below the wear bars'))!;
    expect(status.textContent).toContain('At or below the wear bars (1.6 mm)');
    expect(status.textContent).toContain('right front inner (1.6 mm)');
    expect(status.textContent).toContain('left rear outer (1.2 mm)');
  });

  it('when a depth below zero is typed, then it is refused with the range alone, never called worn to the wear bars', async () => {
    stub(METRIC_PREFERENCES);
    renderApp(`/cars/${IDS.car}/tread?set=${IDS.tyreSet}`, { outboxEntries: [blockingEntry()] });
    const u = userEvent.setup();
    Element.prototype.scrollIntoView ??= () => {};

    await u.type(await screen.findByLabelText('Left front inner'), '-2');
    expect(screen.queryByText(/At or below the wear bars/)).toBeNull();
    await u.type(screen.getByLabelText('Left front middle'), '6');
    await u.type(screen.getByLabelText('Left front outer'), '6');
    await u.click(screen.getByRole('button', { name: 'Save tread reading' }));

    expect(await screen.findByText(/Inner: -2 is out of range/)).toBeTruthy();
    expect(screen.queryByText(/At or below the wear bars/)).toBeNull();
  });

  it('when the reading is saved in 1/32 in, then the outbox holds it in mm with a device-made id', async () => {
    stub(IMPERIAL_PREFERENCES);
    const { outbox } = renderApp(`/cars/${IDS.car}/tread`, { outboxEntries: [blockingEntry()] });
    const u = userEvent.setup();

    const inner = await screen.findByLabelText('Left front inner');
    await u.type(inner, '7');
    expect(changeUnder(inner)).toBe('▼ 0.6/32 in'); // 6.0 mm = 7.56/32 in
    await u.type(screen.getByLabelText('Left front middle'), '8');
    await u.type(screen.getByLabelText('Left front outer'), '8');
    await u.click(screen.getByRole('button', { name: 'Save tread reading' }));

    await waitFor(() => expect(outbox.getSnapshot()).toHaveLength(2));
    const entry = outbox.getSnapshot()[1]!;
    expect(entry).toMatchObject({ kind: 'tread.create', method: 'POST', path: `/api/tyre-sets/${IDS.tyreSet}/readings` });
    const body = entry.body as { id: string; corners: Record<string, Record<string, number>> };
    expect(body.id).toMatch(UUID);
    expect(Object.keys(body.corners)).toEqual(['lf']);
    expect(body.corners.lf!.innerMm).toBeCloseTo((7 * 25.4) / 32, 6);
    expect(body.corners.lf!.middleMm).toBeCloseTo(6.35, 6);
  });

  it('when only part of a corner is filled, then the form asks for all three and sends nothing', async () => {
    stub(METRIC_PREFERENCES);
    const { outbox } = renderApp(`/cars/${IDS.car}/tread`);
    const u = userEvent.setup();

    await u.type(await screen.findByLabelText('Right rear middle'), '6');
    await u.click(screen.getByRole('button', { name: 'Save tread reading' }));

    expect(await screen.findByText(/Right rear: enter all three/)).toBeTruthy();
    expect(outbox.getSnapshot()).toHaveLength(0);
  });

  it('when the page opens, then the last reading of each set is listed in full, even after a box of the form is typed in', async () => {
    stub(METRIC_PREFERENCES);
    renderApp(`/cars/${IDS.car}/tread`);
    const u = userEvent.setup();

    const latest = await screen.findByRole('list', { name: 'Latest reading of each set' });
    await u.type(screen.getByLabelText('Left front inner'), '5.2');
    const lf = within(latest).getByRole('group', { name: /Left front/ });
    expect(lf.textContent).toContain('inner 6.0 mm');
    expect(lf.textContent).toContain('outer 6.6 mm');
    expect(within(latest).getByRole('group', { name: /Right front/ }).textContent).toContain('middle 6.4 mm');
    // The rear was not measured at that reading.
    expect(within(latest).getByRole('group', { name: /Left rear/ }).textContent).toContain('Not measured');
  });
});

describe('deleting a reading', () => {
  it('when the latest reading is deleted and the question confirmed, then the server is asked and the reading leaves the list', async () => {
    const readingId = TYRE_SET.latestReading!.id;
    let deleted = false;
    const fetchMock = stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user(METRIC_PREFERENCES) }),
      [`GET /api/cars/${IDS.car}`]: jsonResponse(200, CAR),
      [`GET /api/cars/${IDS.car}/tyre-sets`]: () => list([deleted ? { ...TYRE_SET, latestReading: null } : TYRE_SET]),
      [`DELETE /api/tyre-sets/${IDS.tyreSet}/readings/${readingId}`]: () => {
        deleted = true;
        return new Response(null, { status: 204 });
      },
    });
    renderApp(`/cars/${IDS.car}/tread`);
    const u = userEvent.setup();

    await u.click(await screen.findByRole('button', { name: 'Delete this reading of Set B (2026)' }));
    const dialog = await screen.findByRole('dialog', { name: /^Delete the Set B \(2026\) reading of / });
    await u.click(within(dialog).getByRole('button', { name: 'Delete reading' }));

    await waitFor(() => expect(screen.queryByRole('list', { name: 'Latest reading of each set' })).toBeNull());
    expect(requestsTo(fetchMock, `DELETE /api/tyre-sets/${IDS.tyreSet}/readings/${readingId}`)).toHaveLength(1);
  });
});

describe('tread entry for a car with no tyre set', () => {
  it('when the car has no set, then the page offers to add one there, and its tread boxes follow once it is saved on the phone', async () => {
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user(METRIC_PREFERENCES) }),
      [`GET /api/cars/${IDS.car}`]: jsonResponse(200, CAR),
      [`GET /api/cars/${IDS.car}/tyre-sets`]: list([]),
    });
    const { outbox } = renderApp(`/cars/${IDS.car}/tread`, { outboxEntries: [blockingEntry()] });
    const u = userEvent.setup();

    const form = await screen.findByRole('form', { name: 'New tyre set' });
    expect(screen.getByText(/no tyre set yet/)).toBeTruthy();
    // Nothing to go back to on this page but the car link above.
    expect(within(form).queryByRole('button', { name: 'Cancel' })).toBeNull();
    await u.type(within(form).getByLabelText('Label'), 'Set A (2026)');
    await u.click(within(form).getByRole('button', { name: 'Save tyre set' }));

    expect(await screen.findByLabelText('Left front inner')).toBeTruthy();
    expect(screen.queryByRole('form', { name: 'New tyre set' })).toBeNull();
    expect(outbox.getSnapshot().map((e) => e.kind)).toContain('tyreSet.create');
  });
});

describe('a tread depth out of range', () => {
  it('when 66 is typed for 6.6 and the reading saved, then that box is named with the range, takes the focus, and nothing is stored', async () => {
    stub(METRIC_PREFERENCES);
    const { outbox } = renderApp(`/cars/${IDS.car}/tread?set=${IDS.tyreSet}`, { outboxEntries: [blockingEntry()] });
    const u = userEvent.setup();
    // jsdom has no layout: the focus follows a frame later.
    Element.prototype.scrollIntoView ??= () => {};

    await u.type(await screen.findByLabelText('Right rear inner'), '6.5');
    await u.type(screen.getByLabelText('Right rear middle'), '6.7');
    await u.type(screen.getByLabelText('Right rear outer'), '66');
    await u.click(screen.getByRole('button', { name: 'Save tread reading' }));

    expect(await screen.findByText('Outer: 66 is out of range: enter 0.0 mm to 20.0 mm')).toBeTruthy();
    await waitFor(() => expect(document.activeElement).toBe(screen.getByLabelText('Right rear outer')));
    expect(outbox.getSnapshot().map((e) => e.kind)).toEqual(['change.create']);
  });

  it('when two readings of a corner are wrong, then each message has a line of its own, no change is shown under a refused one, and the banner goes once both are fixed', async () => {
    stub(METRIC_PREFERENCES);
    renderApp(`/cars/${IDS.car}/tread?set=${IDS.tyreSet}`, { outboxEntries: [blockingEntry()] });
    const u = userEvent.setup();
    Element.prototype.scrollIntoView ??= () => {};

    await u.type(await screen.findByLabelText('Left front outer'), 'abc');
    await u.type(screen.getByLabelText('Left front middle'), '40');
    await u.type(screen.getByLabelText('Left front inner'), '6.1');
    await u.click(screen.getByRole('button', { name: 'Save tread reading' }));

    const outer = await screen.findByText('Outer: Type a number');
    const middle = screen.getByText('Middle: 40 is out of range: enter 0.0 mm to 20.0 mm');
    expect(outer.tagName).toBe('LI');
    expect(middle.tagName).toBe('LI');
    expect(outer).not.toBe(middle);
    // The refused 40 has no "▲ 33.6 mm" under it.
    const middleBox = screen.getByLabelText('Left front middle');
    const changeUnder = document.getElementById(middleBox.getAttribute('aria-describedby')!.split(' ')[1]!)!;
    expect(changeUnder.textContent?.trim()).toBe('');
    expect(screen.getByText('Some readings need attention; they are marked above.')).toBeTruthy();

    await u.clear(screen.getByLabelText('Left front outer'));
    await u.type(screen.getByLabelText('Left front outer'), '6.6');
    expect(screen.getByText('Some readings need attention; they are marked above.')).toBeTruthy();
    await u.clear(middleBox);
    await u.type(middleBox, '6.4');
    expect(screen.queryByText('Some readings need attention; they are marked above.')).toBeNull();
  });
});
