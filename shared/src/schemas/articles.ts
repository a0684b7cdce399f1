import { z } from 'zod';
import { listQuerySchema } from './common';

export const ARTICLE_KINDS = ['procedure', 'troubleshooting', 'spec-sheet', 'bulletin'] as const;
export const AUDIENCES = ['contractor', 'staff'] as const;
export const ARTICLE_STATUSES = ['draft', 'in-review', 'published', 'retired'] as const;
export type ArticleKind = (typeof ARTICLE_KINDS)[number];
export type Audience = (typeof AUDIENCES)[number];
export type ArticleStatus = (typeof ARTICLE_STATUSES)[number];

export const slugSchema = z
  .string()
  .trim()
  .min(3)
  .max(100)
  .regex(/^[a-z0-9]+(-[a-z0-9]+)*$/, 'Lower-case letters, digits and single dashes');

const title = z.string().trim().min(5, 'Give a title of at least 5 characters').max(160);
const summary = z.string().trim().min(10, 'Say in a sentence what it answers').max(400);
const body = z.string().max(100_000, 'At most 100,000 characters');

export const articleCreateSchema = z.object({
  title,
  summary,
  body,
  kind: z.enum(ARTICLE_KINDS),
  audience: z.enum(AUDIENCES),
  equipmentModelIds: z.array(z.number().int().positive()).max(50).default([]),
});
export type ArticleCreate = z.infer<typeof articleCreateSchema>;

export const articleUpdateSchema = articleCreateSchema
  .partial()
  .extend({ note: z.string().trim().max(400).optional() })
  .refine((v) => Object.keys(v).some((k) => k !== 'note'), { message: 'Nothing to change' });
export type ArticleUpdate = z.infer<typeof articleUpdateSchema>;

export const sendBackSchema = z.object({
  note: z.string().trim().min(3, 'Say what needs to change').max(2000),
});
export const feedbackSchema = z.object({
  helped: z.boolean(),
  comment: z.string().trim().max(2000).optional(),
});

export const articleListQuerySchema = listQuerySchema.extend({
  kind: z.enum(ARTICLE_KINDS).optional(),
  status: z.enum(ARTICLE_STATUSES).optional(),
  audience: z.enum(AUDIENCES).optional(),
  equipmentModelId: z.coerce.number().int().positive().optional(),
});
export type ArticleListQuery = z.infer<typeof articleListQuerySchema>;

export const articleSummarySchema = z.object({
  id: z.number().int(),
  slug: z.string(),
  title: z.string(),
  summary: z.string(),
  kind: z.enum(ARTICLE_KINDS),
  audience: z.enum(AUDIENCES),
  status: z.enum(ARTICLE_STATUSES),
  updatedAt: z.string(),
});
export type ArticleSummary = z.infer<typeof articleSummarySchema>;

export const articleSchema = articleSummarySchema.extend({
  body: z.string(),
  bodyHtml: z.string(),
  models: z.array(z.object({ id: z.number().int(), brand: z.string(), modelNumber: z.string() })),
  author: z.object({ id: z.number().int(), name: z.string() }),
  publishedAt: z.string().nullable(),
  reviewNote: z.string().nullable(),
  helpedCount: z.number().int(),
  notHelpedCount: z.number().int(),
  viewCount: z.number().int(),
  touchesGas: z.boolean(),
});
export type Article = z.infer<typeof articleSchema>;

// Search -----------------------------------------------------------------------------------------
export const searchQuerySchema = z.object({
  q: z.string().trim().max(200).default(''),
  kind: z.enum(ARTICLE_KINDS).optional(),
  equipmentType: z.string().trim().max(40).optional(),
  brand: z.string().trim().max(40).optional(),
  fuel: z.enum(['natural-gas', 'propane']).optional(),
  limit: z.coerce.number().int().min(1).max(50).default(10),
  offset: z.coerce.number().int().min(0).max(1000).default(0),
  /** Where the search came from: the new-ticket form records deflections. */
  context: z.enum(['kb', 'new-ticket', 'desk']).default('kb'),
});
export type SearchQuery = z.infer<typeof searchQuerySchema>;

export const searchHitSchema = z.object({
  id: z.number().int(),
  slug: z.string(),
  title: z.string(),
  summary: z.string(),
  snippet: z.string(),
  kind: z.enum(ARTICLE_KINDS),
  audience: z.enum(AUDIENCES),
  score: z.number(),
});
export type SearchHit = z.infer<typeof searchHitSchema>;

export interface SearchResponse {
  hits: SearchHit[];
  total: number;
  facets: { kind: Record<string, number> };
  engine: 'postgres' | 'meilisearch';
  tookMs: number;
  queryId: number | null;
}

/** The front matter of a seed article in kb/*.md. */
export const kbFrontMatterSchema = z.object({
  slug: slugSchema,
  title,
  summary,
  kind: z.enum(ARTICLE_KINDS),
  audience: z.enum(AUDIENCES),
  models: z.array(z.string().trim().min(2).max(40)).max(30).default([]),
  tags: z.array(z.string().trim().min(1).max(30)).max(20).default([]),
});
export type KbFrontMatter = z.infer<typeof kbFrontMatterSchema>;
