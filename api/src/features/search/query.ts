// Turning what someone typed into groups of alternatives: each group is one idea (a word, a
// phrase, or a trade synonym set such as LP = LPG = propane), and a hit must match the ideas.

export interface QueryGroup {
  /** The words or phrases that stand for this idea; any one may match. */
  terms: string[];
  /** A model-number-like token (letters and digits): also matched by prefix. */
  prefix?: string;
}

const STOP = new Set([
  'the',
  'a',
  'an',
  'and',
  'or',
  'of',
  'to',
  'on',
  'in',
  'at',
  'is',
  'it',
  'my',
  'how',
  'do',
  'does',
  'i',
  'what',
  'with',
  'for',
  'then',
  'when',
  'after',
  'won',
  't',
  'not',
  'wont',
  'keeps',
  'will',
]);

interface Phrase {
  terms: string[];
  /** The phrase as a whole word or words: not inside a longer word or model number. */
  re: RegExp;
}

// Built once per synonym table (the engine keeps the same array until the table changes), not for
// every query.
const phrasesOf = new WeakMap<string[][], Phrase[]>();
function phrases(synonymGroups: string[][]): Phrase[] {
  let list = phrasesOf.get(synonymGroups);
  if (!list) {
    list = synonymGroups
      .flatMap((terms) => terms.map((t) => ({ term: t.toLowerCase(), terms })))
      .sort((a, b) => b.term.length - a.term.length)
      .map(({ term, terms }) => {
        const escaped = term.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
        return { terms, re: new RegExp(`(^|[^a-z0-9])${escaped}(?=$|[^a-z0-9])`, 'g') };
      });
    phrasesOf.set(synonymGroups, list);
  }
  return list;
}

/** Splits a query into groups using the synonym table (longest phrase first). */
export function groupQuery(text: string, synonymGroups: string[][]): QueryGroup[] {
  let rest = ` ${text.toLowerCase().replace(/[“”"]/g, ' ')} `;
  const groups: QueryGroup[] = [];
  for (const { terms, re } of phrases(synonymGroups)) {
    re.lastIndex = 0; // shared between calls: a global RegExp remembers where it stopped
    if (re.test(rest)) {
      rest = rest.replace(re, ' ');
      if (!groups.some((g) => g.terms === terms)) groups.push({ terms });
    }
  }
  for (const word of rest.match(/[a-z0-9][a-z0-9-]*/g) ?? []) {
    if (STOP.has(word)) continue;
    const squashed = word.replace(/-/g, '');
    const looksLikeModel = /[a-z]/.test(squashed) && /[0-9]/.test(squashed) && squashed.length >= 3;
    groups.push({ terms: [word], ...(looksLikeModel ? { prefix: squashed } : {}) });
  }
  return groups;
}
