import connectPgSimple from 'connect-pg-simple';
import type { RequestHandler } from 'express';
import session from 'express-session';
import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type pg from 'pg';
import type { Config } from '../../config';
import type { Db } from '../../db/client';
import type { SessionUser } from '../../../../shared/src/schemas/auth';
import { AppError } from '../../lib/errors';
import { checkCredentials, loadSessionUser } from './auth.service';

export const SESSION_COOKIE = 'lightoff.sid';
export const IDLE_TIMEOUT_MS = 30 * 60 * 1000;
export const ABSOLUTE_TIMEOUT_MS = 12 * 60 * 60 * 1000;

declare module 'express-session' {
  interface SessionData {
    signedInAt?: number;
  }
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SessionUser {}
  }
}

/** A session's expiry in the database is pushed forward at most this often. */
export const TOUCH_EVERY_MS = 60 * 1000;

/**
 * Sessions in PostgreSQL: idle timeout 30 min (rolling), HttpOnly, SameSite=Lax, Secure in production.
 * The cookie rolls on every request, but the row's expiry is written at most once a minute per
 * session and process: a write (and its WAL flush) on every read request was the largest fixed cost
 * of a signed-in request. A session therefore ends after 29–30 idle minutes.
 */
export function createSessionMiddleware(config: Config, pool: pg.Pool): RequestHandler {
  const PgStore = connectPgSimple(session);
  class ThrottledPgStore extends PgStore {
    private readonly touchedAt = new Map<string, number>();
    override touch(sid: string, sess: session.SessionData, fn?: (err?: unknown) => void) {
      const now = Date.now();
      const last = this.touchedAt.get(sid);
      if (last !== undefined && now - last < TOUCH_EVERY_MS) {
        fn?.();
        return;
      }
      if (this.touchedAt.size > 10_000) {
        for (const [key, at] of this.touchedAt) if (now - at >= TOUCH_EVERY_MS) this.touchedAt.delete(key);
      }
      this.touchedAt.set(sid, now);
      super.touch(sid, sess, fn);
    }
    override destroy(sid: string, fn?: (err?: unknown) => void) {
      this.touchedAt.delete(sid);
      super.destroy(sid, fn);
    }
  }
  return session({
    name: SESSION_COOKIE,
    secret: config.SESSION_SECRET,
    store: new ThrottledPgStore({
      pool,
      tableName: 'session',
      createTableIfMissing: false,
      pruneSessionInterval: 15 * 60,
    }),
    resave: false,
    saveUninitialized: false,
    rolling: true,
    proxy: config.TRUST_PROXY,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: config.NODE_ENV === 'production',
      maxAge: IDLE_TIMEOUT_MS,
    },
  });
}

/** passport-local checks the password; each request reloads the user so deactivation bites at once. */
export function createPassport(db: Db): passport.PassportStatic {
  const instance = new passport.Passport() as unknown as passport.PassportStatic;
  instance.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, (email, password, done) => {
      checkCredentials(db, email, password).then(
        (user) => done(null, user),
        (err) =>
          err instanceof AppError && err.code === 'invalid_credentials' ? done(null, false) : done(err),
      );
    }),
  );
  instance.serializeUser((user, done) => done(null, user.id));
  instance.deserializeUser((id: number, done) => {
    loadSessionUser(db, Number(id)).then((user) => done(null, user ?? false), done);
  });
  return instance;
}

/** Ends a session past the absolute 12-hour limit, whatever its activity. */
export const absoluteTimeout: RequestHandler = (req, _res, next) => {
  const started = req.session?.signedInAt;
  if (req.user && started && Date.now() - started > ABSOLUTE_TIMEOUT_MS) {
    req.session.destroy(() => next(AppError.unauthenticated('Your session has ended: please sign in again')));
    return;
  }
  next();
};
