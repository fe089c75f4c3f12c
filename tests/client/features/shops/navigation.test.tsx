// @vitest-environment jsdom
import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { jsonResponse, renderApp, setUpAppTests, stubFetch } from '../../test-utils';
import { user } from '../../fixtures/season';
import { staffUser } from '../../fixtures/collab';

setUpAppTests([() => import('@/app/routes/settings'), () => import('@/app/routes/events/events'), () => import('@/features/auth/components/account-dropdown')]);

async function openAccountMenu(name: string) {
  const u = userEvent.setup();
  await u.click(await screen.findByRole('button', { name: `Account: ${name}` }));
  return screen.findByRole('menu');
}

describe('reaching the shop and teams', () => {
  it('when the user works for a shop, then the account menu offers their shop and teams', async () => {
    stubFetch({ 'GET /api/auth/session': jsonResponse(200, { user: staffUser() }) });
    renderApp('/settings');

    const menu = await openAccountMenu('Dusty Okonjo');
    expect(within(menu).getByRole('menuitem', { name: 'Your shop' }).getAttribute('href')).toBe('/shop');
    expect(within(menu).getByRole('menuitem', { name: 'Teams' }).getAttribute('href')).toBe('/teams');
  });

  it('when the user is a driver only, then the menu offers teams and no shop, and no accounts', async () => {
    stubFetch({ 'GET /api/auth/session': jsonResponse(200, { user: user() }) });
    renderApp('/settings');

    const menu = await openAccountMenu('Maren Holt');
    expect(within(menu).getByRole('menuitem', { name: 'Teams' })).toBeTruthy();
    expect(within(menu).queryByRole('menuitem', { name: 'Your shop' })).toBeNull();
    expect(within(menu).queryByRole('menuitem', { name: 'Accounts' })).toBeNull();
  });

  it('when the user is an admin, then the menu offers the accounts', async () => {
    stubFetch({ 'GET /api/auth/session': jsonResponse(200, { user: { ...user(), roles: ['driver', 'admin'] } }) });
    renderApp('/settings');

    const menu = await openAccountMenu('Maren Holt');
    expect(within(menu).getByRole('menuitem', { name: 'Accounts' }).getAttribute('href')).toBe('/accounts');
  });

  it('keeps the phone’s bottom bar to five places', async () => {
    stubFetch({ 'GET /api/auth/session': jsonResponse(200, { user: staffUser() }) });
    renderApp('/settings');
    await screen.findByRole('button', { name: 'Account: Dusty Okonjo' });
    const bars = screen.getAllByRole('navigation', { name: 'Main' });
    for (const bar of bars) expect(within(bar).getAllByRole('link')).toHaveLength(5);
  });

  it('when the user works for a shop, then the bars offer the shop where a driver has Settings (which stays in the account menu)', async () => {
    stubFetch({ 'GET /api/auth/session': jsonResponse(200, { user: staffUser() }) });
    renderApp('/settings');
    await screen.findByRole('button', { name: 'Account: Dusty Okonjo' });
    for (const bar of screen.getAllByRole('navigation', { name: 'Main' })) {
      expect(within(bar).getAllByRole('link').map((l) => l.textContent)).toEqual(['Home', 'Event day', 'Cars', 'Calculators', 'Shop']);
      expect(within(bar).getByRole('link', { name: 'Shop' }).getAttribute('href')).toBe('/shop');
    }
  });

  it('when the user is a driver only, then the bars end with Settings and offer no shop', async () => {
    stubFetch({ 'GET /api/auth/session': jsonResponse(200, { user: user() }) });
    renderApp('/settings');
    await screen.findByRole('button', { name: 'Account: Maren Holt' });
    for (const bar of screen.getAllByRole('navigation', { name: 'Main' })) {
      expect(within(bar).getAllByRole('link').map((l) => l.textContent)).toEqual(['Home', 'Event day', 'Cars', 'Calculators', 'Settings']);
    }
  });

  it('when an event\'s pages are open, then both bars mark Event day as the current place, and only it', async () => {
    stubFetch({ 'GET /api/auth/session': jsonResponse(200, { user: user() }), 'GET /api/events': jsonResponse(200, { items: [], count: 0 }) });
    renderApp('/events');
    await screen.findByRole('heading', { name: 'Events' });
    for (const bar of screen.getAllByRole('navigation', { name: 'Main' })) {
      // The current place is drawn in the link colour; the others are muted.
      const marked = within(bar)
        .getAllByRole('link')
        .filter((link) => link.className.split(' ').includes('text-link'));
      expect(marked.map((link) => link.textContent)).toEqual(['Event day']);
    }
  });
});
