import type { Pool } from 'pg';
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import { AppError } from '../lib/app-error';

export interface AuthLimits {
  /** Failed sign-ins allowed per account in the window. */
  loginPerAccount: number;
  /** Failed sign-ins allowed per IP address in the window (a club's drivers may share one address). */
  loginPerIp: number;
  /** Registrations allowed per IP address in the window. */
  registerPerIp: number;
  /** Password-reset requests allowed per IP address in the window. */
  resetPerIp: number;
  /** Password-reset requests allowed per e-mail address in the window (known or not). */
  resetPerEmail: number;
  /** Upload requests (each up to 10 files) allowed per account in the window. */
  uploadsPerUser: number;
  windowSec: number;
  /** Separates counters of independent app instances sharing one database (tests). */
  keyPrefix: string;
}

export const DEFAULT_AUTH_LIMITS: AuthLimits = {
  loginPerAccount: 5,
  loginPerIp: 30,
  registerPerIp: 10,
  resetPerIp: 10,
  resetPerEmail: 3,
  uploadsPerUser: 60,
  windowSec: 15 * 60,
  keyPrefix: 'auth',
};

/**
 * Sign-in, registration, password-reset and upload counters kept in PostgreSQL (table auth_rate_limits),
 * so a restart does not reset them. Per IP and per account only failures count: an attempt takes a point
 * from its IP before the password is checked (so a burst of parallel guesses is held back too), and a success
 * hands it back. A success also clears the account's failures.
 */
export function createAuthRateLimits(pool: Pool, limits: AuthLimits) {
  const make = (name: string, points: number) =>
    new RateLimiterPostgres({
      storeClient: pool,
      tableName: 'auth_rate_limits',
      tableCreated: true,
      keyPrefix: `${limits.keyPrefix}:${name}`,
      points,
      duration: limits.windowSec,
    });
  const loginIp = make('login-ip', limits.loginPerIp);
  const loginAccount = make('login-account', limits.loginPerAccount);
  const registerIp = make('register-ip', limits.registerPerIp);
  const resetIp = make('reset-ip', limits.resetPerIp);
  const resetEmail = make('reset-email', limits.resetPerEmail);
  const uploadUser = make('upload-user', limits.uploadsPerUser);

  const tooMany = (msBeforeNext: number) => {
    const seconds = Math.max(1, Math.ceil(msBeforeNext / 1000));
    return new AppError('rate_limited', `Too many attempts. Try again in ${Math.ceil(seconds / 60)} min.`, undefined, {
      'Retry-After': String(seconds),
    });
  };

  async function consume(limiter: RateLimiterPostgres, key: string) {
    try {
      await limiter.consume(key);
    } catch (res) {
      if (res instanceof RateLimiterRes) throw tooMany(res.msBeforeNext);
      throw res;
    }
  }

  return {
    /** Before checking a password: counts the IP's attempt and refuses a locked account. */
    async beforeLogin(ip: string, email: string) {
      await consume(loginIp, ip);
      const account = await loginAccount.get(email);
      if (account && account.consumedPoints >= limits.loginPerAccount) throw tooMany(account.msBeforeNext);
    },
    async loginFailed(email: string) {
      await loginAccount.penalty(email, 1);
    },
    /** `ip` is the address whose point `beforeLogin` took; left out where no attempt was counted (a reset). */
    async loginSucceeded(email: string, ip?: string) {
      await loginAccount.delete(email);
      if (ip !== undefined) await loginIp.reward(ip, 1);
    },
    async beforeRegister(ip: string) {
      await consume(registerIp, ip);
    },
    /** Every reset request counts, per IP and per address, whether or not an account uses it. */
    async beforePasswordReset(ip: string, email: string) {
      await consume(resetIp, ip);
      await consume(resetEmail, email);
    },
    /** Before an upload's body is read: every upload request counts, per account. */
    async beforeUpload(userId: string) {
      await consume(uploadUser, userId);
    },
  };
}

export type AuthRateLimits = ReturnType<typeof createAuthRateLimits>;
