import { useEffect, useLayoutEffect, useRef } from 'react';
import { useLocation } from 'react-router-dom';

/**
 * A page opened by a link or a redirect starts at its top, as one the browser loads itself does; without this,
 * a phone kept the last page's scroll and opened the next page half-way down it. Going back or forward (the
 * browser's `popstate`) is left to the browser, which puts the page where it was, and an address with a
 * `#target` to the page, which scrolls to its target. Runs before the page's own effects, so it never undoes a
 * scroll they make.
 */
export function useNewPageAtTop() {
  const location = useLocation();
  const shown = useRef(location.pathname);
  const travelled = useRef(false);

  useEffect(() => {
    const onTravel = () => void (travelled.current = true);
    window.addEventListener('popstate', onTravel);
    return () => window.removeEventListener('popstate', onTravel);
  }, []);

  useLayoutEffect(() => {
    const back = travelled.current;
    travelled.current = false;
    if (shown.current === location.pathname) return;
    shown.current = location.pathname;
    if (!back && !location.hash) window.scrollTo(0, 0);
  }, [location]);
}
