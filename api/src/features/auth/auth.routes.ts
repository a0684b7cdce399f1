import { Router, type Request } from 'express';
import { csrfSync } from 'csrf-sync';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import type passport from 'passport';
import type { AppContext } from '../../context';
import {
  loginBodySchema,
  passwordChangeBodySchema,
  type SessionUser,
} from '../../../../shared/src/schemas/auth';
import { AppError } from '../../lib/errors';
import { PgRateLimitStore } from '../../lib/rate-limit-store';
import { authorize } from '../../lib/policies';
import { parsed, validate } from '../../lib/validate';
import { audit } from '../../lib/audit';
import { changePassword, recordSignIn } from './auth.service';
import { SESSION_COOKIE } from './session';
import { passwordResetRouter } from './password-reset.routes';

const WINDOW_MS = 15 * 60 * 1000;

export const csrf = csrfSync({
  getTokenFromRequest: (req) => req.headers['x-csrf-token'] as string | undefined,
});

function loginLimiters(ctx: AppContext) {
  const tooMany = (message: string) => () => {
    throw new AppError('rate_limited', message, 429);
  };
  const common = {
    windowMs: WINDOW_MS,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
  } as const;
  return [
    // Loose per address, so a shared office connection is not locked out.
    rateLimit({
      ...common,
      limit: ctx.config.LOGIN_LIMIT_PER_IP,
      store: new PgRateLimitStore(ctx.db, 'login-ip:'),
      keyGenerator: (req) => ipKeyGenerator(req.ip ?? 'unknown'),
      handler: tooMany('Too many sign-in attempts from this network. Wait 15 minutes and try again.'),
    }),
    // Tight per e-mail: the 6th failure within 15 minutes is refused.
    rateLimit({
      ...common,
      limit: ctx.config.LOGIN_LIMIT_PER_EMAIL,
      store: new PgRateLimitStore(ctx.db, 'login-email:'),
      keyGenerator: (req: Request) =>
        String((req.body as { email?: unknown })?.email ?? '')
          .trim()
          .toLowerCase(),
      handler: tooMany('Too many failed sign-ins for this e-mail. Wait 15 minutes and try again.'),
    }),
  ];
}

/** Signs the request in as `user` (also after joining by invitation). */
export function logIn(req: Request, user: SessionUser): Promise<void> {
  // passport regenerates the session id here; keepSessionInfo carries the CSRF token over.
  return new Promise((resolve, reject) =>
    req.logIn(user, { session: true, keepSessionInfo: true }, (err) => (err ? reject(err) : resolve())),
  );
}

function authenticate(pp: passport.PassportStatic, req: Request): Promise<SessionUser | false> {
  return new Promise((resolve, reject) => {
    pp.authenticate('local', { session: false }, (err: unknown, user: SessionUser | false) =>
      err ? reject(err) : resolve(user),
    )(req, req.res!, reject);
  });
}

export function authRouter(ctx: AppContext, pp: passport.PassportStatic): Router {
  const router = Router();

  /** GET /api/auth/csrf — anyone: the token to send as X-CSRF-Token. */
  router.get('/csrf', (req, res) => {
    res.set('Cache-Control', 'no-store').json({ token: csrf.generateToken(req) });
  });

  /** POST /api/auth/login — anyone, rate limited per e-mail and per address. */
  router.post('/login', validate('body', loginBodySchema), ...loginLimiters(ctx), async (req, res) => {
    const user = await authenticate(pp, req);
    if (!user)
      throw new AppError(
        'invalid_credentials',
        'That e-mail and password do not match an active account',
        401,
      );
    await logIn(req, user);
    req.session.signedInAt = Date.now();
    await recordSignIn(ctx.db, user);
    res.json({ user });
  });

  /** POST /api/auth/logout — signed in: ends the session and its cookie. */
  router.post('/logout', async (req, res) => {
    const userId = req.user?.id;
    const sid = req.sessionID;
    await new Promise<void>((resolve, reject) => req.logout((err) => (err ? reject(err) : resolve())));
    await new Promise<void>((resolve) => req.session.destroy(() => resolve()));
    if (userId) {
      await audit(ctx.db, { actorId: userId, action: 'auth.sign-out', targetType: 'user', targetId: userId });
    }
    ctx.realtime.endSession(sid, 'signed-out');
    res.clearCookie(SESSION_COOKIE, { path: '/', httpOnly: true, sameSite: 'lax' }).status(204).end();
  });

  /** GET /api/auth/me — signed in: who I am. */
  router.get('/me', (req, res) => {
    if (!req.user) throw AppError.unauthenticated();
    res.set('Cache-Control', 'no-store').json({ user: req.user });
  });

  router.use('/password-reset', passwordResetRouter(ctx));

  /** POST /api/auth/password — signed in: change my password (other sessions end). */
  router.post('/password', validate('body', passwordChangeBodySchema), async (req, res) => {
    authorize(req.user, 'password.change');
    await changePassword(ctx.db, req.user, parsed(res, 'body', passwordChangeBodySchema), req.sessionID);
    ctx.realtime.endUserSessions(req.user.id, 'password-changed', req.sessionID);
    res.status(204).end();
  });

  return router;
}
