import { redirect, type LoaderFunction, type RouteObject } from 'react-router-dom';
import type { ReactNode } from 'react';
import { paths } from '@/config/paths';

/**
 * Pages most people open now and then: the shop's and the team's, suggestions, work orders and invoices, the admin's accounts,
 * the printable setup sheet, the timing-sheet import, and the pages reached from an e-mail.
 * The router learns of them only when the address asks for one (see `discoverRoutes` in
 * router.tsx), so their entries stay out of the first download that the trackside page needs.
 */
/** What these routes share with the rest: the signed-out check and the loading screen. */
export interface MoreRoutesShared {
  signedOutOnly: LoaderFunction;
  loading: ReactNode;
}

export function moreRoutes({ signedOutOnly, loading }: MoreRoutesShared): {
  /** Children of the root: reachable signed in or out. */
  root: RouteObject[];
  /** Children of the signed-in shell. */
  signedIn: RouteObject[];
} {
  return {
    root: [
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
    ],
    signedIn: [
      {
        path: paths.shop,
        lazy: async () => ({ Component: (await import('./routes/shop/shop')).ShopPage }),
      },
      {
        path: `${paths.shop}/customers/:carId`,
        lazy: async () => ({ Component: (await import('./routes/shop/customer')).CustomerPage }),
      },
      {
        path: `${paths.shop}/customers/:carId/suggestions/new`,
        lazy: async () => ({ Component: (await import('./routes/suggestions/new-suggestion')).NewSuggestionPage }),
      },
      {
        // The form's earlier address, kept for links already sent or bookmarked: on to the shop's.
        path: `${paths.cars}/:carId/suggestions/new`,
        loader: ({ params, request }) => redirect(`${paths.shop}/customers/${params.carId ?? ''}/suggestions/new${new URL(request.url).search}`),
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
        // An invoice on a page of its own, to print; the shop's record, kept after its visit is gone.
        path: '/invoices/:invoiceId',
        lazy: async () => ({ Component: (await import('./routes/invoices/invoice')).InvoicePage }),
      },
      {
        path: paths.teams,
        lazy: async () => ({ Component: (await import('./routes/teams/teams')).TeamsPage }),
      },
      {
        path: paths.accounts,
        lazy: async () => ({ Component: (await import('./routes/admin/accounts')).AccountsPage }),
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
        // Season export: one setup snapshot as a printable sheet.
        path: '/setups/:setupId/sheet',
        lazy: async () => ({ Component: (await import('./routes/setups/setup-sheet')).SetupSheetPage }),
      },
      {
        // Timing-sheet import
        path: `${paths.cars}/:carId/import`,
        lazy: async () => ({ Component: (await import('./routes/cars/import-results')).ImportResultsPage }),
      },
    ],
  };
}
