import { createHmac, timingSafeEqual } from 'node:crypto';
import type { Config } from '../../config';
import { MAIL_KINDS, type MailKind } from '../../../../shared/src/schemas/mail';
import { appUrl } from './mail.layout';

/**
 * The "stop these e-mails" token: `<userId>.<kind>.<HMAC-SHA256>` keyed with SESSION_SECRET, so it
 * works without signing in and cannot be forged or pointed at another user or kind. It does not
 * expire: an old e-mail's link should still turn that e-mail off.
 */
const PURPOSE = 'lightoff:unsubscribe:v1';

const sign = (secret: string, payload: string) =>
  createHmac('sha256', secret).update(`${PURPOSE}:${payload}`).digest('base64url');

export function unsubscribeToken(config: Pick<Config, 'SESSION_SECRET'>, userId: number, kind: MailKind) {
  const payload = `${userId}.${kind}`;
  return `${payload}.${sign(config.SESSION_SECRET, payload)}`;
}

/** The user and kind a token names, or null when it was not made by us (changed, cut short). */
export function readUnsubscribeToken(
  config: Pick<Config, 'SESSION_SECRET'>,
  token: string,
): { userId: number; kind: MailKind } | null {
  const [id, kind, mac, ...rest] = token.split('.');
  if (rest.length || !id || !kind || !mac || !/^\d{1,10}$/.test(id)) return null;
  if (!(MAIL_KINDS as readonly string[]).includes(kind)) return null;
  const expected = Buffer.from(sign(config.SESSION_SECRET, `${id}.${kind}`));
  const given = Buffer.from(mac);
  if (given.length !== expected.length || !timingSafeEqual(given, expected)) return null;
  return { userId: Number(id), kind: kind as MailKind };
}

/**
 * Links and headers for an optional e-mail: the page people open from the footer, and the
 * one-click POST address mail programs use (RFC 8058 `List-Unsubscribe-Post`).
 */
export function unsubscribeLinks(
  config: Pick<Config, 'SESSION_SECRET' | 'APP_URL'>,
  userId: number,
  kind: MailKind,
) {
  const token = unsubscribeToken(config, userId, kind);
  const oneClick = appUrl(config, '/api/mail/unsubscribe', { token });
  return {
    pageUrl: appUrl(config, '/unsubscribe', { token }),
    headers: {
      'List-Unsubscribe': `<${oneClick}>`,
      'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click',
    },
  };
}
