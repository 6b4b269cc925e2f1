import type { Request, Response } from 'express';
import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import { UnauthenticatedError } from '../http/errors';
import type { AuthService } from './auth.service';
import type { SignedInUser } from './session-user';

/** What the session remembers: the user and the session version current at sign-in. */
interface SessionRecord {
  id: string;
  version: number;
}

/**
 * A passport instance per app (tests build several apps in one process). Each request reloads
 * the user; a deactivated user or a moved-on session version makes the session anonymous.
 */
/** A passport instance (not the module's global one). */
export type PassportInstance = passport.Authenticator;

export function createPassport(auth: AuthService): PassportInstance {
  const instance = new passport.Passport();
  instance.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, (email, password, done) => {
      auth.verifyCredentials(email, password).then((user) => done(null, user), done);
    }),
  );
  instance.serializeUser<SessionRecord>((user, done) => done(null, { id: user.id, version: user.sessionVersion }));
  instance.deserializeUser<SessionRecord>((record, done) => {
    auth.findSessionUser(record.id, record.version).then((user) => done(null, user ?? false), done);
  });
  return instance;
}

/** Checks the e-mail and password in req.body with the local strategy (domain errors pass through). */
export function authenticateLocal(instance: PassportInstance, req: Request, res: Response): Promise<SignedInUser> {
  return new Promise((resolve, reject) => {
    instance.authenticate('local', { session: false }, (error: unknown, user: SignedInUser | false) => {
      if (error) reject(error);
      else if (!user) reject(new UnauthenticatedError('Enter your e-mail address and password.', { code: 'invalid_credentials' }));
      else resolve(user);
    })(req, res, reject);
  });
}

/** Starts the session: a new session id (against fixation) that keeps the CSRF seed. */
export function logIn(req: Request, user: SignedInUser): Promise<void> {
  return new Promise((resolve, reject) => req.login(user, { session: true, keepSessionInfo: true }, (error) => (error ? reject(error) : resolve())));
}

export function logOut(req: Request): Promise<void> {
  return new Promise((resolve, reject) => req.logout({ keepSessionInfo: true }, (error) => (error ? reject(error) : resolve())));
}
