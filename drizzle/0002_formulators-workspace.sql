CREATE TYPE "public"."material_category" AS ENUM('base', 'acid', 'binder', 'hardener', 'oil', 'butter', 'emulsifier', 'surfactant', 'colourant', 'fragrance', 'essential-oil', 'preservative', 'additive', 'other');--> statement-breakpoint
CREATE TYPE "public"."lot_unit" AS ENUM('g', 'kg', 'mL', 'L', 'units');--> statement-breakpoint
CREATE TYPE "public"."document_kind" AS ENUM('sds', 'certificate-of-analysis', 'ifra-certificate', 'allergen-declaration', 'specification', 'other');--> statement-breakpoint
CREATE TYPE "public"."product_type" AS ENUM('fizzer', 'foaming-fizzer', 'bubble-bar', 'bath-salts', 'shower-steamer', 'soap', 'lotion', 'other');--> statement-breakpoint
CREATE TYPE "public"."formula_version_state" AS ENUM('draft', 'released', 'superseded');--> statement-breakpoint
CREATE TABLE "suppliers" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"name" text NOT NULL,
	"contact" text,
	"email" text,
	"website" text,
	"notes" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "materials" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"supplier_id" uuid,
	"trade_name" text NOT NULL,
	"inci" text NOT NULL,
	"us_name" text,
	"cas" text,
	"ec" text,
	"functions" text[] DEFAULT '{}'::text[] NOT NULL,
	"category" "material_category" NOT NULL,
	"notes" text,
	"colour_index" text,
	"components" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"ifra_certificate" jsonb,
	"allergen_declaration" jsonb,
	"weight_per_volume" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"calibrations" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "lot_consumptions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"lot_id" uuid NOT NULL,
	"quantity" numeric(16, 4) NOT NULL,
	"batch_id" uuid,
	"consumed_at" timestamp with time zone DEFAULT now() NOT NULL,
	"note" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "lots" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"material_id" uuid NOT NULL,
	"supplier_lot_number" text NOT NULL,
	"quantity" numeric(16, 4) NOT NULL,
	"unit" "lot_unit" NOT NULL,
	"received_on" date NOT NULL,
	"expires_on" date,
	"unit_cost" numeric(14, 4),
	"notes" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "lots_expiry_after_receipt" CHECK ("lots"."expires_on" is null or "lots"."expires_on" >= "lots"."received_on"),
	CONSTRAINT "lots_quantity_positive" CHECK ("lots"."quantity" > 0)
);
--> statement-breakpoint
CREATE TABLE "documents" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"material_id" uuid,
	"lot_id" uuid,
	"kind" "document_kind" NOT NULL,
	"title" text NOT NULL,
	"issued_on" date NOT NULL,
	"version" text,
	"filename" text NOT NULL,
	"mime_type" text NOT NULL,
	"size_bytes" integer NOT NULL,
	"sha256" text NOT NULL,
	"content" "bytea" NOT NULL,
	"uploaded_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "documents_one_owner" CHECK (num_nonnulls("documents"."material_id", "documents"."lot_id") = 1)
);
--> statement-breakpoint
CREATE TABLE "formula_lines" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"version_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"material_id" uuid NOT NULL,
	"grams" numeric(18, 6) NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "formula_versions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"formula_id" uuid NOT NULL,
	"number" integer NOT NULL,
	"state" "formula_version_state" DEFAULT 'draft' NOT NULL,
	"profile" jsonb NOT NULL,
	"notes" text,
	"evaluation" jsonb,
	"block_count" integer,
	"warn_count" integer,
	"info_count" integer,
	"evaluation_problems" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"evaluated_at" timestamp with time zone,
	"released_at" timestamp with time zone,
	"released_by" uuid,
	"override_reason" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "formulas" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"name" text NOT NULL,
	"product_type" "product_type" NOT NULL,
	"notes" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "suppliers" ADD CONSTRAINT "suppliers_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "materials" ADD CONSTRAINT "materials_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "materials" ADD CONSTRAINT "materials_supplier_id_suppliers_id_fk" FOREIGN KEY ("supplier_id") REFERENCES "public"."suppliers"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lot_consumptions" ADD CONSTRAINT "lot_consumptions_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lot_consumptions" ADD CONSTRAINT "lot_consumptions_lot_id_lots_id_fk" FOREIGN KEY ("lot_id") REFERENCES "public"."lots"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lots" ADD CONSTRAINT "lots_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lots" ADD CONSTRAINT "lots_material_id_materials_id_fk" FOREIGN KEY ("material_id") REFERENCES "public"."materials"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "documents" ADD CONSTRAINT "documents_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "documents" ADD CONSTRAINT "documents_material_id_materials_id_fk" FOREIGN KEY ("material_id") REFERENCES "public"."materials"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "documents" ADD CONSTRAINT "documents_lot_id_lots_id_fk" FOREIGN KEY ("lot_id") REFERENCES "public"."lots"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "documents" ADD CONSTRAINT "documents_uploaded_by_users_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "formula_lines" ADD CONSTRAINT "formula_lines_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "formula_lines" ADD CONSTRAINT "formula_lines_version_id_formula_versions_id_fk" FOREIGN KEY ("version_id") REFERENCES "public"."formula_versions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "formula_lines" ADD CONSTRAINT "formula_lines_material_id_materials_id_fk" FOREIGN KEY ("material_id") REFERENCES "public"."materials"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "formula_versions" ADD CONSTRAINT "formula_versions_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "formula_versions" ADD CONSTRAINT "formula_versions_formula_id_formulas_id_fk" FOREIGN KEY ("formula_id") REFERENCES "public"."formulas"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "formula_versions" ADD CONSTRAINT "formula_versions_released_by_users_id_fk" FOREIGN KEY ("released_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "formulas" ADD CONSTRAINT "formulas_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "suppliers_workshop_name_idx" ON "suppliers" USING btree ("workshop_id","name");--> statement-breakpoint
