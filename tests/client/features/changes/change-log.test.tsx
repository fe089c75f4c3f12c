// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { renderApp, setUpAppTests } from '../../test-utils';
import { stubCarPage } from '../../fixtures/car-page';
import { IDS } from '../../fixtures/season';

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
});
