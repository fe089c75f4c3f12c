// @vitest-environment jsdom
import { cleanup, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeAll, beforeEach, describe, expect, it, vi } from 'vitest';
import { dropCsrfToken } from '@/lib/api-client';
import { clearToasts } from '@/lib/toast-store';
import { clearTestOutboxes, jsonResponse, renderApp, stubFetch } from '../../test-utils';
import { user } from '../../fixtures/season';
import { staffUser } from '../../fixtures/collab';

beforeAll(async () => {
  await import('@/app/routes/settings');
  await import('@/features/auth/components/account-dropdown');
}, 30_000);
beforeEach(() => dropCsrfToken());
afterEach(async () => {
  await clearTestOutboxes();
  cleanup();
  clearToasts();
  vi.unstubAllGlobals();
});

async function openAccountMenu(name: string) {
  const u = userEvent.setup();
  await u.click(await screen.findByRole('button', { name: `Account: ${name}` }));
  return screen.findByRole('menu');
}

describe('reaching the shop and teams', () => {
  it('when the user works for a shop, then the account menu offers their shop and teams', async () => {
    stubFetch({ 'GET /api/auth/me': jsonResponse(200, { user: staffUser() }) });
    renderApp('/settings');

    const menu = await openAccountMenu('Dusty Okonjo');
    expect(within(menu).getByRole('menuitem', { name: 'Your shop' }).getAttribute('href')).toBe('/shop');
    expect(within(menu).getByRole('menuitem', { name: 'Teams' }).getAttribute('href')).toBe('/teams');
  });

  it('when the user is a driver only, then the menu offers teams and no shop', async () => {
    stubFetch({ 'GET /api/auth/me': jsonResponse(200, { user: user() }) });
    renderApp('/settings');

    const menu = await openAccountMenu('Maren Holt');
    expect(within(menu).getByRole('menuitem', { name: 'Teams' })).toBeTruthy();
    expect(within(menu).queryByRole('menuitem', { name: 'Your shop' })).toBeNull();
  });

  it('keeps the phone’s bottom bar to five places', async () => {
    stubFetch({ 'GET /api/auth/me': jsonResponse(200, { user: staffUser() }) });
    renderApp('/settings');
    await screen.findByRole('button', { name: 'Account: Dusty Okonjo' });
    const bars = screen.getAllByRole('navigation', { name: 'Main' });
    for (const bar of bars) expect(within(bar).getAllByRole('link')).toHaveLength(5);
  });
});
