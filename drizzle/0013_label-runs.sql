CREATE TYPE "public"."label_run_status" AS ENUM('rendering', 'ready', 'failed');--> statement-breakpoint
CREATE TABLE "label_run_pdfs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"run_id" uuid NOT NULL,
	"content" "bytea" NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "label_run_pdfs_workshop_key" UNIQUE("workshop_id","id")
);
--> statement-breakpoint
CREATE TABLE "label_runs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"formula_id" uuid NOT NULL,
	"version_id" uuid NOT NULL,
	"version_number" integer NOT NULL,
	"formula_name" text NOT NULL,
	"markets" jsonb NOT NULL,
	"stock_id" text NOT NULL,
	"stock" jsonb NOT NULL,
	"layout" text NOT NULL,
	"barcode" text NOT NULL,
	"placement" jsonb NOT NULL,
	"start_position" integer NOT NULL,
	"copies" integer NOT NULL,
	"label_count" integer NOT NULL,
	"page_count" integer NOT NULL,
	"lot_code" text,
	"expires_on" date,
	"batch_id" uuid,
	"contents" jsonb NOT NULL,
	"status" "label_run_status" DEFAULT 'rendering' NOT NULL,
	"progress_done" integer DEFAULT 0 NOT NULL,
	"progress_total" integer NOT NULL,
	"override_reason" text,
	"overridden_missing" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"public_token" text NOT NULL,
	"withdrawn_at" timestamp with time zone,
	"created_by" uuid,
	"created_by_name" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "label_runs_workshop_key" UNIQUE("workshop_id","id")
);
--> statement-breakpoint
CREATE TABLE "product_identities" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"formula_id" uuid NOT NULL,
	"identity" jsonb NOT NULL,
	"updated_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "product_identities_workshop_key" UNIQUE("workshop_id","id")
);
--> statement-breakpoint
ALTER TABLE "workshops" ADD COLUMN "address" text;--> statement-breakpoint
ALTER TABLE "label_run_pdfs" ADD CONSTRAINT "label_run_pdfs_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "label_run_pdfs" ADD CONSTRAINT "label_run_pdfs_run_fk" FOREIGN KEY ("workshop_id","run_id") REFERENCES "public"."label_runs"("workshop_id","id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "label_runs" ADD CONSTRAINT "label_runs_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "label_runs" ADD CONSTRAINT "label_runs_formula_fk" FOREIGN KEY ("workshop_id","formula_id") REFERENCES "public"."formulas"("workshop_id","id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "label_runs" ADD CONSTRAINT "label_runs_version_fk" FOREIGN KEY ("workshop_id","version_id") REFERENCES "public"."formula_versions"("workshop_id","id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "label_runs" ADD CONSTRAINT "label_runs_created_by_fk" FOREIGN KEY ("workshop_id","created_by") REFERENCES "public"."users"("workshop_id","id") ON DELETE set null (created_by) ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "product_identities" ADD CONSTRAINT "product_identities_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "product_identities" ADD CONSTRAINT "product_identities_formula_fk" FOREIGN KEY ("workshop_id","formula_id") REFERENCES "public"."formulas"("workshop_id","id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "product_identities" ADD CONSTRAINT "product_identities_updated_by_fk" FOREIGN KEY ("workshop_id","updated_by") REFERENCES "public"."users"("workshop_id","id") ON DELETE set null (updated_by) ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "label_run_pdfs_run_key" ON "label_run_pdfs" USING btree ("run_id");--> statement-breakpoint
CREATE UNIQUE INDEX "label_runs_public_token_key" ON "label_runs" USING btree ("public_token");--> statement-breakpoint
CREATE INDEX "label_runs_workshop_formula_idx" ON "label_runs" USING btree ("workshop_id","formula_id","created_at" DESC NULLS LAST);--> statement-breakpoint
CREATE INDEX "label_runs_workshop_created_idx" ON "label_runs" USING btree ("workshop_id","created_at" DESC NULLS LAST);--> statement-breakpoint
CREATE UNIQUE INDEX "product_identities_formula_key" ON "product_identities" USING btree ("workshop_id","formula_id");