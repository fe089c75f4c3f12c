import { Router } from 'express';

/** Placeholder: the development mailbox, filled in with the mail feature. */
export function mailboxRoutes(_dir: string) {
  return Router();
}
