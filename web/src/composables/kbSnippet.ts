/** One piece of a search snippet: plain text, or a matched word to highlight. */
export interface SnippetPart {
  text: string;
  match: boolean;
}

const OPEN = '⟦';
const CLOSE = '⟧';

/**
 * The search API marks matches in a plain-text snippet with ⟦ and ⟧; split it into parts to
 * render as text (never as HTML). An unclosed mark runs to the end; stray closers are dropped.
 */
export function splitSnippet(snippet: string): SnippetPart[] {
  const parts: SnippetPart[] = [];
  const push = (text: string, match: boolean) => {
    if (!text) return;
    const last = parts.at(-1);
    if (last && last.match === match) last.text += text;
    else parts.push({ text, match });
  };
  let rest = snippet;
  while (rest) {
    const open = rest.indexOf(OPEN);
    if (open === -1) {
      push(rest.replaceAll(CLOSE, ''), false);
      break;
    }
    push(rest.slice(0, open).replaceAll(CLOSE, ''), false);
    rest = rest.slice(open + OPEN.length);
    const close = rest.indexOf(CLOSE);
    const inside = close === -1 ? rest : rest.slice(0, close);
    push(inside.replaceAll(OPEN, ''), true);
    rest = close === -1 ? '' : rest.slice(close + CLOSE.length);
  }
  return parts;
}
