/** Every page's address, in one place. */
export const paths = {
  home: '/',
  signIn: '/sign-in',
  register: '/register',
  cars: '/cars',
  events: '/events',
  /** Opens today's event, or the latest one. */
  eventDay: '/event-day',
  settings: '/settings',
  calculators: '/calculators',
  notifications: '/notifications',
  /** Shop staff: the shop's customers and staff. */
  shop: '/shop',
  teams: '/teams',
  /** Admins: every account. */
  accounts: '/accounts',
  forgotPassword: '/forgot-password',
  /** Reached from the e-mailed link: /reset-password?token=… */
  resetPassword: '/reset-password',
  /** Development only: the e-mails the local mail server caught. */
  devMailbox: '/dev/mailbox',
} as const;

/**
 * Addresses of one record's pages that the event-day page or Home link to. Everything here comes with the
 * first download; the pages only reached from a desk are in `record-paths.ts`, loaded with them.
 */
export const pathTo = {
  car: (carId: string) => `/cars/${carId}`,
  newSetup: (carId: string, fromSetupId?: string | null) =>
    `/cars/${carId}/setups/new${fromSetupId ? `?from=${encodeURIComponent(fromSetupId)}` : ''}`,
  event: (eventId: string, carId?: string | null) =>
    `/events/${eventId}${carId ? `?carId=${encodeURIComponent(carId)}` : ''}`,
};

export const NEXT_PARAM = 'next';

// eslint-disable-next-line no-control-regex -- matching control characters is the point
const CONTROL_CHARACTERS = /[\u0000-\u001f\u007f]/;

/**
 * Accepts a "come back here afterwards" address only if it stays inside this app:
 * one leading slash, no scheme, no protocol-relative `//host`, no backslash tricks.
 */
export function safeNextPath(raw: string | null | undefined): string | null {
  if (!raw || !raw.startsWith('/') || raw.startsWith('//') || raw.includes('\\')) return null;
  // Browsers drop tabs and newlines inside addresses, which could turn "/\t/host" into "//host".
  if (CONTROL_CHARACTERS.test(raw)) return null;
  const pathname = raw.split(/[?#]/, 1)[0];
  if (pathname === paths.signIn || pathname === paths.register) return null;
  return raw;
}

/** The sign-in page, remembering where to go back to. */
export function signInPath(next?: string | null): string {
  const safe = safeNextPath(next);
  return safe && safe !== paths.home ? `${paths.signIn}?${NEXT_PARAM}=${encodeURIComponent(safe)}` : paths.signIn;
}

/** The registration page, keeping the same "come back" address. */
export function registerPath(next?: string | null): string {
  const safe = safeNextPath(next);
  return safe && safe !== paths.home ? `${paths.register}?${NEXT_PARAM}=${encodeURIComponent(safe)}` : paths.register;
}
