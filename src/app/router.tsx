import type { ReactNode } from 'react';
import type { QueryClient } from '@tanstack/react-query';
import {
  createBrowserRouter,
  matchRoutes,
  Outlet,
  redirect,
  type LoaderFunctionArgs,
  type PatchRoutesOnNavigationFunction,
  type RouteObject,
} from 'react-router-dom';
import { NEXT_PARAM, paths, safeNextPath, signInPath } from '@/config/paths';
import { RouteError } from '@/components/errors/route-error';
import { LoadingScreen } from '@/components/ui/loading-screen';
import { authKeys } from '@/features/auth/api/auth-keys';
import { meQueryOptions } from '@/features/auth/api/get-me';
import type { MoreRoutesShared } from './more-routes';
import { SignedInLayout } from './routes/signed-in-layout';

/** The layout route that holds every page behind sign-in. */
export const SIGNED_IN_ROUTE_ID = 'signed-in';
/** The pathless route inside it whose children are the signed-in pages. */
const PAGES_ROUTE_ID = 'signed-in-pages';
const ROOT_ROUTE_ID = 'root';

/** Addresses of the pages in more-routes.tsx: only these make the router fetch that list. */
export const MORE_ROUTES_PATH =
  /^\/(shop|teams|accounts|suggestions|work-orders|invoices|setups|invitations|unsubscribe|dev|forgot-password|reset-password|cars\/[^/]+\/(import|suggestions))(\/|$)/;

export type AppRouter = ReturnType<typeof createBrowserRouter>;

function pathOf(url: URL): string {
  return url.pathname + url.search;
}

export interface DeviceState {
  /** Is this event or car still only on the phone (its creation waiting in the outbox)? The server cannot know it yet. */
  waiting: (id: string) => boolean;
  /**
   * Settles once what the device keeps is read: the last answers of the server and the outbox. The router
   * starts before that (opening IndexedDB on a phone's first visit takes a few hundred ms), so the first
   * page's code and the reads that need nothing kept go out meanwhile; what depends on it waits here.
   */
  read: Promise<unknown>;
}

/**
 * The app's routes. Pages are loaded on first visit, so the first download stays small; the
 * pages opened now and then are not even listed until an address asks for one (`discover`).
 */
export function createRoutes(
  queryClient: QueryClient,
  device: DeviceState,
): { routes: RouteObject[]; discover: PatchRoutesOnNavigationFunction } {
  // Asked at once; but with no signal only the answer kept on the device can reply, so that is read first.
  const whoIsSignedIn = async () => {
    void queryClient.prefetchQuery(meQueryOptions());
    await device.read;
    return queryClient.ensureQueryData({ ...meQueryOptions(), revalidateIfStale: true });
  };

  const requireSignIn = async ({ request }: LoaderFunctionArgs) => {
    const me = await whoIsSignedIn();
    if (!me) throw redirect(signInPath(pathOf(new URL(request.url))));
    return null;
  };

  const signedOutOnly = async ({ request }: LoaderFunctionArgs) => {
    const me = await whoIsSignedIn();
    if (me) throw redirect(safeNextPath(new URL(request.url).searchParams.get(NEXT_PARAM)) ?? paths.home);
    return null;
  };

  const loading = <LoadingScreen />;

  return {
    routes: staticRoutes({ queryClient, device, requireSignIn, signedOutOnly, loading }),
    discover: discoverRoutes({ signedOutOnly, loading }),
  };
}

/**
 * Adds the pages of more-routes.tsx the first time an address needs one of them. Every other
 * address (the trackside page above all) is answered at once, without waiting for that list.
 */
function discoverRoutes(shared: MoreRoutesShared): PatchRoutesOnNavigationFunction {
  let added: Promise<void> | null = null;
  return ({ path, patch }) => {
    if (!MORE_ROUTES_PATH.test(path)) return;
    added ??= import('./more-routes').then(
      ({ moreRoutes }) => {
        const more = moreRoutes(shared);
        patch(ROOT_ROUTE_ID, more.root);
        patch(PAGES_ROUTE_ID, more.signedIn);
      },
      (error: unknown) => {
        // No signal: let the next navigation try again.
        added = null;
        throw error;
      },
    );
    return added;
  };
}

