import { Router } from 'express';
import { z } from 'zod';
import { CAUGHT_MAIL_ID } from '../../services/mail';
import { authorize } from '../../auth/authorize';
import { parse } from '../../middleware/validate';
import { auditQuerySchema, caughtMailQuerySchema, outboxQuerySchema } from '../../../shared/schemas/library';
import { getMail, listAudit, listMail, listOutgoingMail } from './service';

const mailIdSchema = z.strictObject({ id: z.string().regex(CAUGHT_MAIL_ID, 'is not a message id') });

/** /api/admin: the audit log and caught mail (admins only, by permission). */
export function adminRouter(): Router {
  const router = Router();
  router.get('/audit', authorize('audit:read'), async (req, res) => {
    res.json(await listAudit(parse(auditQuerySchema, req.query, 'query')));
  });
  router.get('/mail', authorize('mail:read'), async (req, res) => {
    res.json(await listMail(parse(caughtMailQuerySchema, req.query, 'query')));
  });
  router.get('/outbox', authorize('mail:read'), async (req, res) => {
    res.json({ items: await listOutgoingMail(parse(outboxQuerySchema, req.query, 'query')) });
  });
  router.get('/mail/:id', authorize('mail:read'), async (req, res) => {
    const { id } = parse(mailIdSchema, { id: req.params.id }, 'address');
    res.json(await getMail(id));
  });
  return router;
}
