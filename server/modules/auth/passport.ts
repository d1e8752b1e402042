import type { IncomingMessage } from 'node:http';
import { Passport } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import { loginSchema } from '#shared/schemas/auth';
import { User } from '../../db/models';
import { checkCredentials } from './auth.service';
import { presentUser } from './auth.presenter';
import type { UserDto } from '#shared/schemas/auth';
import type { SqlSessionStore } from './session-store';

declare global {
  namespace Express {
    // Passport's user is ours: merge our fields into Express.User (an alias cannot merge).
    interface User extends UserDto {} // eslint-disable-line @typescript-eslint/no-empty-object-type
  }
}

/** The body is validated by the route before passport sees it; this only checks the credentials. */
export function configurePassport(store: SqlSessionStore) {
  // One authenticator per app, so each uses its own session store (tests and benches build several).
  const passport = new Passport();
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
  // The session read already joined the user; it is looked up again only when that was not handed over.
  passport.deserializeUser((req: IncomingMessage, id: number, done: (err: unknown, user?: Express.User | false) => void) => {
    const joined = store.userFor((req as { sessionID?: string }).sessionID ?? '', id);
    if (joined !== undefined) return done(null, joined ?? false);
    User.findByPk(id, { attributes: ['id', 'email', 'name'], raw: true }).then(
      (user) => done(null, user ? presentUser(user) : false),
      (err) => done(err),
    );
  });
  return passport;
}
