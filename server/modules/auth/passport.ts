import passport, { type PassportStatic } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { DataSource } from 'typeorm';
import { authenticate, findActiveSessionUser, toSessionUser } from '../users/users.service';

/**
 * A passport instance for one app: e-mail + password sign-in, the user id in the session, and the user
 * reloaded on every request so a deactivated account stops working at once.
 */
export function createPassport(dataSource: DataSource): PassportStatic {
  const instance = new passport.Passport() as PassportStatic;
  instance.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, (email, password, done) => {
      authenticate(dataSource, email, password)
        .then((user) => done(null, user ? toSessionUser(user) : false))
        .catch((error: unknown) => done(error));
    }),
  );
  instance.serializeUser((user, done) => done(null, user.id));
  instance.deserializeUser((id: number, done) => {
    findActiveSessionUser(dataSource, id)
      .then((user) => done(null, user ?? false))
      .catch((error: unknown) => done(error));
  });
  return instance;
}
