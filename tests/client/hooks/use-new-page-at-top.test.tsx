// @vitest-environment jsdom
import { act, render } from '@testing-library/react';
import { createBrowserRouter, RouterProvider, type NavigateFunction, type NavigateOptions, useNavigate } from 'react-router-dom';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { useNewPageAtTop } from '@/hooks/use-new-page-at-top';

let navigate: NavigateFunction;

function Shell() {
  useNewPageAtTop();
  navigate = useNavigate();
  return null;
}

function renderAt(path: string) {
  window.history.replaceState(null, '', path);
  const router = createBrowserRouter([{ path: '*', element: <Shell /> }]);
  render(<RouterProvider router={router} />);
}

const go = (to: string, options?: NavigateOptions) => act(async () => void (await navigate(to, options)));
/** The browser's own back, as the phone's back gesture: history moves first, then `popstate` reaches the router. */
const back = () =>
  act(async () => {
    const travelled = new Promise((resolve) => window.addEventListener('popstate', resolve, { once: true }));
    window.history.back();
    await travelled;
    await new Promise((resolve) => setTimeout(resolve, 0));
  });

describe('useNewPageAtTop', () => {
  let scrollTo: ReturnType<typeof vi.fn>;
  beforeEach(() => {
    scrollTo = vi.fn();
    vi.stubGlobal('scrollTo', scrollTo);
  });
  afterEach(() => vi.unstubAllGlobals());

  it('when the shell first shows a page, then it leaves the scroll alone (the driver may already have scrolled)', () => {
    renderAt('/cars/one');

    expect(scrollTo).not.toHaveBeenCalled();
  });

  it('when a link opens another page, then the new page starts at its top', async () => {
    renderAt('/cars/one');

    await go('/events');

    expect(scrollTo).toHaveBeenCalledExactlyOnceWith(0, 0);
  });

  it('when a redirect replaces the page, then the new page starts at its top too', async () => {
    renderAt('/cars/one');

    await go('/shop/customers/one', { replace: true });

    expect(scrollTo).toHaveBeenCalledExactlyOnceWith(0, 0);
  });

  it('when the driver goes back, then the browser is left to put the page where it was', async () => {
    renderAt('/cars/one');
    await go('/events');
    scrollTo.mockClear();

    await back();

    expect(window.location.pathname).toBe('/cars/one');
    expect(scrollTo).not.toHaveBeenCalled();
  });

  it('when the driver goes back and then taps a link, then the linked page starts at its top', async () => {
    renderAt('/cars/one');
    await go('/events');
    await back();
    scrollTo.mockClear();

    await go('/calculators');

    expect(scrollTo).toHaveBeenCalledExactlyOnceWith(0, 0);
  });

  it('when the address names a #target, then the page is left to scroll to it', async () => {
    renderAt('/cars/one/setups/new');

    await go('/cars/one#setup-abc');

    expect(scrollTo).not.toHaveBeenCalled();
  });

  it('when only the query or the hash changes on the same page, then the scroll stays where it is', async () => {
    renderAt('/cars/one');

    await go('/cars/one?comments=abc');
    await go('/cars/one#setup-abc');
    await go('/cars/one');

    expect(scrollTo).not.toHaveBeenCalled();
  });
});
