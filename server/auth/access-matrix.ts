/**
 * Who may do what: one table of relation × resource × action. The access functions in
 * access.ts work out a user's relations to a record and ask `allows`; nothing else
 * decides access.
 *
 * Relations are always relative to one record: the same person is `owner` of their own
 * car and nothing to someone else's. Staff of a shop act under the shop's one shared
 * role (`shop_staff`); a shop admin is staff who may also invite and remove staff.
 */
export const RELATIONS = [
  'owner', 'co_driver', 'shop_staff', 'shop_admin', 'team_member', 'team_captain', 'author', 'recipient', 'admin', 'signed_in',
] as const;
export type Relation = (typeof RELATIONS)[number];

export const ACCESS_MATRIX = {
  /** A car and its season: setups, runs, tyres, changes, analysis. */
  car: {
    read: ['owner', 'co_driver', 'shop_staff'],
    write: ['owner', 'co_driver'],
    manage: ['owner'],
    comment: ['owner', 'co_driver', 'shop_staff'],
    suggest: ['shop_staff'],
    decide: ['owner', 'co_driver'],
    /** Open a service visit (work order) on the car. */
    service: ['shop_staff'],
  },
  /**
   * A shop's service visit on a car. `shop_staff` here means staff of the visit's own shop;
   * editing also needs that shop to hold a grant on the car still.
   */
  work_order: {
    read: ['owner', 'co_driver', 'shop_staff'],
    edit: ['shop_staff'],
    comment: ['owner', 'co_driver', 'shop_staff'],
    pay: ['owner', 'co_driver'],
    mark_paid: ['shop_staff'],
  },
  /** A comment already written. Reading it is reading its car. */
  comment: {
    edit: ['author'],
    delete: ['author'],
  },
  notification: {
    read: ['recipient'],
  },
  shop: {
    read: ['shop_staff', 'shop_admin'],
    manage: ['shop_admin'],
    /** Anyone signed in may open a shop (becoming its admin) or list shops to grant one. */
    create: ['signed_in'],
    list: ['signed_in'],
  },
  team: {
    read: ['team_member', 'team_captain'],
    enter: ['team_member', 'team_captain'],
    manage: ['team_captain'],
    create: ['signed_in'],
  },
  /** Accounts and their roles. */
  users: {
    manage: ['admin'],
  },
} as const satisfies Record<string, Record<string, readonly Relation[]>>;

export type Resource = keyof typeof ACCESS_MATRIX;

export function allows<R extends Resource>(resource: R, action: keyof (typeof ACCESS_MATRIX)[R], relation: Relation): boolean {
  return (ACCESS_MATRIX[resource][action] as readonly Relation[]).includes(relation);
}

/** What a route needs before its handler runs: nobody, a session, or a record-level check. */
export type RouteNeed =
  | 'public'
  | 'signed_in'
  | 'signed_out'
  | 'dev_only'
  | `${Resource}.${string}`;

/**
 * Every API route and the check that guards it. The authorization test walks the app's
 * real routes: a route missing here fails it, so a new route cannot ship unreviewed.
 */
