import type { IncomingMessage } from 'node:http';
import type { Request } from 'express';
import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { DataSource } from 'typeorm';
import { findUserById, findUserEntityByEmail, rolesOf, toUserDto } from '../features/users/user.service';
import { AppError } from '../lib/app-error';
import { verifyAgainstDummy, verifyPassword } from './password';
import { userReadWithSession } from './session';

export const SUSPENDED_SIGN_IN = 'An administrator has suspended this account, so it cannot sign in. Ask them to restore it.';

/** A passport instance of the app's own (tests build several apps in one process). */
export function createPassport(ds: DataSource) {
  const instance = new passport.Passport();

  instance.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password', session: true }, (email, password, done) => {
      (async () => {
        const entity = await findUserEntityByEmail(ds, email);
        if (!entity) return verifyAgainstDummy(password);
        if (!(await verifyPassword(entity.passwordHash, password))) return false;
        // Said only to whoever knows the password, so it tells a guesser nothing.
        if (entity.suspendedAt) throw new AppError('forbidden', SUSPENDED_SIGN_IN);
        return toUserDto(entity, await rolesOf(ds, entity.id));
      })().then((user) => done(null, user), done);
    }),
  );

  instance.serializeUser((user, done) => done(null, user.id));
  instance.deserializeUser((req: IncomingMessage, id: string, done: (err: unknown, user?: Express.User | false) => void) => {
    // An account deleted since sign-in reads as signed out (false), not as an error.
    const read = userReadWithSession((req as Request).session, id);
    if (read !== undefined) return done(null, read ?? false);
    findUserById(ds, id).then((user) => done(null, user ?? false), done);
  });

  return instance;
}

export type AppPassport = ReturnType<typeof createPassport>;
