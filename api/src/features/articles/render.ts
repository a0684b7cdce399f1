import MarkdownIt from 'markdown-it';
import container from 'markdown-it-container';
import sanitizeHtml from 'sanitize-html';
import { GAS_CAUTION } from '../../../../shared/src/calc/common';

/**
 * Article Markdown: raw HTML off, then the output sanitized on the server, so nothing a writer
 * types can run in a reader's browser. Custom blocks: ::: caution, ::: steps, ::: tools and
 * ::: spec <name> (a table the checks can read as data).
 */
const md = new MarkdownIt({ html: false, linkify: true, typographer: false });

const BLOCKS = ['caution', 'steps', 'tools'] as const;
for (const name of BLOCKS) {
  md.use(container, name, {
    render: (tokens: { nesting: number }[], idx: number) =>
      tokens[idx]!.nesting === 1
        ? `<div class="kb-${name}">${name === 'caution' ? '<p class="kb-caution-label">Caution</p>' : ''}\n`
        : '</div>\n',
  });
}
md.use(container, 'spec', {
  validate: (params: string) => /^spec(\s+[a-z0-9-]+)?$/.test(params.trim()),
  render: (tokens: { nesting: number; info: string }[], idx: number) => {
    const name = tokens[idx]!.info.trim().split(/\s+/)[1] ?? 'table';
    return tokens[idx]!.nesting === 1
      ? `<div class="kb-spec" data-spec="${md.utils.escapeHtml(name)}">\n`
      : '</div>\n';
  },
});

/** `/api/articles/<id>/images/<n>` and nothing else (no query, no fragment, no dot segments). */
export const ARTICLE_IMAGE_SRC = /^\/api\/articles\/[1-9]\d{0,9}\/images\/[1-9]\d{0,9}$/;

const SANITIZE: sanitizeHtml.IOptions = {
  allowedTags: [
    'h1',
    'h2',
    'h3',
    'h4',
    'p',
    'ul',
    'ol',
    'li',
    'strong',
    'em',
    'code',
    'pre',
    'blockquote',
    'a',
    'table',
    'thead',
    'tbody',
    'tr',
    'th',
    'td',
    'div',
    'hr',
    'br',
    'img',
    'span',
  ],
  allowedAttributes: {
    a: ['href', 'title'],
    img: ['src', 'alt', 'title', 'loading'],
    div: ['class', 'data-spec'],
    p: ['class'],
    th: ['style'],
    td: ['style'],
  },
  allowedStyles: {
    th: { 'text-align': [/^(left|right|center)$/] },
    td: { 'text-align': [/^(left|right|center)$/] },
  },
  allowedClasses: {
    div: ['kb-caution', 'kb-steps', 'kb-tools', 'kb-spec', 'kb-gas-caution'],
    p: ['kb-caution-label'],
  },
  allowedSchemes: ['https', 'http', 'mailto'],
  // Images only from the article-image route, served with the article's own visibility: no other
  // site's images (tracking pixels, mixed content), no data: payloads, no ticket attachments.
  allowedSchemesByTag: { img: [] },
  allowProtocolRelative: false,
  exclusiveFilter: (frame) => frame.tag === 'img' && !ARTICLE_IMAGE_SRC.test(frame.attribs.src ?? ''),
  transformTags: {
    a: sanitizeHtml.simpleTransform('a', { rel: 'noopener noreferrer nofollow' }),
    img: sanitizeHtml.simpleTransform('img', { loading: 'lazy' }),
  },
};

const GAS_WORDS =
  /\b(gas|propane|lp|burners?|manifold|combustion|flue|vent(ing)?|pilot|ignit(er|or|ion)|orifices?|co\b|carbon monoxide|draft|flame)/i;

export function touchesGas(...texts: string[]): boolean {
  return texts.some((t) => GAS_WORDS.test(t));
}

export function renderArticle(body: string, opts: { gasCaution: boolean }): string {
  const html = sanitizeHtml(md.render(body), SANITIZE);
  return opts.gasCaution
    ? `<div class="kb-gas-caution"><p>${md.utils.escapeHtml(GAS_CAUTION)}</p></div>\n${html}`
    : html;
}

export interface SpecTable {
  name: string;
  columns: string[];
  rows: string[][];
}

/** The ::: spec blocks of an article as data: column names and cell text, for the checks. */
export function extractSpecTables(body: string): SpecTable[] {
  const tokens = md.parse(body, {});
  const tables: SpecTable[] = [];
  let current: SpecTable | null = null;
  let row: string[] | null = null;
  let inHead = false;
  for (const t of tokens) {
    if (t.type === 'container_spec_open')
      current = { name: t.info.trim().split(/\s+/)[1] ?? 'table', columns: [], rows: [] };
    else if (t.type === 'container_spec_close' && current) {
      tables.push(current);
      current = null;
    } else if (!current) continue;
    else if (t.type === 'thead_open') inHead = true;
    else if (t.type === 'thead_close') inHead = false;
    else if (t.type === 'tr_open') row = [];
    else if (t.type === 'tr_close' && row) {
      if (inHead) current.columns = row;
      else current.rows.push(row);
      row = null;
    } else if (t.type === 'inline' && row) row.push(t.content.trim());
  }
  return tables;
}
