import { z } from 'zod';

// Synonym groups: words of the trade that mean the same thing to search (LP = LPG = propane).
// Every term of a group finds what any other term of it finds, in both search engines.

const synonymTerm = z
  .string()
  .trim()
  .min(1, 'A term cannot be empty')
  .max(60, 'At most 60 characters per term')
  .transform((t) => t.toLowerCase());

export const synonymTermsSchema = z
  .array(synonymTerm, { message: 'Give a list of terms' })
  .max(200, 'At most 20 terms in a group')
  .transform((terms) => [...new Set(terms)])
  .refine((terms) => terms.length >= 2, { message: 'Give at least two different terms' })
  .refine((terms) => terms.length <= 20, { message: 'At most 20 terms in a group' });

export const synonymInputSchema = z.object({ terms: synonymTermsSchema });
export type SynonymInput = z.infer<typeof synonymInputSchema>;

export const searchSynonymSchema = z.object({
  id: z.number().int(),
  terms: z.array(z.string()),
  updatedAt: z.string(),
});
export type SearchSynonym = z.infer<typeof searchSynonymSchema>;

export const synonymListSchema = z.object({ synonyms: z.array(searchSynonymSchema) });
export type SynonymList = z.infer<typeof synonymListSchema>;
