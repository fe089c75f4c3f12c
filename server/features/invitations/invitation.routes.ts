import { Router } from 'express';
import type { DataSource } from 'typeorm';
import type { MailSettings } from '../../mail/mailer';

/** Placeholder: filled in with the feature. */
export function invitationRoutes(_ds: DataSource, _mail?: MailSettings) {
  return Router({ mergeParams: true });
}

/** Placeholder: filled in with the feature. */
export function unsubscribeRoutes(_ds: DataSource, _mail?: MailSettings) {
  return Router({ mergeParams: true });
}

