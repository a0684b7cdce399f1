import express, { Router } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import type { AppContext } from '../../context';
import { mailPreferencesUpdateSchema, unsubscribeBodySchema } from '../../../../shared/src/schemas/mail';
import { AppError } from '../../lib/errors';
import { signedIn } from '../../lib/policies';
import { PgRateLimitStore } from '../../lib/rate-limit-store';
import { parsed, validate } from '../../lib/validate';
import * as mail from './mail.service';

/** /api/me/mail-preferences: which optional e-mails the signed-in user gets. */
export function mailPreferencesRouter(ctx: AppContext): Router {
  const router = Router();

  /** GET /api/me/mail-preferences — anyone signed in: their own choices. */
  router.get('/mail-preferences', async (req, res) => {
    res.json({ preferences: await mail.getPreferences(ctx, signedIn(req)) });
  });

  /** PATCH /api/me/mail-preferences — anyone signed in: turn kinds of e-mail on or off. */
  router.patch('/mail-preferences', validate('body', mailPreferencesUpdateSchema), async (req, res) => {
    const patch = parsed(res, 'body', mailPreferencesUpdateSchema);
    res.json({ preferences: await mail.updatePreferences(ctx, signedIn(req), patch) });
  });
  return router;
}

/**
 * /api/mail/unsubscribe: mounted before the CSRF check, because it is reached without a session,
 * from our page or straight from a mail program's one-click POST (RFC 8058: the token in the
 * link's query, a form body `List-Unsubscribe=One-Click`). The signed token is the authority.
 */
export function unsubscribeRouter(ctx: AppContext): Router {
  const router = Router();

  /** POST /api/mail/unsubscribe — anyone with a signed link: turn that kind of e-mail off. */
  router.post(
    '/unsubscribe',
    rateLimit({
      windowMs: 15 * 60 * 1000,
      limit: 60,
      standardHeaders: 'draft-8',
      legacyHeaders: false,
      store: new PgRateLimitStore(ctx.db, 'unsubscribe-ip:'),
      keyGenerator: (req) => ipKeyGenerator(req.ip ?? 'unknown'),
      handler: () => {
        throw new AppError(
          'rate_limited',
          'Too many tries from this network. Wait 15 minutes and try again.',
          429,
        );
      },
    }),
    express.urlencoded({ extended: false, limit: '2kb' }),
    (req, _res, next) => {
      const body = (req.body ?? {}) as Record<string, unknown>;
      if (body.token === undefined && typeof req.query.token === 'string')
        req.body = { token: req.query.token };
      next();
    },
    validate('body', unsubscribeBodySchema),
    async (_req, res) => {
      res.json(await mail.unsubscribe(ctx, parsed(res, 'body', unsubscribeBodySchema).token));
    },
  );
  return router;
}
