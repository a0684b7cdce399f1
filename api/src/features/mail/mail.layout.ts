import MarkdownIt from 'markdown-it';
import type { Config } from '../../config';

/**
 * Lightoff's e-mail look: a charcoal band with the name, a white card on warm off-white, an
 * ember-copper action button, a muted footer. Inline styles and tables only, because mail
 * programs drop style sheets. Every piece of content is plain text, escaped here.
 */
export interface MailContent {
  heading: string;
  /** Plain-text paragraphs (no HTML); line breaks inside one are kept. */
  paragraphs: string[];
  /** Quoted entries under the paragraphs: desk replies, linked articles. */
  items?: MailItem[];
  /** A highlighted note, e.g. the gas-work caution. */
  caution?: string;
  /** The one thing to do next: a link into the app (build it with `appUrl`). */
  action?: { label: string; url: string };
  /** Why they got this e-mail. */
  footer: string;
  /** Optional e-mails only: where to turn this kind of e-mail off without signing in. */
  unsubscribeUrl?: string;
}

export interface MailItem {
  title: string;
  /** Small grey line under the title (who, when). */
  meta?: string;
  text?: string;
  url?: string;
}

const { escapeHtml } = new MarkdownIt().utils;

/** A link into the app: `APP_URL` (which may carry a path) plus the app path. */
export function appUrl(config: Pick<Config, 'APP_URL'>, path: string, query?: Record<string, string>) {
  const base = config.APP_URL.replace(/\/+$/, '');
  const search = query ? `?${new URLSearchParams(query).toString()}` : '';
  return `${base}${path.startsWith('/') ? path : `/${path}`}${search}`;
}

const C = {
  page: '#fbf7f2',
  card: '#ffffff',
  band: '#2b2622',
  onBand: '#fbf7f2',
  accent: '#e0733f',
  ember: '#a4431b',
  text: '#2b2622',
  muted: '#5b5550',
  rule: '#e6ddd3',
  wash: '#f6e3d6',
  font: "'Open Sans', system-ui, -apple-system, 'Segoe UI', sans-serif",
};

const paragraphHtml = (text: string, style: string) =>
  `<p style="${style}">${escapeHtml(text).replace(/\r?\n/g, '<br>')}</p>`;

function itemHtml(item: MailItem): string {
  const title = item.url
    ? `<a href="${escapeHtml(item.url)}" style="color:${C.ember};font-weight:700;text-decoration:underline;">${escapeHtml(item.title)}</a>`
    : `<strong style="color:${C.text};">${escapeHtml(item.title)}</strong>`;
  const meta = item.meta
    ? `<div style="font-size:13px;color:${C.muted};margin-top:2px;">${escapeHtml(item.meta)}</div>`
    : '';
  const text = item.text
    ? paragraphHtml(item.text, `margin:8px 0 0;font-size:15px;line-height:1.55;color:${C.text};`)
    : '';
  return (
    `<tr><td style="padding:10px 14px;border-left:4px solid ${C.accent};background:${C.page};">` +
    `${title}${meta}${text}</td></tr><tr><td style="height:10px;line-height:10px;font-size:0;">&nbsp;</td></tr>`
  );
}

function toHtml(m: MailContent): string {
  const p = `margin:0 0 14px;font-size:16px;line-height:1.55;color:${C.text};`;
  const items = m.items?.length
    ? `<table role="presentation" width="100%" cellpadding="0" cellspacing="0" style="margin:4px 0 8px;">${m.items.map(itemHtml).join('')}</table>`
    : '';
  const caution = m.caution
    ? `<div style="margin:8px 0 16px;padding:10px 14px;background:${C.wash};border-radius:6px;font-size:14px;line-height:1.5;color:${C.text};"><strong>Caution.</strong> ${escapeHtml(m.caution)}</div>`
    : '';
  const action = m.action
    ? `<table role="presentation" cellpadding="0" cellspacing="0" style="margin:12px 0 4px;"><tr><td style="background:${C.ember};border-radius:6px;">` +
      `<a href="${escapeHtml(m.action.url)}" style="display:inline-block;padding:12px 22px;font-size:16px;font-weight:700;color:#ffffff;text-decoration:none;">${escapeHtml(m.action.label)}</a>` +
      `</td></tr></table><p style="margin:6px 0 0;font-size:13px;color:${C.muted};word-break:break-all;">${escapeHtml(m.action.url)}</p>`
    : '';
  const unsubscribe = m.unsubscribeUrl
    ? ` <a href="${escapeHtml(m.unsubscribeUrl)}" style="color:${C.muted};text-decoration:underline;">Stop these e-mails</a>.`
    : '';
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1"><title>${escapeHtml(m.heading)}</title></head>
<body style="margin:0;padding:0;background:${C.page};font-family:${C.font};">
<table role="presentation" width="100%" cellpadding="0" cellspacing="0" style="background:${C.page};"><tr><td align="center" style="padding:24px 12px;">
<table role="presentation" width="100%" cellpadding="0" cellspacing="0" style="max-width:600px;">
<tr><td style="background:${C.band};border-radius:10px 10px 0 0;padding:14px 24px;font-size:18px;font-weight:700;color:${C.onBand};letter-spacing:0.02em;"><span style="color:${C.accent};">&#9679;</span> Lightoff</td></tr>
<tr><td style="background:${C.card};border:1px solid ${C.rule};border-top:0;border-radius:0 0 10px 10px;padding:24px;">
<h1 style="margin:0 0 16px;font-size:22px;line-height:1.3;color:${C.text};">${escapeHtml(m.heading)}</h1>
${m.paragraphs.map((t) => paragraphHtml(t, p)).join('\n')}
${items}${caution}${action}
</td></tr>
<tr><td style="padding:16px 24px;font-size:13px;line-height:1.5;color:${C.muted};">${escapeHtml(m.footer)}${unsubscribe}</td></tr>
</table></td></tr></table>
</body></html>`;
}

function toText(m: MailContent): string {
  const out = [
    m.heading,
    '='.repeat(Math.min(m.heading.length, 60)),
    '',
    ...m.paragraphs.flatMap((t) => [t, '']),
  ];
  for (const item of m.items ?? []) {
    out.push(`> ${item.title}${item.meta ? ` (${item.meta})` : ''}`);
    if (item.text) out.push(...item.text.split(/\r?\n/).map((l) => `> ${l}`));
    if (item.url) out.push(`> ${item.url}`);
    out.push('');
  }
  if (m.caution) out.push(`Caution: ${m.caution}`, '');
  if (m.action) out.push(`${m.action.label}: ${m.action.url}`, '');
  out.push('--', m.footer);
  if (m.unsubscribeUrl) out.push(`Stop these e-mails: ${m.unsubscribeUrl}`);
  return `${out.join('\n')}\n`;
}

/** Renders one e-mail in Lightoff's look, as the text part and the HTML part. */
export function renderMail(content: MailContent): { text: string; html: string } {
  return { text: toText(content), html: toHtml(content) };
}
