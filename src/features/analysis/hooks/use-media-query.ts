import { useCallback, useSyncExternalStore } from 'react';

/**
 * Whether the window matches a media query, e.g. "(min-width: 48rem)", kept up to date as the window is resized
 * or the phone turned. False where the browser cannot tell (no `matchMedia`), so layouts fall back to the phone's.
 */
export function useMediaQuery(query: string): boolean {
  const subscribe = useCallback(
    (onChange: () => void) => {
      if (typeof window.matchMedia !== 'function') return () => {};
      const list = window.matchMedia(query);
      list.addEventListener('change', onChange);
      return () => list.removeEventListener('change', onChange);
    },
    [query],
  );
  return useSyncExternalStore(
    subscribe,
    () => typeof window.matchMedia === 'function' && window.matchMedia(query).matches,
    () => false,
  );
}
