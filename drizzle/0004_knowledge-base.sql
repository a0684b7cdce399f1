CREATE TYPE "public"."article_kind" AS ENUM('procedure', 'troubleshooting', 'spec-sheet', 'bulletin');--> statement-breakpoint
CREATE TYPE "public"."article_status" AS ENUM('draft', 'in-review', 'published', 'retired');--> statement-breakpoint
CREATE TYPE "public"."audience" AS ENUM('contractor', 'staff');--> statement-breakpoint
CREATE TABLE "article_feedback" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "article_feedback_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"article_id" integer NOT NULL,
	"user_id" integer NOT NULL,
	"helped" boolean NOT NULL,
	"comment" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "article_models" (
	"article_id" integer NOT NULL,
	"equipment_model_id" integer NOT NULL,
	CONSTRAINT "article_models_article_id_equipment_model_id_pk" PRIMARY KEY("article_id","equipment_model_id")
);
--> statement-breakpoint
CREATE TABLE "article_revisions" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "article_revisions_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"article_id" integer NOT NULL,
	"title" text NOT NULL,
	"summary" text NOT NULL,
	"body" text NOT NULL,
	"author_id" integer NOT NULL,
	"note" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "articles" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "articles_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"slug" text NOT NULL,
	"title" text NOT NULL,
	"summary" text NOT NULL,
	"body" text NOT NULL,
	"kind" "article_kind" NOT NULL,
	"audience" "audience" NOT NULL,
	"status" "article_status" DEFAULT 'draft' NOT NULL,
	"author_id" integer NOT NULL,
	"reviewer_id" integer,
	"review_note" text,
	"published_at" timestamp with time zone,
	"model_text" text DEFAULT '' NOT NULL,
	"source_ticket_id" integer,
	"view_count" integer DEFAULT 0 NOT NULL,
	"helped_count" integer DEFAULT 0 NOT NULL,
	"not_helped_count" integer DEFAULT 0 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"search_vector" "tsvector" GENERATED ALWAYS AS (setweight(to_tsvector('english', immutable_unaccent("articles"."title")), 'A')
        || setweight(to_tsvector('english', immutable_unaccent("articles"."summary" || ' ' || "articles"."model_text")), 'B')
        || setweight(to_tsvector('english', immutable_unaccent("articles"."body")), 'C')) STORED,
	CONSTRAINT "articles_slug_unique" UNIQUE("slug")
);
--> statement-breakpoint
CREATE TABLE "search_queries" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "search_queries_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"user_id" integer,
	"text" text NOT NULL,
	"filters" jsonb,
	"context" text DEFAULT 'kb' NOT NULL,
	"hits" integer NOT NULL,
	"clicked_article_id" integer,
	"deflected" boolean DEFAULT false NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "search_synonyms" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "search_synonyms_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"terms" text[] NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "search_words" (
	"word" text PRIMARY KEY NOT NULL
);
--> statement-breakpoint
ALTER TABLE "article_feedback" ADD CONSTRAINT "article_feedback_article_id_articles_id_fk" FOREIGN KEY ("article_id") REFERENCES "public"."articles"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "article_feedback" ADD CONSTRAINT "article_feedback_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "article_models" ADD CONSTRAINT "article_models_article_id_articles_id_fk" FOREIGN KEY ("article_id") REFERENCES "public"."articles"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "article_models" ADD CONSTRAINT "article_models_equipment_model_id_equipment_models_id_fk" FOREIGN KEY ("equipment_model_id") REFERENCES "public"."equipment_models"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "article_revisions" ADD CONSTRAINT "article_revisions_article_id_articles_id_fk" FOREIGN KEY ("article_id") REFERENCES "public"."articles"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "article_revisions" ADD CONSTRAINT "article_revisions_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "articles" ADD CONSTRAINT "articles_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "articles" ADD CONSTRAINT "articles_reviewer_id_users_id_fk" FOREIGN KEY ("reviewer_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "articles" ADD CONSTRAINT "articles_source_ticket_id_tickets_id_fk" FOREIGN KEY ("source_ticket_id") REFERENCES "public"."tickets"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "search_queries" ADD CONSTRAINT "search_queries_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "search_queries" ADD CONSTRAINT "search_queries_clicked_article_id_articles_id_fk" FOREIGN KEY ("clicked_article_id") REFERENCES "public"."articles"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "article_feedback_once" ON "article_feedback" USING btree ("article_id","user_id");--> statement-breakpoint
CREATE INDEX "article_revisions_article_idx" ON "article_revisions" USING btree ("article_id","id");--> statement-breakpoint
CREATE INDEX "articles_search_idx" ON "articles" USING gin ("search_vector");--> statement-breakpoint
CREATE INDEX "articles_title_trgm" ON "articles" USING gin ("title" gin_trgm_ops);--> statement-breakpoint
CREATE INDEX "articles_status_audience_idx" ON "articles" USING btree ("status","audience");--> statement-breakpoint
CREATE INDEX "search_queries_created_idx" ON "search_queries" USING btree ("created_at");--> statement-breakpoint
CREATE INDEX "search_words_trgm" ON "search_words" USING gin ("word" gin_trgm_ops);--> statement-breakpoint
-- The trade's words for the same things; specialists edit these in the app.
INSERT INTO "search_synonyms" ("terms") VALUES
  ('{lp,lpg,propane,"liquid propane"}'),
  ('{ng,"natural gas",methane}'),
  ('{"w.c.",wc,iwc,"water column","inches of water","in. w.c."}'),
  ('{hsi,"hot surface igniter","hot surface ignitor",igniter,ignitor}'),
  ('{ifc,"integrated furnace control","control board","circuit board"}'),
  ('{ecm,"electronically commutated motor","variable speed motor"}'),
  ('{psc,"permanent split capacitor"}'),
  ('{txv,"thermostatic expansion valve","expansion valve"}'),
  ('{afue,"annual fuel utilization efficiency"}'),
  ('{btu,btuh,"btu/h",mbh}'),
  ('{manifold,"manifold pressure","outlet pressure"}'),
  ('{inlet,"inlet pressure","supply pressure"}'),
  ('{co,"carbon monoxide"}'),
  ('{lwco,"low water cutoff","low-water cutoff"}'),
  ('{"t&p","relief valve","t and p","temperature and pressure relief"}'),
  ('{"flame sensor","flame rod"}'),
  ('{"pressure switch","vacuum switch"}'),
  ('{condensate,"condensate trap",drain}'),
  ('{orifice,orifices,spud}'),
  ('{clocking,"clock the meter","meter timing","clocking the meter"}'),
  ('{derate,"high altitude",altitude}'),
  ('{rollout,"roll-out","flame rollout"}'),
  ('{lockout,"locks out","lock out"}'),
  ('{"temperature rise",rise,"delta t"}');
