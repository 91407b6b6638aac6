import { Router, type NextFunction, type Request, type Response } from 'express';
import passport from 'passport';
import { loginSchema, type SessionDto } from '../../../shared/schemas/auth';
import { parse } from '../../middleware/validate';
import { AppError, unauthorized } from '../../errors';
import { toSessionUser, type SignInRefusal } from '../../auth/passport';
import { open } from '../../auth/authorize';
import { activeLock, clientAddress, recordFailure, recordSuccess } from '../../auth/sign-in-throttle';
import { recordSignIn } from './service';

/** passport-local's answer as a promise: the user, or false with why. */
function authenticate(req: Request, res: Response, next: NextFunction): Promise<{ user: Express.User | false; refusal?: SignInRefusal }> {
  return new Promise((resolve, reject) => {
    passport.authenticate('local', { session: true }, (err: unknown, user: Express.User | false, info?: SignInRefusal) => {
      if (err) reject(err);
      else resolve({ user, refusal: info });
    })(req, res, next);
  });
}

const logIn = (req: Request, user: Express.User) => new Promise<void>((resolve, reject) => req.logIn(user, (err) => (err ? reject(err) : resolve())));

export function authRouter(): Router {
  const router = Router();

  router.post('/login', open, async (req, res, next) => {
    const credentials = parse(loginSchema, req.body ?? {}, 'sign-in');
    req.body = credentials;
    // Only this address's own failures can hold it back (server/auth/sign-in-throttle.ts).
    const address = clientAddress(req);
    const lock = await activeLock(address, credentials.email);
    if (lock) {
      const seconds = Math.max(1, Math.ceil(lock.retryAfterMs / 1000));
      res.setHeader('Retry-After', String(seconds));
      throw new AppError(
        429,
        'too_many_attempts',
        lock.scope === 'address'
          ? `Too many failed sign-ins from your network. Try again in ${seconds} s.`
          : `Too many failed sign-ins for this account from your network. Try again in ${seconds} s.`,
      );
    }
    const { user, refusal } = await authenticate(req, res, next);
    if (!user) {
      if (refusal?.reason === 'deactivated') {
        throw new AppError(403, 'account_deactivated', 'This account is deactivated. Ask an administrator of your team to reactivate it.');
      }
      await recordFailure(address, credentials.email);
      throw new AppError(401, 'invalid_credentials', 'E-mail or password is incorrect.');
    }
    await recordSuccess(address, credentials.email);
    // req.logIn regenerates the session id (passport ≥ 0.6), so a planted id is useless.
    await logIn(req, user);
    await recordSignIn(user.id);
    res.json({ user: toSessionUser(user) } satisfies SessionDto);
  });

  router.post('/logout', open, (req, res, next) => {
    req.logout((err) => {
      if (err) return next(err);
      req.session.destroy((destroyErr) => {
        if (destroyErr) return next(destroyErr);
        res.clearCookie('isobath.sid');
        res.status(204).end();
      });
    });
  });

  router.get('/me', open, (req, _res, next) => {
    if (!req.user) return next(unauthorized());
    next();
  }, (req, res) => {
    res.json({ user: toSessionUser(req.user!) } satisfies SessionDto);
  });

  return router;
}
