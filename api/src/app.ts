import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';
import express, { type Express, type RequestHandler } from 'express';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import type passport from 'passport';
import { randomUUID } from 'node:crypto';
import type { AppContext } from './context';
import { AppError, errorMiddleware } from './lib/errors';
import {
  absoluteTimeout,
  authRouter,
  createPassport,
  createSessionMiddleware,
  csrf,
} from './features/auth/index';
import { adminRouter } from './features/admin/index';
import { healthRouter } from './features/health/index';
import { homeRouter } from './features/home/index';
import { ticketsRouter } from './features/tickets/index';
import { attachmentsRouter } from './features/attachments/index';
import { equipmentRouter } from './features/equipment/index';
import { snippetsRouter } from './features/snippets/index';
import { deskRouter } from './features/desk/index';
import { checksRouter } from './features/checks/index';
import { articlesRouter } from './features/articles/index';
import { searchRouter } from './features/search/index';
import { mailPreferencesRouter, unsubscribeRouter } from './features/mail/index';
import { invitationsRouter } from './features/invitations/index';

export interface CreatedApp {
  app: Express;
  /** The same session and user loading the HTTP routes use, for socket.io's handshake. */
  sessionMiddleware: RequestHandler;
  passport: passport.PassportStatic;
}

/** The Express app: middleware, then the feature routers, then the one error middleware. */
export function createApp(ctx: AppContext): CreatedApp {
  const { config } = ctx;
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', config.TRUST_PROXY ? 1 : false);

  app.use(
    pinoHttp({
      logger: ctx.logger,
      genReqId: (req, res) => {
        const id = (req.headers['x-request-id'] as string | undefined)?.slice(0, 64) || randomUUID();
        res.setHeader('X-Request-Id', id);
        return id;
      },
      autoLogging: { ignore: (req) => req.url === '/api/health' },
      // The secret of an e-mailed link (/join/<token>, /reset/<token>, ?token=) never reaches the log.
      serializers: {
        req: (req: { url?: string }) => {
          if (req.url)
            req.url = req.url
              .replace(/^\/(join|reset)\/[^/?#]+/, '/$1/[redacted]')
              .replace(/([?&]token=)[^&#]*/g, '$1[redacted]');
          return req;
        },
      },
      customLogLevel: (_req, res, err) => (err || res.statusCode >= 500 ? 'error' : 'info'),
    }),
  );
  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: false,
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          // Element Plus positions popovers with inline styles.
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'"],
          connectSrc: ["'self'", 'ws:', 'wss:'],
          workerSrc: ["'self'", 'blob:'],
          manifestSrc: ["'self'"],
          objectSrc: ["'none'"],
          baseUri: ["'none'"],
          formAction: ["'self'"],
          frameAncestors: ["'none'"],
          ...(config.NODE_ENV === 'production' ? { upgradeInsecureRequests: [] } : {}),
        },
      },
      strictTransportSecurity: config.NODE_ENV === 'production',
    }),
  );

  const sessionMiddleware = createSessionMiddleware(config, ctx.db.$client);
  const pp = createPassport(ctx.db);
  const api = express.Router();
  api.use(express.json({ limit: '1mb' }));
  api.use(sessionMiddleware, pp.initialize(), pp.session(), absoluteTimeout);
  api.use(healthRouter(ctx));
  // Reached from e-mails without a session; the signed token is the authority (see the router).
  api.use('/mail', unsubscribeRouter(ctx));
  api.use(csrf.csrfSynchronisedProtection);
  api.use('/auth', authRouter(ctx, pp));
  api.use('/home', homeRouter(ctx));
  api.use('/admin', adminRouter(ctx));
  api.use('/tickets', ticketsRouter(ctx));
  api.use('/attachments', attachmentsRouter(ctx));
  api.use('/equipment', equipmentRouter(ctx));
  api.use('/snippets', snippetsRouter(ctx));
  api.use('/desk', deskRouter(ctx));
  api.use('/checks', checksRouter(ctx));
  api.use('/articles', articlesRouter(ctx));
  api.use('/search', searchRouter(ctx));
  api.use('/me', mailPreferencesRouter(ctx));
  api.use('/invitations', invitationsRouter(ctx));
  api.use((req) => {
    throw new AppError('not_found', `No such API route: ${req.method} ${req.baseUrl}${req.path}`, 404);
  });
  app.use('/api', api);

  serveWebApp(app, config.WEB_DIST);
  app.use(errorMiddleware(ctx.logger));
  return { app, sessionMiddleware, passport: pp };
}

/** The built web app: hashed assets cached for a year, every other path gets index.html. */
function serveWebApp(app: Express, webDist: string | undefined) {
  const dist = resolve(webDist ?? 'dist/web');
  const index = join(dist, 'index.html');
  app.use(
    '/assets',
    express.static(join(dist, 'assets'), { immutable: true, maxAge: '1y', fallthrough: false, index: false }),
  );
  app.use(express.static(dist, { index: false, maxAge: '1h' }));
  app.get('/{*splat}', (_req, res, next) => {
    if (!existsSync(index)) {
      next(new AppError('not_found', 'The web app is not built: run `npm start` or `npm run build`', 404));
      return;
    }
    res.set('Cache-Control', 'no-cache').sendFile(index);
  });
}
