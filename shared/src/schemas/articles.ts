import { z } from 'zod';
import { listQuerySchema } from './common';

export const ARTICLE_KINDS = ['procedure', 'troubleshooting', 'spec-sheet', 'bulletin'] as const;
export const AUDIENCES = ['contractor', 'staff'] as const;
export const ARTICLE_STATUSES = ['draft', 'in-review', 'published', 'retired'] as const;
export type ArticleKind = (typeof ARTICLE_KINDS)[number];
export type Audience = (typeof AUDIENCES)[number];
export type ArticleStatus = (typeof ARTICLE_STATUSES)[number];

/** Knowledge-base pages whose address an article's slug would hide (`/kb/<slug>`). */
export const RESERVED_SLUGS: readonly string[] = ['new', 'missed', 'synonyms'];

export const slugSchema = z
  .string()
  .trim()
  .min(3)
  .max(100)
  .regex(/^[a-z0-9]+(-[a-z0-9]+)*$/, 'Lower-case letters, digits and single dashes')
  .refine((slug) => !RESERVED_SLUGS.includes(slug), 'This address is taken by a knowledge-base page');

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

export const REMOVED_KINDS = ['name', 'company', 'phone', 'email', 'address', 'serial'] as const;
export type RemovedKind = (typeof REMOVED_KINDS)[number];
/** A piece of contact detail taken out of a ticket's text when it was written up. */
export const removedItemSchema = z.object({ kind: z.enum(REMOVED_KINDS), text: z.string() });
export type RemovedItem = z.infer<typeof removedItemSchema>;

/** Where an article came from: the tickets written up into it. */
export const articleOriginSchema = z.object({
  ticketCount: z.number().int(),
  /** Only the tickets this reader may open (none for contractors). */
  tickets: z.array(z.object({ id: z.number().int(), number: z.string() })),
  /** What the write-up removed; only for readers who may edit the article. */
  removed: z.array(removedItemSchema).optional(),
});
export type ArticleOrigin = z.infer<typeof articleOriginSchema>;

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
  /** Set when the article was written up from tickets. */
  origin: articleOriginSchema.nullable().optional(),
});
export type Article = z.infer<typeof articleSchema>;

/** A picture in an article's text, as `POST /api/articles/:id/images` answers it. */
export const articleImageSchema = z.object({
  id: z.number().int(),
  /** `/api/articles/<article id>/images/<id>`: the only image address article text may use. */
  url: z.string(),
  width: z.number().int().nullable(),
  height: z.number().int().nullable(),
});
export type ArticleImage = z.infer<typeof articleImageSchema>;

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

/**
 * Counts over the matched set, as the reader may see it. Each facet leaves out its own filter (and
 * only its own), so the other values of a chosen filter stay visible with their counts. Equipment
 * type, brand and fuel come from the equipment models linked to the article.
 */
export const searchFacetsSchema = z.object({
  kind: z.record(z.string(), z.number().int()),
  equipmentType: z.record(z.string(), z.number().int()),
  brand: z.record(z.string(), z.number().int()),
  fuel: z.record(z.string(), z.number().int()),
});
export type SearchFacets = z.infer<typeof searchFacetsSchema>;

export const searchResponseSchema = z.object({
  hits: z.array(searchHitSchema),
  total: z.number().int(),
  /** True when there are more matches than `total` (and the facets) count: show it as "300+". */
  totalIsLowerBound: z.boolean(),
  facets: searchFacetsSchema,
  /** The engine that answered. */
  engine: z.enum(['postgres', 'meilisearch']),
  /** True when Meilisearch is configured but did not answer, so PostgreSQL answered instead. */
  fallback: z.boolean(),
  tookMs: z.number(),
  queryId: z.number().int().nullable(),
});
export type SearchResponse = z.infer<typeof searchResponseSchema>;

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
