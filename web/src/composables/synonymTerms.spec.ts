import { describe, expect, it } from 'vitest';
import { synonymInputSchema } from '@shared/schemas/search';
import { parseTerms, previewTerms } from './synonymTerms';

describe('parseTerms', () => {
  it('When words are separated by commas, equals signs, semicolons or lines, then each is one term', () => {
    expect(parseTerms('LP = LPG; propane,\nbottled gas')).toEqual(['LP', 'LPG', 'propane', 'bottled gas']);
  });

  it('When there are blank pieces and runs of spaces, then they are dropped and squeezed', () => {
    expect(parseTerms(' , natural   gas ,, NG , ')).toEqual(['natural gas', 'NG']);
  });
});

describe('previewTerms', () => {
  it('When the same word is typed twice in different case, then it shows once, in lower case', () => {
    expect(previewTerms('LP, lp, Propane')).toEqual(['lp', 'propane']);
  });

  it('When the preview has two different terms, then the shared schema accepts them the same way', () => {
    const parsed = synonymInputSchema.parse({ terms: parseTerms('LP, lp, Propane') });
    expect(parsed.terms).toEqual(previewTerms('LP, lp, Propane'));
  });

  it('When only one word is left after folding, then the shared schema refuses the group', () => {
    expect(synonymInputSchema.safeParse({ terms: parseTerms('LP, lp') }).success).toBe(false);
  });
});
