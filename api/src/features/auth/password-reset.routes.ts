import { Router } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import type { AppContext } from '../../context';
import {
  passwordResetConfirmSchema,
  passwordResetRequestSchema,
  tokenBodySchema,
} from '../../../../shared/src/index';
import { AppError } from '../../lib/errors';
import { PgRateLimitStore } from '../../lib/rate-limit-store';
import { parsed, validate } from '../../lib/validate';
import { checkPasswordReset, confirmPasswordReset, requestPasswordReset } from './password-reset.service';

const WINDOW_MS = 15 * 60 * 1000;

/** The one answer to every accepted request, whether or not the e-mail has a sign-in. */
export const RESET_REQUESTED = {
  message:
    'If that e-mail belongs to a Lightoff sign-in, a link to choose a new password is on its way. ' +
    'It works once, for 30 minutes. Check the spam folder if it does not arrive within a few minutes.',
};

function requestLimiters(ctx: AppContext) {
  const tooMany = (message: string) => () => {
    throw new AppError('rate_limited', message, 429);
  };
  const common = { windowMs: WINDOW_MS, standardHeaders: 'draft-8', legacyHeaders: false } as const;
  return [
    rateLimit({
      ...common,
      limit: ctx.config.RESET_LIMIT_PER_IP,
      store: new PgRateLimitStore(ctx.db, 'reset-ip:'),
      keyGenerator: (req) => ipKeyGenerator(req.ip ?? 'unknown'),
      handler: tooMany('Too many reset requests from this network. Wait 15 minutes and try again.'),
    }),
    // Counted for every address alike, so the limit says nothing about which e-mails exist.
    rateLimit({
      ...common,
      limit: ctx.config.RESET_LIMIT_PER_EMAIL,
      store: new PgRateLimitStore(ctx.db, 'reset-email:'),
      keyGenerator: (_req, res) => String((res.locals.body as { email?: unknown } | undefined)?.email ?? ''),
      handler: tooMany('Several links were already sent to this e-mail. Wait 15 minutes, then ask again.'),
    }),
  ];
}

export function passwordResetRouter(ctx: AppContext): Router {
  const router = Router();

  /** POST /api/auth/password-reset {email} — anyone: mail a reset link; the same 202 for any e-mail. */
  router.post(
    '/',
    validate('body', passwordResetRequestSchema),
    ...requestLimiters(ctx),
    async (_req, res) => {
      await requestPasswordReset(ctx, parsed(res, 'body', passwordResetRequestSchema).email);
      res.status(202).json(RESET_REQUESTED);
    },
  );

  /** POST /api/auth/password-reset/check {token} — anyone with the link: still usable, and for whom. */
  router.post('/check', validate('body', tokenBodySchema), async (_req, res) => {
    res
      .set('Cache-Control', 'no-store')
      .json(await checkPasswordReset(ctx, parsed(res, 'body', tokenBodySchema).token));
  });

  /** POST /api/auth/password-reset/confirm {token, password} — anyone with the link: set it; every session ends. */
  router.post('/confirm', validate('body', passwordResetConfirmSchema), async (_req, res) => {
    await confirmPasswordReset(ctx, parsed(res, 'body', passwordResetConfirmSchema));
    res.status(204).end();
  });

  return router;
}
