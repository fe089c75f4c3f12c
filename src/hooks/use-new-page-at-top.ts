import { useEffect, useLayoutEffect, useRef } from 'react';
import { useLocation } from 'react-router-dom';

/** Where the places are kept over a reload of the tab (sessionStorage lasts as long as the tab). */
const STORE_KEY = 'scrubline.scroll-places';

/** The newest places kept; a long session's older entries are let go. */
const KEPT = 50;

function readPlaces(): Map<string, number> {
  try {
    const stored: unknown = JSON.parse(sessionStorage.getItem(STORE_KEY) ?? '[]');
    return new Map(Array.isArray(stored) ? stored.filter((e): e is [string, number] => typeof e?.[0] === 'string' && typeof e?.[1] === 'number') : []);
  } catch {
    return new Map();
  }
}

/** Where the reader left each page of this tab's history, by the history entry's key. */
const leftAt = readPlaces();

/** The reader is at `y` on the entry `key`: the newest place goes last, and the oldest beyond KEPT are let go. */
function rememberPlace(key: string, y: number) {
  leftAt.delete(key);
  leftAt.set(key, y);
  for (const oldest of leftAt.keys()) {
    if (leftAt.size <= KEPT) break;
    leftAt.delete(oldest);
  }
}

function keepPlaces() {
  try {
    sessionStorage.setItem(STORE_KEY, JSON.stringify([...leftAt]));
  } catch {
    // Storage full or refused: the places last until the tab reloads.
  }
}

/** How long a page drawn bit by bit (its data arriving) is given to grow back to where the reader was. */
const RESTORE_FOR_MS = 1500;

/** What the reader does to scroll by hand: any of them ends a restore in progress. */
const READER_MOVES = ['touchstart', 'wheel', 'keydown', 'pointerdown'] as const;

/**
 * Puts the page back where the reader left it once it is tall enough again: on going back, the page is drawn
 * afresh and may be short for a moment, and a position set then would be cut short. Stops as soon as the reader
 * touches, scrolls or presses a key.
 */
function scrollBackTo(y: number): () => void {
  const until = performance.now() + RESTORE_FOR_MS;
  let frame = 0;
  const stop = () => {
    cancelAnimationFrame(frame);
    for (const move of READER_MOVES) window.removeEventListener(move, stop);
  };
  const step = () => {
    window.scrollTo(0, y);
    if (Math.abs(window.scrollY - y) <= 1 || performance.now() > until) stop();
    else frame = requestAnimationFrame(step);
  };
  for (const move of READER_MOVES) window.addEventListener(move, stop, { passive: true });
  step();
  return stop;
}

/**
 * A page opened by a link or a redirect starts at its top, as one the browser loads itself does; without this,
 * a phone kept the last page's scroll and opened the next page half-way down it. Going back or forward (the
 * browser's `popstate` to the entry now shown) returns the page to where the reader left it, kept for this tab
 * over a reload too, and an address
 * with a `#target` is left to the page, which scrolls to its target. Runs before the page's own effects, so it
 * never undoes a scroll they make.
 */
export function useNewPageAtTop() {
  const location = useLocation();
  const shown = useRef(location.pathname);
  const current = useRef(location.key);
  /** The address a `popstate` (back, forward) went to; a link's navigation has none. */
  const travelledTo = useRef<string | null>(null);

  useEffect(() => {
    // The browser's own restoring comes before the page is drawn again, and lands short on a long page.
    window.history.scrollRestoration = 'manual';
    const onTravel = () => void (travelledTo.current = window.location.pathname + window.location.search + window.location.hash);
    const onScroll = () => rememberPlace(current.current, window.scrollY);
    window.addEventListener('popstate', onTravel);
    window.addEventListener('scroll', onScroll, { passive: true });
    // A reload (or the tab put away) keeps the places for Back afterwards.
    window.addEventListener('pagehide', keepPlaces);
    return () => {
      window.removeEventListener('popstate', onTravel);
      window.removeEventListener('scroll', onScroll);
      window.removeEventListener('pagehide', keepPlaces);
    };
  }, []);

  useLayoutEffect(() => {
    const here = location.pathname + location.search + location.hash;
    const back = travelledTo.current === here;
    travelledTo.current = null;
    current.current = location.key;
    const pageChanged = shown.current !== location.pathname;
    shown.current = location.pathname;
    // Back to an entry whose place is known, the same page in another state (?edit=1) included; an entry never
    // scrolled here (a #target the browser jumped to) is left to the browser.
    const left = back ? leftAt.get(location.key) : undefined;
    if (left !== undefined) return scrollBackTo(left);
    if (pageChanged && !back && !location.hash) window.scrollTo(0, 0);
  }, [location]);
}
