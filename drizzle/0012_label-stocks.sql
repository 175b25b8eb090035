CREATE TABLE "label_stocks" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"name" text NOT NULL,
	"geometry" jsonb NOT NULL,
	"archived_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "label_stocks_workshop_key" UNIQUE("workshop_id","id")
);
--> statement-breakpoint
ALTER TABLE "label_stocks" ADD CONSTRAINT "label_stocks_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "label_stocks_workshop_name_idx" ON "label_stocks" USING btree ("workshop_id","name");