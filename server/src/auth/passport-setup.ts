import passportStatic from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import { User } from '../people/user.model.js';
import { verifyPassword } from './passwords.js';
import type { Role } from './principal.js';

declare global {
  namespace Express {
    /** What passport puts on `req.user`: the signed-in person, read fresh from the database each request. */
    interface User {
      userId: number;
      userName: string;
      displayName: string;
      role: Role;
    }
  }
}

function sessionUser(user: User): Express.User {
  return { userId: user.id, userName: user.userName, displayName: user.displayName, role: user.role };
}

/**
 * Passport for people: the local strategy checks the user name and password; the session keeps the
 * user id only, and every request reloads the person, so a role change or a deactivation applies at once.
 * It depends on no per-app state (the models are bound by initModels), so one instance serves every app.
 */
function createPassport(): passportStatic.Authenticator {
  const instance = new passportStatic.Passport();
  instance.use(
    'local',
    new LocalStrategy({ usernameField: 'userName', passwordField: 'password' }, (userName, password, done) => {
      User.findOne({ where: { userName } })
        .then(async (user) => {
          const ok = await verifyPassword(password, user?.passwordHash);
          done(null, ok && user?.active ? sessionUser(user) : false);
        })
        .catch(done);
    }),
  );
  instance.serializeUser((user, done) => done(null, user.userId));
  instance.deserializeUser((id: unknown, done) => {
    if (typeof id !== 'number') return done(null, false);
    User.findByPk(id)
      .then((user) => done(null, user?.active ? sessionUser(user) : false))
      .catch(done);
  });
  return instance;
}

export const passport = createPassport();
