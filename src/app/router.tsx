import type { QueryClient } from '@tanstack/react-query';
import {
  createBrowserRouter,
  matchRoutes,
  Outlet,
  redirect,
  type LoaderFunctionArgs,
  type RouteObject,
} from 'react-router-dom';
import { NEXT_PARAM, paths, safeNextPath, signInPath } from '@/config/paths';
import { RouteError } from '@/components/errors/route-error';
import { LoadingScreen } from '@/components/ui/loading-screen';
import { authKeys } from '@/features/auth/api/auth-keys';
import { meQueryOptions } from '@/features/auth/api/get-me';
import { SignedInLayout } from './routes/signed-in-layout';

/** The layout route that holds every page behind sign-in. */
export const SIGNED_IN_ROUTE_ID = 'signed-in';

export type AppRouter = ReturnType<typeof createBrowserRouter>;

function pathOf(url: URL): string {
  return url.pathname + url.search;
}

/** The app's routes. Pages are loaded on first visit, so the first download stays small. */
export function createRoutes(queryClient: QueryClient): RouteObject[] {
  const requireSignIn = async ({ request }: LoaderFunctionArgs) => {
    const me = await queryClient.ensureQueryData({ ...meQueryOptions(), revalidateIfStale: true });
    if (!me) throw redirect(signInPath(pathOf(new URL(request.url))));
    return null;
  };

  const signedOutOnly = async ({ request }: LoaderFunctionArgs) => {
    const me = await queryClient.ensureQueryData({ ...meQueryOptions(), revalidateIfStale: true });
    if (me) throw redirect(safeNextPath(new URL(request.url).searchParams.get(NEXT_PARAM)) ?? paths.home);
    return null;
  };

  const loading = <LoadingScreen />;

  return [
    {
      id: 'root',
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
          path: paths.forgotPassword,
          loader: signedOutOnly,
          hydrateFallbackElement: loading,
          lazy: async () => ({ Component: (await import('./routes/account/forgot-password')).ForgotPasswordPage }),
        },
        {
          path: paths.resetPassword,
          hydrateFallbackElement: loading,
          lazy: async () => ({ Component: (await import('./routes/account/reset-password')).ResetPasswordPage }),
        },
        {
          // Works signed in or out: signed out, the page offers sign-in or registration first.
          path: '/invitations/:token',
          hydrateFallbackElement: loading,
          lazy: async () => ({ Component: (await import('./routes/account/invitation')).InvitationPage }),
        },
        {
          path: '/unsubscribe/:token',
          hydrateFallbackElement: loading,
          lazy: async () => ({ Component: (await import('./routes/account/unsubscribe')).UnsubscribePage }),
        },
        {
          path: paths.devMailbox,
          hydrateFallbackElement: loading,
          lazy: async () => ({ Component: (await import('./routes/dev/mailbox')).MailboxPage }),
        },
        {
          id: SIGNED_IN_ROUTE_ID,
          loader: requireSignIn,
          hydrateFallbackElement: loading,
          Component: SignedInLayout,
          children: [
            {
              // A pathless wrapper: a page that fails shows its error inside the shell.
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
                  lazy: async () => ({ Component: (await import('./routes/events/event-day')).EventDayPage }),
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
                  path: paths.shop,
                  lazy: async () => ({ Component: (await import('./routes/shop/shop')).ShopPage }),
                },
                {
                  path: `${paths.shop}/customers/:carId`,
                  lazy: async () => ({ Component: (await import('./routes/shop/customer')).CustomerPage }),
                },
                {
                  path: `${paths.cars}/:carId/suggestions/new`,
                  lazy: async () => ({ Component: (await import('./routes/suggestions/new-suggestion')).NewSuggestionPage }),
                },
                {
                  path: '/suggestions/:suggestionId',
                  lazy: async () => ({ Component: (await import('./routes/suggestions/suggestion')).SuggestionPage }),
                },
                {
                  path: '/work-orders/:workOrderId',
                  lazy: async () => ({ Component: (await import('./routes/work-orders/work-order')).WorkOrderPage }),
                },
                {
                  path: paths.teams,
                  lazy: async () => ({ Component: (await import('./routes/teams/teams')).TeamsPage }),
                },
                {
                  path: `${paths.teams}/:teamId`,
                  lazy: async () => ({ Component: (await import('./routes/teams/team')).TeamPage }),
                },
                {
                  path: `${paths.teams}/:teamId/board`,
                  lazy: async () => ({ Component: (await import('./routes/teams/class-board')).ClassBoardPage }),
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

export function createAppRouter(queryClient: QueryClient): AppRouter {
  return createBrowserRouter(createRoutes(queryClient));
}

/**
 * The session is gone (a 401, or "who am I" answered nobody): mark the user signed out and,
 * if the current page needs sign-in, go to the sign-in page, remembering where we were.
 */
export function sendToSignIn(router: AppRouter, queryClient: QueryClient): void {
  queryClient.setQueryData(authKeys.me(), null);
  // While the first page loads, its own loader decides.
  if (!router.state.initialized) return;
  const location = router.state.navigation.location ?? router.state.location;
  const matches = matchRoutes(router.routes, location) ?? [];
  if (!matches.some((match) => match.route.id === SIGNED_IN_ROUTE_ID)) return;
  void router.navigate(signInPath(location.pathname + location.search), { replace: true });
}