CREATE INDEX "suppliers_workshop_created_idx" ON "suppliers" USING btree ("workshop_id","created_at");--> statement-breakpoint
CREATE INDEX "materials_workshop_trade_name_idx" ON "materials" USING btree ("workshop_id","trade_name","id");--> statement-breakpoint
CREATE INDEX "materials_workshop_inci_idx" ON "materials" USING btree ("workshop_id","inci","id");--> statement-breakpoint
CREATE INDEX "materials_workshop_category_idx" ON "materials" USING btree ("workshop_id","category","trade_name");--> statement-breakpoint
CREATE INDEX "materials_workshop_updated_idx" ON "materials" USING btree ("workshop_id","updated_at");--> statement-breakpoint
CREATE INDEX "materials_workshop_created_idx" ON "materials" USING btree ("workshop_id","created_at");--> statement-breakpoint
CREATE INDEX "materials_supplier_idx" ON "materials" USING btree ("supplier_id");--> statement-breakpoint
CREATE INDEX "lot_consumptions_lot_idx" ON "lot_consumptions" USING btree ("lot_id");--> statement-breakpoint
CREATE INDEX "lot_consumptions_workshop_idx" ON "lot_consumptions" USING btree ("workshop_id");--> statement-breakpoint
CREATE INDEX "lots_workshop_received_idx" ON "lots" USING btree ("workshop_id","received_on","id");--> statement-breakpoint
CREATE INDEX "lots_workshop_expires_idx" ON "lots" USING btree ("workshop_id","expires_on","id");--> statement-breakpoint
CREATE INDEX "lots_workshop_lot_number_idx" ON "lots" USING btree ("workshop_id","supplier_lot_number","id");--> statement-breakpoint
CREATE INDEX "lots_workshop_quantity_idx" ON "lots" USING btree ("workshop_id","quantity","id");--> statement-breakpoint
CREATE INDEX "lots_workshop_created_idx" ON "lots" USING btree ("workshop_id","created_at","id");--> statement-breakpoint
CREATE INDEX "lots_material_idx" ON "lots" USING btree ("material_id","received_on");--> statement-breakpoint
CREATE INDEX "documents_material_idx" ON "documents" USING btree ("workshop_id","material_id","kind");--> statement-breakpoint
CREATE INDEX "documents_lot_idx" ON "documents" USING btree ("workshop_id","lot_id");--> statement-breakpoint
CREATE UNIQUE INDEX "formula_lines_position_key" ON "formula_lines" USING btree ("version_id","position");--> statement-breakpoint
CREATE INDEX "formula_lines_material_idx" ON "formula_lines" USING btree ("workshop_id","material_id");--> statement-breakpoint
CREATE UNIQUE INDEX "formula_versions_number_key" ON "formula_versions" USING btree ("formula_id","number");--> statement-breakpoint
CREATE UNIQUE INDEX "formula_versions_one_draft_key" ON "formula_versions" USING btree ("formula_id") WHERE "formula_versions"."state" = 'draft';--> statement-breakpoint
CREATE UNIQUE INDEX "formula_versions_one_released_key" ON "formula_versions" USING btree ("formula_id") WHERE "formula_versions"."state" = 'released';--> statement-breakpoint
CREATE INDEX "formula_versions_workshop_idx" ON "formula_versions" USING btree ("workshop_id");--> statement-breakpoint
CREATE INDEX "formulas_workshop_name_idx" ON "formulas" USING btree ("workshop_id","name");--> statement-breakpoint
CREATE INDEX "formulas_workshop_updated_idx" ON "formulas" USING btree ("workshop_id","updated_at");