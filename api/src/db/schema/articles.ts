import { sql, type SQL } from 'drizzle-orm';
import {
  boolean,
  customType,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uniqueIndex,
} from 'drizzle-orm/pg-core';
import { ARTICLE_KINDS, ARTICLE_STATUSES, AUDIENCES } from '../../../../shared/src/schemas/articles';
import { equipmentModels, tickets } from './tickets';
import { users } from './users';

export const articleKindEnum = pgEnum('article_kind', ARTICLE_KINDS);
export const audienceEnum = pgEnum('audience', AUDIENCES);
export const articleStatusEnum = pgEnum('article_status', ARTICLE_STATUSES);

const tsvector = customType<{ data: string }>({ dataType: () => 'tsvector' });

export const articles = pgTable(
  'articles',
  {
    id: integer().primaryKey().generatedAlwaysAsIdentity(),
    slug: text().notNull().unique(),
    title: text().notNull(),
    summary: text().notNull(),
    body: text().notNull(),
    kind: articleKindEnum().notNull(),
    audience: audienceEnum().notNull(),
    status: articleStatusEnum().notNull().default('draft'),
    authorId: integer()
      .notNull()
      .references(() => users.id),
    reviewerId: integer().references(() => users.id),
    reviewNote: text(),
    publishedAt: timestamp({ withTimezone: true }),
    /** Model numbers of the linked equipment, with and without dashes, kept for search. */
    modelText: text().notNull().default(''),
    sourceTicketId: integer().references(() => tickets.id),
    viewCount: integer().notNull().default(0),
    helpedCount: integer().notNull().default(0),
    notHelpedCount: integer().notNull().default(0),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    /** Weighted: title A, summary and model numbers B, body C; accents folded. */
    searchVector: tsvector().generatedAlwaysAs(
      (): SQL => sql`setweight(to_tsvector('english', immutable_unaccent(${articles.title})), 'A')
        || setweight(to_tsvector('english', immutable_unaccent(${articles.summary} || ' ' || ${articles.modelText})), 'B')
        || setweight(to_tsvector('english', immutable_unaccent(${articles.body})), 'C')`,
    ),
  },
  (t) => [
    index('articles_search_idx').using('gin', t.searchVector),
    index('articles_title_trgm').using('gin', sql`${t.title} gin_trgm_ops`),
    index('articles_status_audience_idx').on(t.status, t.audience),
  ],
);

export const articleRevisions = pgTable(
  'article_revisions',
  {
    id: integer().primaryKey().generatedAlwaysAsIdentity(),
    articleId: integer()
      .notNull()
      .references(() => articles.id, { onDelete: 'cascade' }),
    title: text().notNull(),
    summary: text().notNull(),
    body: text().notNull(),
    authorId: integer()
      .notNull()
      .references(() => users.id),
    note: text(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('article_revisions_article_idx').on(t.articleId, t.id)],
);

export const articleModels = pgTable(
  'article_models',
  {
    articleId: integer()
      .notNull()
      .references(() => articles.id, { onDelete: 'cascade' }),
    equipmentModelId: integer()
      .notNull()
      .references(() => equipmentModels.id, { onDelete: 'cascade' }),
  },
  (t) => [primaryKey({ columns: [t.articleId, t.equipmentModelId] })],
);

export const articleFeedback = pgTable(
  'article_feedback',
  {
    id: integer().primaryKey().generatedAlwaysAsIdentity(),
    articleId: integer()
      .notNull()
      .references(() => articles.id, { onDelete: 'cascade' }),
    userId: integer()
      .notNull()
      .references(() => users.id),
    helped: boolean().notNull(),
    comment: text(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('article_feedback_once').on(t.articleId, t.userId)],
);

export const searchQueries = pgTable(
  'search_queries',
  {
    id: integer().primaryKey().generatedAlwaysAsIdentity(),
    userId: integer().references(() => users.id),
    text: text().notNull(),
    filters: jsonb().$type<Record<string, unknown>>(),
    context: text().notNull().default('kb'),
    hits: integer().notNull(),
    clickedArticleId: integer().references(() => articles.id, { onDelete: 'set null' }),
    deflected: boolean().notNull().default(false),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('search_queries_created_idx').on(t.createdAt)],
);

/** Groups of words the trade uses for the same thing (LP = propane = LPG); specialists edit them. */
export const searchSynonyms = pgTable('search_synonyms', {
  id: integer().primaryKey().generatedAlwaysAsIdentity(),
  terms: text().array().notNull(),
  updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
});

/** Every word of the published articles, for correcting typos in queries by trigram similarity. */
export const searchWords = pgTable('search_words', { word: text().primaryKey() }, (t) => [
  index('search_words_trgm').using('gin', sql`${t.word} gin_trgm_ops`),
]);

/** Pictures in an article's body: re-encoded by sharp like ticket photos, served from storage. */
export const articleImages = pgTable(
  'article_images',
  {
    id: integer().primaryKey().generatedAlwaysAsIdentity(),
    articleId: integer()
      .notNull()
      .references(() => articles.id, { onDelete: 'cascade' }),
    uploadedById: integer()
      .notNull()
      .references(() => users.id),
    storageKey: text().notNull().unique(),
    thumbnailKey: text(),
    fileName: text().notNull(),
    contentType: text().notNull(),
    bytes: integer().notNull(),
    width: integer(),
    height: integer(),
    sha256: text().notNull(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('article_images_article_idx').on(t.articleId)],
);
