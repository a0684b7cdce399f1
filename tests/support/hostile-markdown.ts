// Article text written to break out of the renderer: scripts, dangerous links, event handlers,
// SVG and MathML, embedded frames, style tricks and broken HTML, also inside the product's own
// blocks. Each payload, if it ever ran, would set a global flag, open a dialog or ask for a marker
// URL; each entry also carries a plain sentence that must still be shown. Used by the render unit
// test and by the end-to-end test in Chromium.

/** The global a payload would set if it ran. */
export const FLAG = '__kbOwned';
/** The same-origin path a payload would request if it ran (or if a foreign resource got through). */
export const MARKER_PATH = '/kb-xss-marker/';

const set = (name: string) => `window.${FLAG}='${name}'`;
const hit = (name: string) => `${MARKER_PATH}${name}`;

export interface HostileEntry {
  /** What the entry tries. */
  name: string;
  markdown: string;
  /** Plain text that must survive and be shown to the reader. */
  visible: string;
}

const entries: [name: string, markdown: string][] = [
  ['script tag', `<script>${set('script')}</script>`],
  ['script tag, upper case, with src', `<SCRIPT SRC="${hit('script.js')}"></SCRIPT>`],
  ['script split across tags', `<scr<script>ipt>${set('split')}</scr</script>ipt>`],
  ['script after a closed paragraph', `</p><script>alert('after-p')</script><p>`],
  ['javascript: link', `[Open the manual](javascript:${set('js-link')})`],
  ['javascript: link, mixed case', `[Open the manual](JaVaScRiPt:alert('js-mixed'))`],
  ['javascript: link, decimal entities', `[Manual](&#106;&#97;vascript:alert('js-dec'))`],
  ['javascript: link, hex entities', `[Manual](&#x6A;&#x61;&#x76;ascript:alert('js-hex'))`],
  ['javascript: link, entity in the middle', `[Manual](javas&#99;ript:alert('js-mid'))`],
  ['javascript: link, tab entity inside', `[Manual](jav&#x09;ascript:alert('js-tab'))`],
  ['javascript: link, leading spaces in angle brackets', `[Manual](<  javascript:alert('js-space')>)`],
  ['javascript: reference link', `[Manual][ref]\n\n[ref]: javascript:alert('js-ref')`],
  ['javascript: autolink', `<javascript:alert('js-auto')>`],
  ['javascript: bare text', `javascript:alert('js-bare')`],
  ['javascript: image', `![plate](javascript:alert('js-img'))`],
  ['vbscript: link', `[Manual](vbscript:msgbox("vb"))`],
  ['vbscript: link, upper case', `[Manual](VBScript:MsgBox("vb-upper"))`],
  ['data: link with HTML', `[Manual](data:text/html;base64,PHNjcmlwdD5hbGVydCgnZGF0YScpPC9zY3JpcHQ+)`],
  ['data: link, mixed case', `[Manual](DaTa:text/html,<script>alert('data-mixed')</script>)`],
  ['data: image, SVG', `![plate](data:image/svg+xml;base64,PHN2ZyBvbmxvYWQ9YWxlcnQoMSk+PC9zdmc+)`],
  [
    'data: image, PNG',
    `![plate](data:image/png;base64,iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==)`,
  ],
  ['image from another site', `![plate](https://images.example.invalid/plate.png)`],
  ['image from our own host but not an article image', `![plate](${hit('plain.png')})`],
  ['image path with a handler tacked on', `![plate](/api/articles/1/images/1" onerror="${set('img-quote')})`],
  ['image path climbing out', `![plate](/api/articles/1/images/1/../../../../..${hit('climb.png')})`],
  ['img onerror', `<img src=x onerror="${set('img-onerror')}">`],
  ['img onerror, unquoted and unclosed', `<img src=x onerror=alert('img-open')//`],
  ['event handler on a div', `<div onmouseover="${set('div-hover')}">hover here</div>`],
  ['event handler on a link', `<a href="#" onclick="${set('a-click')}">click here</a>`],
  ['details ontoggle', `<details open ontoggle="${set('toggle')}"><summary>x</summary></details>`],
  ['link title breaking out', `[Manual](https://example.invalid "a\\" onmouseover=\\"${set('title')}")`],
  ['svg onload', `<svg onload="${set('svg-onload')}"><circle r="4"/></svg>`],
  ['svg with script', `<svg><script>${set('svg-script')}</script></svg>`],
  ['svg link', `<svg><a xlink:href="javascript:alert('svg-a')"><text y="20">tap</text></a></svg>`],
  ['svg animate', `<svg><animate onbegin="${set('svg-animate')}" attributeName="x" dur="1s"/></svg>`],
  [
    'MathML mglyph confusion',
    `<math><mtext><table><mglyph><style><img src=x onerror="${set('mathml')}"></style></mglyph></table></mtext></math>`,
  ],
  ['MathML link', `<math href="javascript:alert('math-href')"><mi>x</mi></math>`],
  ['iframe javascript:', `<iframe src="javascript:alert('iframe')"></iframe>`],
  ['iframe srcdoc', `<iframe srcdoc="<script>parent.${FLAG}='srcdoc'</script>"></iframe>`],
  ['object', `<object data="${hit('object')}"></object>`],
  ['embed', `<embed src="${hit('embed')}">`],
  ['style url(javascript:)', `<div style="background:url(javascript:alert('style-url'))">x</div>`],
  ['style expression()', `<p style="width: expression(alert('expression'))">x</p>`],
  ['style element import', `<style>@import '${hit('style.css')}'; body { background: red }</style>`],
  ['link stylesheet', `<link rel="stylesheet" href="${hit('link.css')}">`],
  ['meta refresh', `<meta http-equiv="refresh" content="0;url=javascript:alert('meta')">`],
  ['base href', `<base href="${hit('base/')}">`],
  ['form', `<form action="${hit('form')}"><button>send</button></form>`],
  ['unclosed tags', `<div><span><a href="javascript:alert('open')"><b>never closed`],
  ['comment trick', `<!--<img src="--><img src=x onerror=${set('comment')}//">`],
  ['Vue template braces', `{{ constructor.constructor('${set('template')}')() }}`],
  ['caution block with script', `::: caution\n<script>${set('caution')}</script>\n:::`],
  [
    'caution block with an argument',
    `::: caution onclick=alert('caution-arg')\nShut the gas off first.\n:::`,
  ],
  ['caution block name breaking out', `::: caution" onclick="${set('caution-quote')}\ntext\n:::`],
  [
    'steps block with a javascript: link',
    `::: steps\n1. [Start](javascript:${set('steps')})\n2. <img src=x onerror=alert('steps-img')>\n:::`,
  ],
  [
    'tools block with an image handler',
    `::: tools\n- <img src=x onerror="${set('tools')}">\n- [Meter](vbscript:msgbox(1))\n:::`,
  ],
  [
    'spec block with a hostile name',
    `::: spec x"><script>${set('spec-name')}</script>\n| a | b |\n| --- | --- |\n| 1 | 2 |\n:::`,
  ],
  [
    'spec block with hostile cells',
    `::: spec manifold\n| Stage | Value |\n| --- | --- |\n| <script>${set('spec-cell')}</script> | [x](javascript:alert('spec-link')) |\n| <img src=x onerror=alert('spec-img')> | ![p](data:image/png;base64,AAAA) |\n:::`,
  ],
];