export const ROUTE_ACCESS: Record<string, RouteNeed> = {
  'GET /api/health': 'public',

  'GET /api/auth/csrf': 'public',
  'POST /api/auth/register': 'public',
  'POST /api/auth/login': 'public',
  'POST /api/auth/logout': 'public',
  'GET /api/auth/me': 'signed_in',
  'GET /api/auth/session': 'public',
  'PATCH /api/auth/me/preferences': 'signed_in',
  'POST /api/auth/me/password': 'signed_in',
  'GET /api/auth/me/email': 'signed_in',
  'POST /api/auth/me/email': 'signed_in',
  'POST /api/auth/me/close': 'signed_in',
  'GET /api/auth/me/export.json': 'signed_in',
  'POST /api/auth/me/email/confirm': 'signed_in',
  'GET /api/auth/me/sessions': 'signed_in',
  'POST /api/auth/me/sessions/end': 'signed_in',
  'POST /api/auth/password-reset': 'public',
  'POST /api/auth/password-reset/confirm': 'public',

  'GET /api/admin/users': 'users.manage',
  'POST /api/admin/users/:userId/suspend': 'users.manage',
  'POST /api/admin/users/:userId/restore': 'users.manage',
  'POST /api/admin/users/:userId/close': 'users.manage',
  'PUT /api/admin/users/:userId/admin': 'users.manage',

  'POST /api/cars': 'signed_in',
  'GET /api/cars': 'signed_in',
  'GET /api/cars/:carId': 'car.read',
  'PATCH /api/cars/:carId': 'car.manage',
  'DELETE /api/cars/:carId': 'car.manage',
  'POST /api/cars/:carId/co-drivers': 'car.manage',
  'DELETE /api/cars/:carId/co-drivers/:userId': 'car.read',
  'GET /api/cars/:carId/shop-grants': 'car.read',
  'POST /api/cars/:carId/shop-grants': 'car.manage',
  'DELETE /api/cars/:carId/shop-grants/:shopId': 'car.manage',

  'POST /api/cars/:carId/setups': 'car.write',
  'GET /api/cars/:carId/setups': 'car.read',
  'POST /api/cars/:carId/setups/quick-change': 'car.write',
  'GET /api/setups/:setupId': 'car.read',
  'PATCH /api/setups/:setupId': 'car.write',
  'DELETE /api/setups/:setupId': 'car.write',
  'GET /api/setups/:setupId/runs': 'car.read',
  'GET /api/setups/:a/diff/:b': 'car.read',

  'POST /api/cars/:carId/changes': 'car.write',
  'GET /api/cars/:carId/changes': 'car.read',
  'DELETE /api/cars/:carId/changes/:changeId': 'car.write',

  'GET /api/cars/:carId/tyre-sets': 'car.read',
  'POST /api/cars/:carId/tyre-sets': 'car.write',
  'GET /api/cars/:carId/pressures': 'car.read',
  'POST /api/cars/:carId/pressures': 'car.write',
  'GET /api/tyre-sets/:tyreSetId/readings': 'car.read',
  'POST /api/tyre-sets/:tyreSetId/readings': 'car.write',
  'DELETE /api/tyre-sets/:tyreSetId/readings/:readingId': 'car.write',
  'POST /api/tyre-sets/:tyreSetId/mountings': 'car.write',

  'GET /api/cars/:carId/analysis/scatter': 'car.read',
  'GET /api/cars/:carId/analysis/compare': 'car.read',
  'GET /api/cars/:carId/season': 'car.read',

  'POST /api/events': 'signed_in',
  'GET /api/events': 'signed_in',
  'GET /api/events/:eventId': 'car.read',
  'GET /api/events/:eventId/summary': 'car.read',

  'POST /api/runs': 'car.write',
  'GET /api/runs': 'signed_in',
  'GET /api/runs/:runId': 'car.read',
  'PATCH /api/runs/:runId': 'car.write',
  'DELETE /api/runs/:runId': 'car.write',

  'GET /api/comments': 'car.read',
  'POST /api/comments': 'car.comment',
  'PATCH /api/comments/:commentId': 'comment.edit',
  'DELETE /api/comments/:commentId': 'comment.delete',

  'GET /api/notifications': 'notification.read',
  'GET /api/notifications/unread-count': 'notification.read',
  'POST /api/notifications/read': 'notification.read',

  'GET /api/cars/:carId/suggestions': 'car.read',
  'POST /api/cars/:carId/suggestions': 'car.suggest',
  'GET /api/suggestions/waiting': 'signed_in',
  'GET /api/suggestions/:suggestionId': 'car.read',
  'POST /api/suggestions/:suggestionId/accept': 'car.decide',
  'POST /api/suggestions/:suggestionId/decline': 'car.decide',

  'GET /api/shops': 'shop.list',
  'POST /api/shops': 'shop.create',
  'GET /api/shops/mine': 'signed_in',
  'GET /api/shops/:shopId': 'shop.read',
  'GET /api/shops/:shopId/customers': 'shop.read',
  'POST /api/shops/:shopId/invitations': 'shop.manage',
  'DELETE /api/shops/:shopId/staff/:userId': 'shop.manage',

  'POST /api/teams': 'team.create',
  'GET /api/teams/mine': 'signed_in',
  'GET /api/teams/:teamId': 'team.read',
  'POST /api/teams/:teamId/invitations': 'team.manage',
  'PATCH /api/teams/:teamId/members/:userId': 'team.manage',
  'DELETE /api/teams/:teamId/members/:userId': 'team.read',
  'POST /api/teams/:teamId/entries': 'team.enter',
  'PATCH /api/teams/:teamId/entries/:carId': 'team.enter',
  'DELETE /api/teams/:teamId/entries/:carId': 'team.enter',
  'GET /api/teams/:teamId/factors': 'team.read',
  'PUT /api/teams/:teamId/factors': 'team.manage',
  'GET /api/teams/:teamId/board': 'team.read',

  // Service visits (work orders)
  'POST /api/cars/:carId/work-orders': 'car.service',
  'GET /api/cars/:carId/work-orders': 'car.read',
  'GET /api/shops/:shopId/work-orders': 'shop.read',
  'GET /api/work-orders/:workOrderId': 'work_order.read',
  'PATCH /api/work-orders/:workOrderId': 'work_order.edit',
  'PUT /api/work-orders/:workOrderId/lines': 'work_order.edit',
  'PUT /api/work-orders/:workOrderId/measurements/:stage': 'work_order.edit',
  'PUT /api/work-orders/:workOrderId/build-sheet': 'work_order.edit',
  'POST /api/work-orders/:workOrderId/close': 'work_order.edit',

  // Invoices and payment
  'PATCH /api/shops/:shopId/settings': 'shop.manage',
  'POST /api/work-orders/:workOrderId/invoice': 'work_order.mark_paid',
  'GET /api/work-orders/:workOrderId/invoice': 'work_order.read',
  /** Its visit's rule; the shop's staff also keep reading it once the visit is gone. */
  'GET /api/invoices/:invoiceId': 'work_order.read',
  'GET /api/shops/:shopId/invoices': 'shop.read',
  'POST /api/invoices/:invoiceId/checkout': 'work_order.pay',
  'POST /api/invoices/:invoiceId/mark-paid': 'work_order.mark_paid',
  /** The payment service's signed events: no session; the signature is the check. */
  'POST /api/payments/webhook': 'public',

  'GET /api/invitations/:token': 'public',
  'POST /api/invitations/:token/accept': 'signed_in',
  'POST /api/unsubscribe/:token': 'public',

  // Timing-sheet import: runs for one car (car write) at an event the user can see.
  'POST /api/events/:eventId/imports': 'car.write',

  // Season export (anyone who reads the car, its granted shop too) and re-import into a new car of one's own.
  'GET /api/cars/:carId/export.csv': 'car.read',
  'GET /api/cars/:carId/export.json': 'car.read',
  'POST /api/cars/import': 'signed_in',

  // Uploads: files on a tread reading, run or setup follow the car (drivers add, its shop reads);
  // an event's files, whoever sees the event. Deleting: the uploader or the owner/creator (checked in the service).
  'POST /api/attachments': 'car.write',
  'GET /api/attachments': 'car.read',
  'GET /api/attachments/:attachmentId/file': 'car.read',
  'GET /api/attachments/:attachmentId/thumbnail': 'car.read',
  'DELETE /api/attachments/:attachmentId': 'car.read',

  'GET /api/dev/mailbox': 'dev_only',
  'DELETE /api/dev/mailbox': 'dev_only',
};
