import passport from 'passport';
import type { Transaction } from 'sequelize';
import { Strategy as LocalStrategy } from 'passport-local';
import { User } from '../db/models';
import { verifyPassword } from './passwords';
import { ROLE_PERMISSIONS, type SessionUserDto } from '../../shared/schemas/auth';
import { announce, cachesUsable, onChange } from '../services/change-feed';

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
 * Signed-in users by id, so a request costs no account query. Only active accounts are cached.
 * Every account write is announced on the change feed (model hooks, in the write's transaction),
 * so every process drops the account after the commit; a read that began before a change is
 * not kept; while the feed is not listening nothing is cached.
 */
const sessionUsers = new Map<number, Express.User>();
let generation = 0;

/** For raw SQL writes to users (tests, scripts): forget every cached account. */
export function forgetSessionUsers(): void {
  generation++;
  sessionUsers.clear();
}

onChange((change) => {
  if (change.kind === 'everything' || (change.kind === 'account' && change.userId === null)) forgetSessionUsers();
  else if (change.kind === 'account' && change.userId !== null) {
    generation++;
    sessionUsers.delete(change.userId);
  }
});

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
      const usable = cachesUsable();
      const cached = usable ? sessionUsers.get(id) : undefined;
      if (cached) return done(null, cached);
      const started = generation;
      const user = await User.findByPk(id, { attributes: ['id', 'email', 'name', 'role', 'active'] });
      // A deactivated or deleted account's session ends at its next request.
      if (!user || !user.active) return done(null, false);
      const sessionUser = { id: user.id, email: user.email, name: user.name, role: user.role };
      if (usable && cachesUsable() && generation === started) {
        if (sessionUsers.size >= 10_000) sessionUsers.clear();
        sessionUsers.set(id, sessionUser);
      }
      return done(null, sessionUser);
    } catch (err) {
      return done(err);
    }
  });
  // Any write to an account (role, name, deactivation, password) is announced in its own
  // transaction: every process drops the account once it commits, so the change takes effect at
  // the account's very next request, wherever it is served.
  const announceAccount = (userId: number | null, options: { transaction?: Transaction | null }) => announce({ kind: 'account', userId }, options.transaction);
  User.addHook('afterSave', 'announce-account', (user: User, options) => announceAccount(user.id, options));
  User.addHook('afterDestroy', 'announce-account', (user: User, options) => announceAccount(user.id, options));
  for (const hook of ['afterBulkUpdate', 'afterBulkDestroy'] as const) User.addHook(hook, 'announce-account', (options: { transaction?: Transaction | null }) => announceAccount(null, options));
  User.addHook('afterUpsert', 'announce-account', (_created, options: { transaction?: Transaction | null }) => announceAccount(null, options));
  configured = true;
  return passport;
}
