// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import type { ChangeLogEntry } from '@shared/season/change-log.schema';
import { renderApp, requestsTo, setUpAppTests } from '../../test-utils';
import { stubCarPage } from '../../fixtures/car-page';
import { IDS, list, user } from '../../fixtures/season';

setUpAppTests([() => import('@/app/routes/cars/car')]);

describe('the change log', () => {
  it('when its date picker is cleared and the entry saved, then the date says "Pick a date", not the API\'s format or years, and nothing is queued', async () => {
    stubCarPage();
    const { outbox } = renderApp(`/cars/${IDS.car}`);
    const u = userEvent.setup();

    const form = await screen.findByRole('form', { name: 'Add to the change log' });
    await u.type(within(form).getByLabelText(/What changed/i), 'Fitted camber arms');
    await u.clear(within(form).getByLabelText('Date'));
    await u.click(within(form).getByRole('button', { name: /Add|Save/ }));

    const date = within(form).getByLabelText('Date');
    await waitFor(() => expect(date.getAttribute('aria-invalid')).toBe('true'));
    expect(within(form).getByText('Pick a date')).toBeTruthy();
    expect(within(form).queryByText(/year|2026-06-12/)).toBeNull();
    expect(outbox.getSnapshot()).toHaveLength(0);
  });

  it('when a saved entry is deleted and the question confirmed, then the server is asked and the log no longer lists it', async () => {
    const entry = (id: string, what: string): ChangeLogEntry => ({
      id, carId: IDS.car, changedOn: '2026-05-01', what, location: 'front', notes: null, setupId: null, fromVisit: false,
      createdBy: { id: IDS.maren, displayName: 'Maren Holt' }, createdAt: '2026-05-01T10:00:00.000Z',
    });
    const arms = entry('d1111111-1111-4111-8111-111111111111', 'Fitted camber arms');
    const typo = entry('d2222222-2222-4222-8222-222222222222', 'Fitted camber arms (wrong car)');
    let deleted = false;
    const fetchMock = stubCarPage(user(), {
      [`GET /api/cars/${IDS.car}/changes`]: () => list(deleted ? [arms] : [arms, typo]),
      [`DELETE /api/cars/${IDS.car}/changes/${typo.id}`]: () => {
        deleted = true;
        return new Response(null, { status: 204 });
      },
    });
    renderApp(`/cars/${IDS.car}`);
    const u = userEvent.setup();

    await u.click(await screen.findByRole('button', { name: 'Delete “Fitted camber arms (wrong car)”' }));
    const dialog = await screen.findByRole('dialog', { name: 'Delete “Fitted camber arms (wrong car)” from the log?' });
    await u.click(within(dialog).getByRole('button', { name: 'Delete entry' }));

    await waitFor(() => expect(screen.queryByText('Fitted camber arms (wrong car)')).toBeNull());
    expect(screen.getByText('Fitted camber arms')).toBeTruthy();
    expect(requestsTo(fetchMock, `DELETE /api/cars/${IDS.car}/changes/${typo.id}`)).toHaveLength(1);
  });

  it('when the entry came with a shop’s handover, then it offers no Delete and says where it came from', async () => {
    const handover: ChangeLogEntry = {
      id: 'd3333333-3333-4333-8333-333333333333', carId: IDS.car, changedOn: '2026-05-01', what: 'Aligned and corner-balanced', location: 'car',
      notes: null, setupId: null, fromVisit: true, createdBy: { id: IDS.maren, displayName: 'Dusty Okonjo' }, createdAt: '2026-05-01T10:00:00.000Z',
    };
    stubCarPage(user(), { [`GET /api/cars/${IDS.car}/changes`]: list([handover]) });
    renderApp(`/cars/${IDS.car}`);

    const row = (await screen.findByText('Aligned and corner-balanced')).closest('li')!;
    expect(within(row).getByText('From a shop visit')).toBeTruthy();
    expect(within(row).queryByRole('button', { name: /Delete/ })).toBeNull();
  });
});
