export { authRouter, csrf, logIn } from './auth.routes';
export { absoluteTimeout, createPassport, createSessionMiddleware, SESSION_COOKIE } from './session';
