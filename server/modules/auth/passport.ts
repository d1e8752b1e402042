import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import { loginSchema } from '#shared/schemas/auth';
import { User } from '../../db/models';
import { checkCredentials } from './auth.service';
import { presentUser } from './auth.presenter';
import type { UserDto } from '#shared/schemas/auth';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends UserDto {}
  }
}

/** The body is validated by the route before passport sees it; this only checks the credentials. */
export function configurePassport() {
  passport.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password', session: true }, (email, password, done) => {
      const input = loginSchema.parse({ email, password });
      checkCredentials(input).then(
        (user) => done(null, user ? presentUser(user) : false),
        (err) => done(err),
      );
    }),
  );
  passport.serializeUser((user, done) => done(null, user.id));
  passport.deserializeUser((id: number, done) => {
    User.findByPk(id).then(
      (user) => done(null, user ? presentUser(user) : false),
      (err) => done(err),
    );
  });
  return passport;
}
