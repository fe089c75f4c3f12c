import { Router, type Request } from 'express';
import type { DataSource } from 'typeorm';
import { updatePreferencesInputSchema, type UpdatePreferencesInput, type User } from '@shared/auth/auth.schema';
import { loginInputSchema, registerInputSchema, type LoginInput, type RegisterInput } from '@shared/auth/credentials.schema';
import {
  changeEmailInputSchema, changePasswordInputSchema, closeAccountInputSchema, confirmEmailChangeSchema, endSessionsInputSchema,
  type ChangeEmailInput, type ChangePasswordInput, type CloseAccountInput, type ConfirmEmailChange, type EndSessionsInput,
} from '@shared/auth/account.schema';
import {
  PASSWORD_RESET_REQUESTED_MESSAGE,
  passwordResetConfirmSchema,
  passwordResetRequestSchema,
  type PasswordResetConfirm,
  type PasswordResetRequest,
  type PasswordResetRequested,
} from '@shared/collab/invitation.schema';
import { AppError } from '../lib/app-error';
import { accountKey, securityEvent, type SecurityEvent } from '../lib/security-log';
import { parsed, validate } from '../lib/validate';
import { createUser, findUserById, updatePreferences } from '../features/users/user.service';
import type { AppPassport } from './passport';
import type { AuthRateLimits } from './rate-limit';
import { currentUser, requireAuth } from './access';
import { SESSION_COOKIE } from './session';
import type { MailSettings } from '../mail/mailer';
import { confirmPasswordReset, requestPasswordReset } from './password-reset';
import { changePassword } from './password-change';
import { deviceLabel, endOtherSessions, listDevices } from './devices';
import { assertNewAddress, confirmEmailChange, pendingEmailChange, requestEmailChange } from './email-change';
import { closeAccount } from './close-account';
import { accountFileName, exportAccount } from '../features/exports/account-export';

interface Deps {
  ds: DataSource;
  passport: AppPassport;
  limits: AuthRateLimits;
  generateCsrfToken: (req: Request, overwrite?: boolean) => string;
  /** For password-reset e-mails; without it the reset link is stored but not sent. */
  mail?: MailSettings;
  /** The session's idle timeout: a session's last request is its stored expiry less this. */
  idleMs: number;
}

const INVALID_LOGIN = 'That e-mail and password do not match an account.';

/**
 * Signs the user in: passport regenerates the session ID, then we stamp the sign-in time and what the
 * browser says it is, for the list of signed-in devices.
 */
function signIn(req: Request, user: User) {
  return new Promise<void>((resolve, reject) => {
    req.login(user, (err) => {
      if (err) return reject(err);
      req.session.signedInAt = Date.now();
      req.session.device = deviceLabel(req.get('user-agent'));
      resolve();
    });
  });
}

