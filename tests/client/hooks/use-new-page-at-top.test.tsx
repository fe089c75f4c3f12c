// @vitest-environment jsdom
import { act, cleanup, render } from '@testing-library/react';
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

/** The reader scrolls the page to `y` (jsdom draws nothing: the position is only a number here). */
function scrollBy(y: number) {
  window.scrollY = y;
  window.dispatchEvent(new Event('scroll'));
}

describe('useNewPageAtTop', () => {
  let scrollTo: ReturnType<typeof vi.fn<(x: number, y: number) => void>>;
  beforeEach(() => {
    scrollTo = vi.fn((_x: number, y: number) => void (window.scrollY = y));
    vi.stubGlobal('scrollTo', scrollTo);
    window.scrollY = 0;
  });
  afterEach(() => {
    cleanup();
    vi.unstubAllGlobals();
  });

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

  it('when the driver goes back, then the page returns to where the driver left it, not to its top', async () => {
    renderAt('/cars/one');
    scrollBy(2500);
    await go('/events');
    expect(window.scrollY).toBe(0);
    scrollBy(300);

    await back();

    expect(window.location.pathname).toBe('/cars/one');
    expect(scrollTo).toHaveBeenLastCalledWith(0, 2500);
    expect(window.scrollY).toBe(2500);
  });

  it('when the driver goes back from another state of the same page (?edit=1), then it returns to where the page was left', async () => {
    renderAt('/cars/one');
    scrollBy(1800);
    await go('/cars/one?edit=1');
    scrollBy(900);

    await back();

    expect(window.location.search).toBe('');
    expect(window.scrollY).toBe(1800);
  });

  it('when the page is still short as the driver goes back, then it is put back once it has grown, unless the driver scrolls first', async () => {
    renderAt('/cars/one');
    scrollBy(2500);
    await go('/events');
    // The car's page comes back short (its data still arriving): the browser stops at 600 at first.
    let height = 600;
    scrollTo.mockImplementation((_x: number, y: number) => void (window.scrollY = Math.min(y, height)));

    await back();
    expect(window.scrollY).toBe(600);
    height = 4000;
    await act(() => new Promise((resolve) => setTimeout(resolve, 100)));
    expect(window.scrollY).toBe(2500);

    // Again, but a key is pressed while the page is still short: the driver's own scrolling wins.
    await go('/events');
    height = 600;
    await back();
    window.dispatchEvent(new KeyboardEvent('keydown', { key: 'PageUp' }));
    height = 4000;
    await act(() => new Promise((resolve) => setTimeout(resolve, 100)));
    expect(window.scrollY).toBe(600);
  });

  it('when the page went to a #target on itself and the driver then taps a link, then the new page still starts at its top', async () => {
    renderAt('/calculators');
    // As a plain <a href="#springs"> does: the browser moves history and fires popstate.
    await act(async () => {
      window.history.pushState(null, '', '/calculators#springs');
      window.dispatchEvent(new PopStateEvent('popstate'));
      await new Promise((resolve) => setTimeout(resolve, 0));
    });
    scrollBy(1800);
    scrollTo.mockClear();

    await go('/settings');

    expect(scrollTo).toHaveBeenCalledExactlyOnceWith(0, 0);
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

  it('when the tab is reloaded and the driver then goes back, then the page before still returns to its place', async () => {
    renderAt('/cars/one');
    scrollBy(2200);
    await go('/events');
    // The reload: the page is put away, and the app starts again with nothing in memory.
    window.dispatchEvent(new Event('pagehide'));
    cleanup();
    vi.resetModules();
    const fresh = await import('@/hooks/use-new-page-at-top');
    function FreshShell() {
      fresh.useNewPageAtTop();
      return null;
    }
    render(<RouterProvider router={createBrowserRouter([{ path: '*', element: <FreshShell /> }])} />);
    window.scrollY = 0;

    await back();

    expect(window.location.pathname).toBe('/cars/one');
    expect(window.scrollY).toBe(2200);
  });
});
