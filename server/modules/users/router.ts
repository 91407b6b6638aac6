import { Router } from 'express';
import rateLimit, { ipKeyGenerator } from 'express-rate-limit';
import { authorize, open, requireSignIn } from '../../auth/authorize';
import { parse, parseId } from '../../middleware/validate';
import { AppError } from '../../errors';
import { toSessionUser } from '../../auth/passport';
import {
  invitationAcceptSchema,
  invitationCreateSchema,
  passwordChangeSchema,
  passwordResetRequestSchema,
  passwordResetSchema,
  userUpdateSchema,
} from '../../../shared/schemas/projects';
import type { SessionDto } from '../../../shared/schemas/auth';
import type { MessageDto } from '../../../shared/schemas/responses';
import * as users from './service';
import { kickOutbox } from '../../services/outbox';

/** Admin: people, roles, deactivation, invitations. */
export function adminUsersRouter(): Router {
  const r = Router();
  r.get('/users', authorize('users:manage'), async (_req, res) => res.json({ items: await users.listUsers() }));
  r.patch('/users/:id', authorize('users:manage'), async (req, res) =>
    res.json(await users.updateUser(req.user!.id, parseId(req.params.id), parse(userUpdateSchema, req.body, 'change'))),
  );
  r.get('/sign-in-locks', authorize('users:manage'), async (_req, res) => res.json({ items: await users.listSignInLocks() }));
  r.delete('/sign-in-locks/:id', authorize('users:manage'), async (req, res) => {
    await users.clearSignInLock(req.user!.id, parseId(req.params.id));
    res.status(204).end();
  });
  r.get('/invitations', authorize('users:manage'), async (_req, res) => res.json({ items: await users.listInvitations() }));
  r.post('/invitations', authorize('users:manage'), async (req, res) => {
    const input = parse(invitationCreateSchema, req.body, 'invitation');
    res.status(201).json(await users.invite(req.user!.id, input.email, input.role));
  });
  r.post('/invitations/:id/revoke', authorize('users:manage'), async (req, res) => res.json(await users.revokeInvitation(req.user!.id, parseId(req.params.id))));
  r.post('/invitations/:id/resend', authorize('users:manage'), async (req, res) => res.json(await users.resendInvitation(req.user!.id, parseId(req.params.id))));
  return r;
}

/** Public account routes (no session needed) and the signed-in password change. */
export function accountRouter(): Router {
  const r = Router();
  const limiter = rateLimit({
    windowMs: 15 * 60_000,
    limit: 20,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => ipKeyGenerator(req.ip ?? ''),
    handler: (_req, _res, next) => next(new AppError(429, 'too_many_attempts', 'Too many requests. Wait 15 minutes and try again.')),
  });
  r.post('/invitations/accept', open, limiter, async (req, res, next) => {
    const input = parse(invitationAcceptSchema, req.body, 'invitation');
    const user = await users.acceptInvitation(input.token, input.name, input.password);
    const sessionUser = { id: user.id, email: user.email, name: user.name, role: user.role };
    req.logIn(sessionUser, (err) => (err ? next(err) : res.status(201).json({ user: toSessionUser(sessionUser) } satisfies SessionDto)));
  });
  r.post('/password-reset/request', open, limiter, async (req, res) => {
    const input = parse(passwordResetRequestSchema, req.body, 'request');
    // The same work for every address (one queued job); the lookup and the mail come after the answer.
    await users.requestPasswordReset(input.email);
    res.once('finish', kickOutbox);
    res.status(202).json({ message: 'If that address has an account, a reset link is on its way.' } satisfies MessageDto);
  });
  r.post('/password-reset', open, limiter, async (req, res) => {
    const input = parse(passwordResetSchema, req.body, 'request');
    await users.resetPassword(input.token, input.password);
    res.json({ message: 'Your password is changed. Sign in with it.' } satisfies MessageDto);
  });
  r.post('/password', requireSignIn, async (req, res) => {
    const input = parse(passwordChangeSchema, req.body, 'request');
    await users.changePassword(req.user!.id, input.currentPassword, input.newPassword, req.sessionID);
    res.json({ message: 'Your password is changed; your other sessions have ended.' } satisfies MessageDto);
  });
  return r;
}
