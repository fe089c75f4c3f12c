/*
 * How a person's name is shown. Kept apart from the account schemas, so that the trackside page can use it
 * without loading them.
 */

/** What a closed account is called wherever its old records still name it (server/auth/close-account.ts). */
export const CLOSED_ACCOUNT_NAME = 'Closed account';

/**
 * The name where space is short ("Maren’s best"): the first word of the display name, but a closed account's
 * whole stand-in, since "Closed’s best" would read as someone called Closed.
 */
export const shortName = (displayName: string): string =>
  displayName === CLOSED_ACCOUNT_NAME ? displayName : (displayName.split(' ')[0] ?? displayName);
