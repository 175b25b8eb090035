CREATE TABLE "reference_lists" (
	"key" text PRIMARY KEY NOT NULL,
	"title" text NOT NULL,
	"description" text NOT NULL,
	"position" integer NOT NULL,
	"row_count" integer NOT NULL,
	"synced_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "reference_rows" (
	"list_key" text NOT NULL,
	"row_id" text NOT NULL,
	"position" integer NOT NULL,
	"label" text NOT NULL,
	"search_text" text NOT NULL,
	"source" text NOT NULL,
	"status" text NOT NULL,
	"effective_from" date,
	"effective_to" date,
	"note" text,
	"data" jsonb NOT NULL,
	CONSTRAINT "reference_rows_list_key_row_id_pk" PRIMARY KEY("list_key","row_id")
);
--> statement-breakpoint
ALTER TABLE "reference_rows" ADD CONSTRAINT "reference_rows_list_key_reference_lists_key_fk" FOREIGN KEY ("list_key") REFERENCES "public"."reference_lists"("key") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "reference_rows_label_idx" ON "reference_rows" USING btree ("list_key","label");