import { describe, expect, it } from 'vitest';
import { readUnsubscribeToken, unsubscribeLinks, unsubscribeToken } from './mail.tokens';

const config = { SESSION_SECRET: 'a'.repeat(40), APP_URL: 'https://desk.example' };

describe('unsubscribe tokens', () => {
  it('When a token we made comes back, then it names its user and kind', () => {
    expect(readUnsubscribeToken(config, unsubscribeToken(config, 42, 'resolved'))).toEqual({
      userId: 42,
      kind: 'resolved',
    });
  });

  it('When any part is changed, cut or signed with another secret, then it is refused', () => {
    const token = unsubscribeToken(config, 42, 'resolved');
    const [, , mac] = token.split('.');
    expect(readUnsubscribeToken(config, `43.resolved.${mac}`)).toBeNull();
    expect(readUnsubscribeToken(config, `42.replies.${mac}`)).toBeNull();
    expect(readUnsubscribeToken(config, token.slice(0, -2))).toBeNull();
    expect(readUnsubscribeToken(config, `${token}.x`)).toBeNull();
    expect(readUnsubscribeToken(config, '42.marketing.abc')).toBeNull();
    expect(readUnsubscribeToken({ SESSION_SECRET: 'b'.repeat(40) }, token)).toBeNull();
  });

  it('When links are made, then the page and the one-click address carry the same token', () => {
    const { pageUrl, headers } = unsubscribeLinks(config, 7, 'replies');
    const token = new URL(pageUrl).searchParams.get('token');
    expect(pageUrl.startsWith('https://desk.example/unsubscribe?token=')).toBe(true);
    expect(headers['List-Unsubscribe']).toBe(`<https://desk.example/api/mail/unsubscribe?token=${token}>`);
    expect(headers['List-Unsubscribe-Post']).toBe('List-Unsubscribe=One-Click');
  });
});
