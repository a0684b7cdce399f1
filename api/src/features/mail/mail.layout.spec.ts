import { describe, expect, it } from 'vitest';
import { appUrl, renderMail } from './mail.layout';

describe('renderMail', () => {
  const content = {
    heading: 'The desk replied',
    paragraphs: ['Check the <vent> & the "cap".\nThen call us.'],
    items: [{ title: 'Desk tech', meta: 'Mar 3, 10:42 AM UTC', text: '<script>alert(1)</script>' }],
    action: { label: 'Open the ticket', url: 'https://desk.example/tickets/7?x=1&y=2' },
    footer: 'You opened this ticket.',
    unsubscribeUrl: 'https://desk.example/unsubscribe?token=1.replies.sig',
  };

  it('When content carries markup, then the HTML part escapes it and the text part keeps it as typed', () => {
    const { text, html } = renderMail(content);
    expect(html).toContain('Check the &lt;vent&gt; &amp; the &quot;cap&quot;.<br>Then call us.');
    expect(html).toContain('&lt;script&gt;alert(1)&lt;/script&gt;');
    expect(html).not.toContain('<script>');
    expect(text).toContain('Check the <vent> & the "cap".\nThen call us.');
    expect(text).toContain('> <script>alert(1)</script>');
  });

  it('When there is an action and an unsubscribe link, then both parts carry them and the footer', () => {
    const { text, html } = renderMail(content);
    expect(text).toContain('Open the ticket: https://desk.example/tickets/7?x=1&y=2');
    expect(text).toContain('Stop these e-mails: https://desk.example/unsubscribe?token=1.replies.sig');
    expect(html).toContain('href="https://desk.example/tickets/7?x=1&amp;y=2"');
    expect(html).toContain('href="https://desk.example/unsubscribe?token=1.replies.sig"');
    expect(html).toContain('You opened this ticket.');
    expect(renderMail({ ...content, unsubscribeUrl: undefined }).text).not.toContain('Stop these e-mails');
  });
});

describe('appUrl', () => {
  it('When APP_URL has a path or a trailing slash, then links keep the path and have one slash', () => {
    expect(appUrl({ APP_URL: 'https://x.example/desk/' }, '/tickets/4')).toBe(
      'https://x.example/desk/tickets/4',
    );
    expect(appUrl({ APP_URL: 'https://x.example' }, 'kb/a', { token: 'a b' })).toBe(
      'https://x.example/kb/a?token=a+b',
    );
  });
});