function staticRoutes({
  queryClient,
  device,
  requireSignIn,
  signedOutOnly,
  loading,
}: {
  queryClient: QueryClient;
  device: DeviceState;
  requireSignIn: (args: LoaderFunctionArgs) => Promise<null>;
  signedOutOnly: (args: LoaderFunctionArgs) => Promise<null>;
  loading: ReactNode;
}): RouteObject[] {
  return [
    {
      id: ROOT_ROUTE_ID,
      element: <Outlet />,
      errorElement: <RouteError />,
      hydrateFallbackElement: loading,
      children: [
        {
          path: paths.signIn,
          loader: signedOutOnly,
          hydrateFallbackElement: loading,
          lazy: async () => ({ Component: (await import('./routes/sign-in')).SignInPage }),
        },
        {
          path: paths.register,
          loader: signedOutOnly,
          hydrateFallbackElement: loading,
          lazy: async () => ({ Component: (await import('./routes/register')).RegisterPage }),
        },
        {
          id: SIGNED_IN_ROUTE_ID,
          loader: requireSignIn,
          hydrateFallbackElement: loading,
          Component: SignedInLayout,
          children: [
            {
              // A pathless wrapper: a page that fails shows its error inside the shell.
              id: PAGES_ROUTE_ID,
              errorElement: <RouteError variant="in-shell" />,
              children: [
                {
                  index: true,
                  lazy: async () => ({ Component: (await import('./routes/home')).HomePage }),
                },
                {
                  path: paths.eventDay,
                  lazy: async () => ({ Component: (await import('./routes/events/event-day-redirect')).EventDayRedirect }),
                },
                {
                  path: paths.events,
                  lazy: async () => ({ Component: (await import('./routes/events/events')).EventsPage }),
                },
                {
                  // The trackside screen: its own small chunk.
                  path: `${paths.events}/:eventId`,
                  lazy: async () => {
                    const { EventDayPage, eventDayLoader } = await import('./routes/events/event-day');
                    return { Component: EventDayPage, loader: eventDayLoader(queryClient, device) };
                  },
                },
                {
                  path: paths.cars,
                  lazy: async () => ({ Component: (await import('./routes/cars/cars')).CarsPage }),
                },
                {
                  path: `${paths.cars}/:carId`,
                  lazy: async () => ({ Component: (await import('./routes/cars/car')).CarPage }),
                },
                {
                  path: `${paths.cars}/:carId/setups/new`,
                  lazy: async () => ({ Component: (await import('./routes/cars/new-setup')).NewSetupPage }),
                },
                {
                  path: `${paths.cars}/:carId/tread`,
                  lazy: async () => ({ Component: (await import('./routes/cars/tread')).TreadPage }),
                },
                {
                  path: `${paths.cars}/:carId/review`,
                  lazy: async () => ({ Component: (await import('./routes/analysis/season-review')).SeasonReviewPage }),
                },
                {
                  path: paths.calculators,
                  lazy: async () => ({ Component: (await import('./routes/calculators/calculators')).CalculatorsPage }),
                },
                {
                  path: paths.notifications,
                  lazy: async () => ({ Component: (await import('./routes/notifications')).NotificationsPage }),
                },
                {
                  path: paths.settings,
                  lazy: async () => ({ Component: (await import('./routes/settings')).SettingsPage }),
                },
              ],
            },
          ],
        },
        {
          path: '*',
          lazy: async () => ({ Component: (await import('./routes/not-found')).NotFoundPage }),
        },
      ],
    },
  ];
}

export function createAppRouter(queryClient: QueryClient, device: DeviceState): AppRouter {
  const { routes, discover } = createRoutes(queryClient, device);
  return createBrowserRouter(routes, { patchRoutesOnNavigation: discover });
}

/**
 * The session is gone (a 401, or "who am I" answered nobody): mark the user signed out and,
 * if the current page needs sign-in, go to the sign-in page, remembering where we were.
 */
export function sendToSignIn(router: AppRouter, queryClient: QueryClient): void {
  queryClient.setQueryData(authKeys.me(), null);
  // While the first page loads, its own loader decides; but it may have decided on the answer kept on the
  // device just before this one came, so the page is looked at again once it is in.
  if (!router.state.initialized) {
    const stop = router.subscribe(({ initialized }) => {
      if (!initialized) return;
      stop();
      sendToSignIn(router, queryClient);
    });
    return;
  }
  const location = router.state.navigation.location ?? router.state.location;
  const matches = matchRoutes(router.routes, location) ?? [];
  if (!matches.some((match) => match.route.id === SIGNED_IN_ROUTE_ID)) return;
  void router.navigate(signInPath(location.pathname + location.search), { replace: true });
}
