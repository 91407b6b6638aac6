import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import { User } from '../db/models';
import { verifyPassword } from './passwords';
import { ROLE_PERMISSIONS, type SessionUserDto } from '../../shared/schemas/auth';

declare global {
  namespace Express {
    interface User {
      id: number;
      email: string;
      name: string;
      role: import('../../shared/schemas/auth').Role;
    }
  }
}

/** Why passport-local refused a sign-in. */
export interface SignInRefusal {
  message: string;
  reason: 'credentials' | 'deactivated';
}

const refusal = (reason: SignInRefusal['reason']): SignInRefusal => ({ message: reason === 'deactivated' ? 'account deactivated' : 'wrong e-mail or password', reason });

export function toSessionUser(user: Express.User): SessionUserDto {
  return { id: user.id, email: user.email, name: user.name, role: user.role, permissions: [...ROLE_PERMISSIONS[user.role]] };
}

let configured = false;

/**
 * Signed-in users by id, so a request costs no account query. Only active accounts are cached;
 * model hooks clear it on every account write in this process (the app runs as one process).
 */
const sessionUsers = new Map<number, Express.User>();

/** For raw SQL writes to users (tests, scripts): forget every cached account. */
export function forgetSessionUsers(): void {
  sessionUsers.clear();
}

export function configurePassport(): typeof passport {
  if (configured) return passport;
  passport.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, async (email, password, done) => {
      try {
        const user = await User.findOne({ where: { email: email.trim().toLowerCase() } });
        const ok = await verifyPassword(password, user?.passwordHash);
        // One answer for an unknown account and a wrong password: no account enumeration. Only
        // the right password learns that its account is deactivated.
        if (!user || !ok) return done(null, false, refusal('credentials'));
        if (!user.active) return done(null, false, refusal('deactivated'));
        return done(null, { id: user.id, email: user.email, name: user.name, role: user.role });
      } catch (err) {
        return done(err);
      }
    }),
  );
  passport.serializeUser((user, done) => done(null, user.id));
  passport.deserializeUser(async (id: number, done) => {
    try {
      const cached = sessionUsers.get(id);
      if (cached) return done(null, cached);
      const user = await User.findByPk(id, { attributes: ['id', 'email', 'name', 'role', 'active'] });
      // A deactivated or deleted account's session ends at its next request.
      if (!user || !user.active) return done(null, false);
      const sessionUser = { id: user.id, email: user.email, name: user.name, role: user.role };
      if (sessionUsers.size >= 10_000) sessionUsers.clear();
      sessionUsers.set(id, sessionUser);
      return done(null, sessionUser);
    } catch (err) {
      return done(err);
    }
  });
  // Any write to an account (role, name, deactivation, password) drops the cache, so a change
  // takes effect at the account's very next request.
  for (const hook of ['afterSave', 'afterDestroy', 'afterBulkUpdate', 'afterBulkDestroy', 'afterUpsert'] as const) {
    User.addHook(hook, 'drop-session-user-cache', () => sessionUsers.clear());
  }
  configured = true;
  return passport;
}
