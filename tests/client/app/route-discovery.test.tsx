// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import type { RouteObject } from 'react-router-dom';
import { QueryClient } from '@tanstack/react-query';
import { createRoutes, MORE_ROUTES_PATH } from '@/app/router';
import { moreRoutes } from '@/app/more-routes';

/** Every path in a route tree, parents joined to children; params filled with a sample value. */
function addresses(routes: readonly RouteObject[], parent = ''): string[] {
  return routes.flatMap((r) => {
    const here = r.path === undefined ? parent : r.path.startsWith('/') ? r.path : `${parent}/${r.path}`;
    const own = r.path !== undefined && r.path !== '*' ? [here.replace(/:[^/]+/g, 'a1b2')] : [];
    return [...own, ...addresses(r.children ?? [], here)];
  });
}

describe('pages added on demand', () => {
  const more = moreRoutes({ signedOutOnly: () => null, loading: null });
  const { routes } = createRoutes(new QueryClient(), { waiting: () => false, read: Promise.resolve() });

  it('when an address of a page in more-routes.tsx is opened, then the router is told to fetch that list', () => {
    const wanted = addresses([...more.root, ...more.signedIn]);
    expect(wanted.length).toBeGreaterThanOrEqual(10);
    for (const address of wanted) expect(MORE_ROUTES_PATH.test(address), address).toBe(true);
  });

  it('when any page of the first list is opened (the trackside page among them), then nothing more is fetched first', () => {
    const first = addresses(routes);
    expect(first).toContain('/events/a1b2');
    for (const address of first) expect(MORE_ROUTES_PATH.test(address), address).toBe(false);
  });
});
