import { describe, expect, it } from 'vitest';
import { Window } from 'happy-dom';
import {
  ALLOWED_ATTRIBUTES,
  ALLOWED_TAGS,
  HOSTILE_BODY,
  HOSTILE_MARKDOWN,
  isSafeHref,
} from '../../../../tests/support/hostile-markdown';
import { ARTICLE_IMAGE_SRC, renderArticle } from './render';

/** The rendered HTML as a parsed tree (no scripts run, nothing is fetched). */
function parse(html: string) {
  const window = new Window({
    settings: {
      disableJavaScriptEvaluation: true,
      disableJavaScriptFileLoading: true,
      disableCSSFileLoading: true,
      disableIframePageLoading: true,
    },
  });
  const root = window.document.createElement('div');
  root.innerHTML = html;
  return root;
}

/** Everything in the HTML that is not on the renderer's short list of tags, attributes and URLs. */
function problems(html: string): string[] {
  const found: string[] = [];
  for (const el of parse(html).querySelectorAll('*')) {
    const tag = el.tagName.toLowerCase();
    if (!ALLOWED_TAGS.has(tag)) found.push(`tag <${tag}>`);
    for (const attr of Array.from(el.attributes)) {
      const name = attr.name.toLowerCase();
      const value = attr.value ?? '';
      if (!(ALLOWED_ATTRIBUTES[tag] ?? []).includes(name)) found.push(`<${tag} ${name}>`);
      if (name === 'href' && !isSafeHref(value)) found.push(`<${tag} href="${value}">`);
      if (name === 'src' && !ARTICLE_IMAGE_SRC.test(value)) found.push(`<${tag} src="${value}">`);
      if (name === 'style' && !/^text-align:(left|right|center);?$/.test(value.replace(/\s/g, '')))
        found.push(`<${tag} style="${value}">`);
    }
  }
  return found;
}

describe('rendering hostile article text', () => {
  it.each(HOSTILE_MARKDOWN.map((e) => [e.name, e] as const))(
    'When the text holds %s, then the HTML has only the renderer’s own tags, attributes and URLs, and the plain text stays',
    (_name, entry) => {
      const html = renderArticle(entry.markdown, { gasCaution: false });
      expect(problems(html)).toEqual([]);
      expect(parse(html).textContent).toContain(entry.visible);
    },
  );

  it('When every payload is in one article, then nothing slips through where they meet', () => {
    const html = renderArticle(HOSTILE_BODY, { gasCaution: true });
    expect(problems(html)).toEqual([]);
    const text = parse(html).textContent ?? '';
    for (const entry of HOSTILE_MARKDOWN) expect(text).toContain(entry.visible);
  });

  it('When raw HTML is typed, then the reader sees it as text rather than losing it', () => {
    const html = renderArticle('Do not type <script>alert(1)</script> here.', { gasCaution: false });
    expect(html).toContain('&lt;script&gt;alert(1)&lt;/script&gt;');
    expect(parse(html).textContent).toContain('<script>alert(1)</script>');
  });
});

describe('pictures in article text', () => {
  it('When an image points at an article-image path, then it is kept and loads lazily', () => {
    const html = renderArticle('![Rating plate](/api/articles/12/images/34 "Plate")', { gasCaution: false });
    const img = parse(html).querySelector('img');
    expect(img?.getAttribute('src')).toBe('/api/articles/12/images/34');
    expect(img?.getAttribute('alt')).toBe('Rating plate');
    expect(img?.getAttribute('title')).toBe('Plate');
    expect(img?.getAttribute('loading')).toBe('lazy');
  });

  it.each([
    ['another site over https', 'https://images.example.invalid/plate.png'],
    ['another site over http', 'http://images.example.invalid/plate.png'],
    ['a protocol-relative address', '//images.example.invalid/plate.png'],
    ['a ticket attachment', '/api/attachments/5'],
    ['an article-image path with a query', '/api/articles/1/images/2?size=big'],
    ['an article-image path with a fragment', '/api/articles/1/images/2#x'],
    ['an article-image path with more after it', '/api/articles/1/images/2/../../9'],
    ['a relative path', 'plate.png'],
  ])(
    'When an image points at %s, then it is dropped and its alt text is not shown as an image',
    (_what, src) => {
      const html = renderArticle(`Before ![plate](${src}) after`, { gasCaution: false });
      expect(parse(html).querySelector('img')).toBeNull();
      expect(parse(html).textContent).toContain('Before');
      expect(parse(html).textContent).toContain('after');
    },
  );
});
