import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import { User } from '../db/models';
import { verifyPassword } from './passwords';
import { ROLE_PERMISSIONS, type SessionUserDto } from '../../shared/schemas/auth';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface User {
      id: number;
      email: string;
      name: string;
      role: import('../../shared/schemas/auth').Role;
    }
  }
}

export function toSessionUser(user: Express.User): SessionUserDto {
  return { id: user.id, email: user.email, name: user.name, role: user.role, permissions: [...ROLE_PERMISSIONS[user.role]] };
}

let configured = false;

export function configurePassport(): typeof passport {
  if (configured) return passport;
  passport.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, async (email, password, done) => {
      try {
        const user = await User.findOne({ where: { email: email.trim().toLowerCase() } });
        const ok = await verifyPassword(password, user?.passwordHash);
        // One answer for unknown, inactive and wrong password: no account enumeration.
        if (!user || !ok || !user.active) return done(null, false);
        return done(null, { id: user.id, email: user.email, name: user.name, role: user.role });
      } catch (err) {
        return done(err);
      }
    }),
  );
  passport.serializeUser((user, done) => done(null, user.id));
  passport.deserializeUser(async (id: number, done) => {
    try {
      const user = await User.findByPk(id, { attributes: ['id', 'email', 'name', 'role', 'active'] });
      // A deactivated or deleted account's session ends at its next request.
      if (!user || !user.active) return done(null, false);
      return done(null, { id: user.id, email: user.email, name: user.name, role: user.role });
    } catch (err) {
      return done(err);
    }
  });
  configured = true;
  return passport;
}
