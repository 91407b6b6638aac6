import { Router } from 'express';
import rateLimit, { ipKeyGenerator } from 'express-rate-limit';
import passport from 'passport';
import { loginSchema, type SessionDto } from '../../../shared/schemas/auth';
import { parse } from '../../middleware/validate';
import { AppError, unauthorized } from '../../errors';
import { toSessionUser } from '../../auth/passport';
import { open } from '../../auth/authorize';
import { lockRemaining, recordFailure, recordSuccess } from '../../auth/lockout';
import { env } from '../../config/env';
import { recordSignIn } from './service';

export function authRouter(): Router {
  const router = Router();

  // Failed sign-ins per address and account; successful ones do not count.
  const loginLimiter = rateLimit({
    windowMs: 15 * 60_000,
    limit: env().LOGIN_RATE_LIMIT,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? '')}|${String(req.body?.email ?? '').toLowerCase().slice(0, 254)}`,
    handler: (_req, _res, next) =>
      next(new AppError(429, 'too_many_attempts', 'Too many failed sign-ins. Wait 15 minutes and try again.')),
  });

  router.post('/login', open, loginLimiter, (req, res, next) => {
    const credentials = parse(loginSchema, req.body ?? {}, 'sign-in');
    req.body = credentials;
    const wait = lockRemaining(credentials.email);
    if (wait > 0) {
      res.setHeader('Retry-After', String(Math.ceil(wait / 1000)));
      return next(new AppError(429, 'too_many_attempts', `Too many failed sign-ins for this account. Try again in ${Math.ceil(wait / 1000)} s.`));
    }
    passport.authenticate('local', { session: true }, (err: unknown, user: Express.User | false) => {
      if (err) return next(err);
      if (!user) {
        recordFailure(credentials.email);
        return next(new AppError(401, 'invalid_credentials', 'E-mail or password is incorrect.'));
      }
      recordSuccess(credentials.email);
      // req.logIn regenerates the session id (passport ≥ 0.6), so a planted id is useless.
      req.logIn(user, (loginErr) => {
        if (loginErr) return next(loginErr);
        recordSignIn(user.id)
          .then(() => res.json({ user: toSessionUser(user) } satisfies SessionDto))
          .catch(next);
      });
    })(req, res, next);
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
