// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { errorResponse, jsonResponse, renderApp, requestsTo, setUpAppTests } from '../../test-utils';
import { stubCarPage } from '../../fixtures/car-page';
import { CAR, coDriverUser, IDS, list, user } from '../../fixtures/season';

const CAR_PAGE = `/cars/${IDS.car}`;

setUpAppTests([() => import('@/app/routes/cars/car')]);

const drivers = () => screen.getByRole('list', { name: 'Drivers' });

describe('co-drivers', () => {
  it('when the owner adds an e-mail no account uses, then the server’s message shows on the e-mail field, not as a toast', async () => {
    const message = 'No account uses that e-mail; ask them to register first';
    const fetchMock = stubCarPage(user(), {
      [`POST /api/cars/${IDS.car}/co-drivers`]: errorResponse(400, 'validation_failed', 'No account uses that e-mail.', { email: [message] }),
    });
    renderApp(CAR_PAGE);
    const u = userEvent.setup();

    const email = await screen.findByLabelText('Co-driver’s e-mail');
    await u.type(email, '  Nobody@Example.test ');
    await u.click(screen.getByRole('button', { name: 'Add co-driver' }));

    const shown = await screen.findByText(message);
    expect(email.getAttribute('aria-invalid')).toBe('true');
    expect(email.getAttribute('aria-describedby')).toContain(shown.id);
    expect(screen.getAllByText(message)).toHaveLength(1);
    expect(screen.queryByText('No account uses that e-mail.')).toBeNull();
    expect(requestsTo(fetchMock, `POST /api/cars/${IDS.car}/co-drivers`)[0]?.body).toEqual({ email: 'nobody@example.test' });
  });

  it('when the owner removes a co-driver and confirms, then the server is asked and the list no longer shows them', async () => {
    let removed = false;
    const fetchMock = stubCarPage(user(), {
      [`GET /api/cars/${IDS.car}`]: () => jsonResponse(200, removed ? { ...CAR, coDrivers: [], version: 2 } : CAR),
      'GET /api/cars': () => list([removed ? { ...CAR, coDrivers: [] } : CAR]),
      [`DELETE /api/cars/${IDS.car}/co-drivers/${IDS.tomas}`]: () => {
        removed = true;
        return jsonResponse(204);
      },
    });
    renderApp(CAR_PAGE);
    const u = userEvent.setup();

    await u.click(await screen.findByRole('button', { name: 'Remove Tomas Reyes' }));
    const dialog = await screen.findByRole('dialog', { name: 'Remove Tomas Reyes?' });
    await u.click(within(dialog).getByRole('button', { name: 'Remove co-driver' }));

    await waitFor(() => expect(within(drivers()).queryByText('Tomas Reyes')).toBeNull());
    expect(requestsTo(fetchMock, `DELETE /api/cars/${IDS.car}/co-drivers/${IDS.tomas}`)).toHaveLength(1);
  });

  it('when the signed-in user is a co-driver, then the drivers are listed without add or remove', async () => {
    stubCarPage(coDriverUser());
    renderApp(CAR_PAGE);

    expect(await screen.findByText('Only the owner, Maren Holt, can add or remove co-drivers.')).toBeTruthy();
    expect(within(drivers()).getByText(/Tomas Reyes/).textContent).toBe('Tomas Reyes (you)');
    expect(screen.queryByLabelText('Co-driver’s e-mail')).toBeNull();
    expect(screen.queryByRole('button', { name: /^Remove/ })).toBeNull();
  });
});