export function authRoutes({ ds, passport, limits, generateCsrfToken, mail, idleMs }: Deps) {
  const router = Router();

  /**
   * Runs `act`, which checks the signed-in person's password typed again, under the account's sign-in limit:
   * a wrong password (a validation error) counts as a failed sign-in, a right one clears the count.
   */
  async function withPasswordLimit<T>(req: Request, event: SecurityEvent, act: (user: User) => Promise<T>): Promise<T> {
    const user = currentUser(req);
    await limits.beforeLogin(req.ip ?? 'unknown', user.email);
    try {
      const result = await act(user);
      await limits.loginSucceeded(user.email, req.ip ?? 'unknown');
      securityEvent(req, event);
      return result;
    } catch (err) {
      if (err instanceof AppError && err.code === 'validation_failed') {
        await limits.loginFailed(user.email);
        securityEvent(req, 'password-check-failed', { for: event });
      }
      throw err;
    }
  }

  router.get('/csrf', (req, res) => {
    res.json({ token: generateCsrfToken(req) });
  });

  router.post('/register', validate({ body: registerInputSchema }), async (req, res) => {
    const input = parsed<RegisterInput>(res, 'body');
    await limits.beforeRegister(req.ip ?? 'unknown');
    const user = await createUser(ds, input);
    await signIn(req, user);
    securityEvent(req, 'registered');
    res.status(201).json({ user });
  });

  router.post('/login', validate({ body: loginInputSchema }), async (req, res) => {
    const input = parsed<LoginInput>(res, 'body');
    await limits.beforeLogin(req.ip ?? 'unknown', input.email);
    req.body = input;
    const user = await new Promise<User | false>((resolve, reject) => {
      passport.authenticate('local', { session: false }, (err: unknown, found: User | false) =>
        err ? reject(err) : resolve(found),
      )(req, res, reject);
    }).catch((err: unknown) => {
      // A suspended account, its password right.
      if (err instanceof AppError) securityEvent(req, 'sign-in-refused', { account: accountKey(input.email), reason: err.code });
      throw err;
    });
    if (!user) {
      await limits.loginFailed(input.email);
      securityEvent(req, 'sign-in-refused', { account: accountKey(input.email), reason: 'no match' });
      throw new AppError('unauthenticated', INVALID_LOGIN);
    }
    await limits.loginSucceeded(input.email, req.ip ?? 'unknown');
    await signIn(req, user);
    securityEvent(req, 'signed-in');
    res.json({ user });
  });

  /** Signs this browser out: the session's row is deleted and its cookie cleared. */
  function signOut(req: Request) {
    return new Promise<void>((resolve, reject) => {
      req.logout((err) => {
        if (err) return reject(err);
        req.session.destroy((destroyErr) => (destroyErr ? reject(destroyErr) : resolve()));
      });
    });
  }

  router.post('/logout', async (req, res) => {
    if (req.user) securityEvent(req, 'signed-out');
    await signOut(req);
    res.clearCookie(SESSION_COOKIE, { path: '/' });
    res.status(204).end();
  });

  router.get('/me', requireAuth, (req, res) => {
    res.json({ user: currentUser(req) });
  });

  /** Who is signed in on this browser, or null: a question every page asks, so "nobody" is an answer, not a refusal. */
  router.get('/session', (req, res) => {
    res.json({ user: req.user ? currentUser(req) : null });
  });

  /** Units per quantity (and later other display choices); merged into what is stored. */
  router.patch('/me/preferences', requireAuth, validate({ body: updatePreferencesInputSchema }), async (req, res) => {
    const user = await updatePreferences(ds, currentUser(req).id, parsed<UpdatePreferencesInput>(res, 'body'));
    res.json({ user });
  });

  /**
   * A new password for the signed-in account, the current one typed again. A wrong current password counts
   * as a failed sign-in of the account, so this cannot be used to guess it past the sign-in limit.
   */
  router.post('/me/password', requireAuth, validate({ body: changePasswordInputSchema }), async (req, res) => {
    const input = parsed<ChangePasswordInput>(res, 'body');
    await withPasswordLimit(req, 'password-changed', (user) => changePassword(ds, user.id, req.sessionID, input));
    res.status(204).end();
  });

  /** A change of sign-in address still waiting for its link to be opened, or none. */
  router.get('/me/email', requireAuth, async (req, res) => {
    res.json(await pendingEmailChange(ds, currentUser(req).id));
  });

  /**
   * Asks to sign in with a new address, the password typed again (counted like a sign-in): a link goes to
   * the new address and a warning to the old one; nothing changes until the link is opened.
   */
  router.post('/me/email', requireAuth, validate({ body: changeEmailInputSchema }), async (req, res) => {
    const input = parsed<ChangeEmailInput>(res, 'body');
    assertNewAddress(currentUser(req), input.newEmail);
    res.status(202).json(await withPasswordLimit(req, 'email-change-asked', (user) => requestEmailChange(ds, mail, user, input)));
  });

  /** The link from the new address, opened by the account that asked: the address changes. */
  router.post('/me/email/confirm', requireAuth, validate({ body: confirmEmailChangeSchema }), async (req, res) => {
    const { id } = currentUser(req);
    await confirmEmailChange(ds, id, parsed<ConfirmEmailChange>(res, 'body').token);
    securityEvent(req, 'email-changed');
    res.json({ user: await findUserById(ds, id) });
  });

  /** Everything the account holds, as one JSON file to keep (its cars' season files among it). */
  router.get('/me/export.json', requireAuth, async (req, res) => {
    const file = await exportAccount(ds, currentUser(req));
    res.setHeader('Content-Disposition', `attachment; filename="${accountFileName()}"`);
    res.setHeader('Cache-Control', 'no-store');
    res.type('application/json; charset=utf-8').send(JSON.stringify(file, null, 2));
  });

  /**
   * Closes the account, the password typed again (counted like a sign-in): its cars and their seasons go, the
   * rest is made anonymous, every device is signed out, this one included. 409 while others depend on it.
   */
  router.post('/me/close', requireAuth, validate({ body: closeAccountInputSchema }), async (req, res) => {
    const input = parsed<CloseAccountInput>(res, 'body');
    await withPasswordLimit(req, 'account-closed', (user) => closeAccount(ds, mail, user, input));
    await signOut(req);
    res.clearCookie(SESSION_COOKIE, { path: '/' });
    res.status(204).end();
  });

  /** The devices signed in to this account, this one first. */
  router.get('/me/sessions', requireAuth, async (req, res) => {
    res.json({ items: await listDevices(ds, currentUser(req).id, req.sessionID, idleMs) });
  });

  /** Signs out one other device, or all of them, with the password typed again; counted like a sign-in. */
  router.post('/me/sessions/end', requireAuth, validate({ body: endSessionsInputSchema }), async (req, res) => {
    const input = parsed<EndSessionsInput>(res, 'body');
    const ended = await withPasswordLimit(req, 'devices-signed-out', (user) => endOtherSessions(ds, user.id, req.sessionID, input));
    res.json({ ended });
  });

  /** Always 202 with the same words, so the answer does not tell which addresses have accounts. */
  router.post('/password-reset', validate({ body: passwordResetRequestSchema }), async (req, res) => {
    const { email } = parsed<PasswordResetRequest>(res, 'body');
    await limits.beforePasswordReset(req.ip ?? 'unknown', email);
    await requestPasswordReset(ds, mail, email);
    securityEvent(req, 'password-reset-asked', { account: accountKey(email) });
    const body: PasswordResetRequested = { message: PASSWORD_RESET_REQUESTED_MESSAGE };
    res.status(202).json(body);
  });

  /** Sets the new password and ends every session of the account, this browser's included. */
  router.post('/password-reset/confirm', validate({ body: passwordResetConfirmSchema }), async (req, res) => {
    const { token, password } = parsed<PasswordResetConfirm>(res, 'body');
    const { email } = await confirmPasswordReset(ds, token, password);
    securityEvent(req, 'password-reset', { account: accountKey(email) });
    // A lock from earlier failed sign-ins would otherwise keep the owner out with the new password.
    await limits.loginSucceeded(email);
    if (req.user) await new Promise<void>((resolve, reject) => req.logout((err) => (err ? reject(err) : resolve())));
    res.status(204).end();
  });

  return router;
}
