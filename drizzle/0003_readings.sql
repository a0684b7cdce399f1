CREATE TABLE "ticket_readings" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "ticket_readings_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"ticket_id" integer NOT NULL,
	"author_id" integer NOT NULL,
	"kind" text NOT NULL,
	"values" jsonb NOT NULL,
	"result" jsonb NOT NULL,
	"verdict" text,
	"message_id" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "ticket_messages" ADD COLUMN "data" jsonb;--> statement-breakpoint
ALTER TABLE "ticket_readings" ADD CONSTRAINT "ticket_readings_ticket_id_tickets_id_fk" FOREIGN KEY ("ticket_id") REFERENCES "public"."tickets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "ticket_readings" ADD CONSTRAINT "ticket_readings_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "ticket_readings" ADD CONSTRAINT "ticket_readings_message_id_ticket_messages_id_fk" FOREIGN KEY ("message_id") REFERENCES "public"."ticket_messages"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "ticket_readings_ticket_idx" ON "ticket_readings" USING btree ("ticket_id","id");