export const HOSTILE_MARKDOWN: HostileEntry[] = entries.map(([name, markdown], i) => {
  const visible = `Plain line ${String(i + 1).padStart(2, '0')} stays readable`;
  return { name, markdown: `${visible}.\n\n${markdown}\n\nAfter it: ${visible.toLowerCase()}.`, visible };
});

/** Every entry in one article body, for the editor's preview. */
export const HOSTILE_BODY = HOSTILE_MARKDOWN.map((e) => e.markdown).join('\n\n');

/** A title and summary that try the same; the page shows them as text. */
export const HOSTILE_TITLE = `Vent check <img src=x onerror="${set('title-field')}"> done`;
export const HOSTILE_SUMMARY = `Summary <script>${set('summary-field')}</script> in plain words.`;

/** What the rendered HTML may contain at all: the tags the renderer produces, nothing else. */
export const ALLOWED_TAGS = new Set([
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
]);
/** The attributes each tag may carry in the rendered HTML. */
export const ALLOWED_ATTRIBUTES: Record<string, string[]> = {
  a: ['href', 'title', 'rel'],
  img: ['src', 'alt', 'title', 'loading'],
  div: ['class', 'data-spec'],
  p: ['class'],
  th: ['style'],
  td: ['style'],
};
/**
 * Whether a link is harmless: a web or mail address, or one with no scheme at all (a path on our
 * site). Browsers drop tabs and newlines inside a URL before reading its scheme, so this does too.
 */
export function isSafeHref(href: string): boolean {
  const squashed = [...href].filter((c) => c.charCodeAt(0) > 0x20).join('');
  const scheme = /^([a-z][a-z0-9+.-]*):/i.exec(squashed)?.[1]?.toLowerCase();
  return scheme === undefined || ['http', 'https', 'mailto'].includes(scheme);
}
