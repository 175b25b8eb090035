CREATE TYPE "public"."batch_state" AS ENUM('draft', 'released');--> statement-breakpoint
CREATE TYPE "public"."stock_adjustment_reason" AS ENUM('spillage', 'count-correction', 'disposal', 'other');--> statement-breakpoint
CREATE TYPE "public"."stock_movement_kind" AS ENUM('batch', 'adjustment', 'amendment');--> statement-breakpoint
CREATE TYPE "public"."customer_kind" AS ENUM('stockist', 'market-stall', 'online-order', 'other');--> statement-breakpoint
CREATE TYPE "public"."recall_notice_status" AS ENUM('not-sent', 'sent', 'failed', 'drill');--> statement-breakpoint
CREATE TYPE "public"."recall_severity" AS ENUM('serious-harm', 'minor-harm', 'unlikely-harm');--> statement-breakpoint
CREATE TYPE "public"."recall_state" AS ENUM('open', 'closed');--> statement-breakpoint
CREATE TYPE "public"."complaint_status" AS ENUM('open', 'closed');--> statement-breakpoint
CREATE TABLE "batch_amendments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"batch_id" uuid NOT NULL,
	"field" text NOT NULL,
	"previous_value" jsonb,
	"value" jsonb,
	"reason" text NOT NULL,
	"amended_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "batch_amendments_workshop_key" UNIQUE("workshop_id","id")
);
--> statement-breakpoint
CREATE TABLE "batches" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"formula_id" uuid NOT NULL,
	"version_id" uuid NOT NULL,
	"version_number" integer NOT NULL,
	"batch_code" text NOT NULL,
	"sequence" integer NOT NULL,
	"state" "batch_state" DEFAULT 'draft' NOT NULL,
	"made_on" date NOT NULL,
	"units" integer,
	"unit_mass_grams" numeric(18, 6),
	"target_grams" numeric(18, 6) NOT NULL,
	"loss_percent" numeric(6, 3) NOT NULL,
	"batch_grams" numeric(18, 6) NOT NULL,
	"tolerance_percent" numeric(5, 2) NOT NULL,
	"sheet" jsonb NOT NULL,
	"record" jsonb NOT NULL,
	"ready_on" date,
	"units_made" integer,
	"best_before_month" text,
	"expires_on" date,
	"period_after_opening_months" integer,
	"created_by" uuid,
	"released_at" timestamp with time zone,
	"released_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "batches_workshop_key" UNIQUE("workshop_id","id")
);
--> statement-breakpoint
CREATE TABLE "formula_line_substitutes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"line_id" uuid NOT NULL,
	"material_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "formula_line_substitutes_workshop_key" UNIQUE("workshop_id","id")
);
--> statement-breakpoint
CREATE TABLE "customers" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"kind" "customer_kind" NOT NULL,
	"name" text NOT NULL,
	"contact" text,
	"email" text,
	"phone" text,
	"address" text,
	"notes" text,
	"archived_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "customers_workshop_key" UNIQUE("workshop_id","id")
);
--> statement-breakpoint
CREATE TABLE "deliveries" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"customer_id" uuid NOT NULL,
	"delivered_on" date NOT NULL,
	"reference" text,
	"notes" text,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "deliveries_workshop_key" UNIQUE("workshop_id","id")
);
--> statement-breakpoint
CREATE TABLE "delivery_lines" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"delivery_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"batch_id" uuid NOT NULL,
	"units" integer NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "delivery_lines_workshop_key" UNIQUE("workshop_id","id")
);
--> statement-breakpoint
CREATE TABLE "recall_notices" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"recall_id" uuid NOT NULL,
	"customer_id" uuid NOT NULL,
	"to" text NOT NULL,
	"subject" text NOT NULL,
	"body" text NOT NULL,
	"status" "recall_notice_status" DEFAULT 'not-sent' NOT NULL,
	"sent_at" timestamp with time zone,
	"failure" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "recall_notices_workshop_key" UNIQUE("workshop_id","id")
);
--> statement-breakpoint
CREATE TABLE "recall_replies" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"recall_id" uuid NOT NULL,
	"customer_id" uuid NOT NULL,
	"replied_on" date NOT NULL,
	"units_on_hand" integer NOT NULL,
	"units_returned" integer NOT NULL,
	"notes" text,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "recall_replies_workshop_key" UNIQUE("workshop_id","id")
);
--> statement-breakpoint
CREATE TABLE "recalls" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"scope" jsonb NOT NULL,
	"supplier_lot_id" uuid,
	"reason" text NOT NULL,
	"severity" "recall_severity" NOT NULL,
	"drill" boolean DEFAULT false NOT NULL,
	"state" "recall_state" DEFAULT 'open' NOT NULL,
	"what_to_do" text,
	"batch_codes" jsonb NOT NULL,
	"affected" jsonb NOT NULL,
	"drill_report" jsonb,
	"summary" text,
	"opened_at" timestamp with time zone DEFAULT now() NOT NULL,
	"opened_by" uuid,
	"closed_at" timestamp with time zone,
	"closed_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "recalls_workshop_key" UNIQUE("workshop_id","id")
);
--> statement-breakpoint
CREATE TABLE "complaints" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"formula_id" uuid NOT NULL,
	"batch_id" uuid,
	"finished_lot_code" text,
	"received_on" date NOT NULL,
	"reporter_name" text,
	"reporter_contact" text,
	"what_happened" text NOT NULL,
	"body_area" text,
	"serious" boolean NOT NULL,
	"status" "complaint_status" DEFAULT 'open' NOT NULL,
	"follow_up_notes" text,
	"reported_to_fda_on" date,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "complaints_workshop_key" UNIQUE("workshop_id","id")
);
--> statement-breakpoint
DROP INDEX "lot_consumptions_lot_idx";--> statement-breakpoint
ALTER TABLE "workshops" ADD COLUMN "weighing_tolerance_percent" numeric(5, 2) DEFAULT 2 NOT NULL;--> statement-breakpoint
ALTER TABLE "workshops" ADD COLUMN "batch_code_pattern" text DEFAULT '{YYMMDD}-{CODE}-{SEQ}' NOT NULL;--> statement-breakpoint
ALTER TABLE "workshops" ADD COLUMN "small_business" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "lot_consumptions" ADD COLUMN "kind" "stock_movement_kind" DEFAULT 'batch' NOT NULL;--> statement-breakpoint
ALTER TABLE "lot_consumptions" ADD COLUMN "line_number" integer;--> statement-breakpoint
ALTER TABLE "lot_consumptions" ADD COLUMN "grams" numeric(18, 6);--> statement-breakpoint
ALTER TABLE "lot_consumptions" ADD COLUMN "reason" "stock_adjustment_reason";--> statement-breakpoint
ALTER TABLE "lot_consumptions" ADD COLUMN "created_by" uuid;--> statement-breakpoint
-- Rows written before batches existed name no batch: they are adjustments whose reason was not asked.
UPDATE "lot_consumptions" SET "kind" = 'adjustment', "reason" = 'other' WHERE "batch_id" IS NULL;--> statement-breakpoint
ALTER TABLE "batch_amendments" ADD CONSTRAINT "batch_amendments_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "batch_amendments" ADD CONSTRAINT "batch_amendments_batch_fk" FOREIGN KEY ("workshop_id","batch_id") REFERENCES "public"."batches"("workshop_id","id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "batch_amendments" ADD CONSTRAINT "batch_amendments_amended_by_fk" FOREIGN KEY ("workshop_id","amended_by") REFERENCES "public"."users"("workshop_id","id") ON DELETE set null (amended_by) ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "batches" ADD CONSTRAINT "batches_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "batches" ADD CONSTRAINT "batches_formula_fk" FOREIGN KEY ("workshop_id","formula_id") REFERENCES "public"."formulas"("workshop_id","id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "batches" ADD CONSTRAINT "batches_version_fk" FOREIGN KEY ("workshop_id","version_id") REFERENCES "public"."formula_versions"("workshop_id","id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "batches" ADD CONSTRAINT "batches_created_by_fk" FOREIGN KEY ("workshop_id","created_by") REFERENCES "public"."users"("workshop_id","id") ON DELETE set null (created_by) ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "batches" ADD CONSTRAINT "batches_released_by_fk" FOREIGN KEY ("workshop_id","released_by") REFERENCES "public"."users"("workshop_id","id") ON DELETE set null (released_by) ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "formula_line_substitutes" ADD CONSTRAINT "formula_line_substitutes_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "formula_line_substitutes" ADD CONSTRAINT "formula_line_substitutes_line_fk" FOREIGN KEY ("workshop_id","line_id") REFERENCES "public"."formula_lines"("workshop_id","id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "formula_line_substitutes" ADD CONSTRAINT "formula_line_substitutes_material_fk" FOREIGN KEY ("workshop_id","material_id") REFERENCES "public"."materials"("workshop_id","id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "customers" ADD CONSTRAINT "customers_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deliveries" ADD CONSTRAINT "deliveries_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deliveries" ADD CONSTRAINT "deliveries_customer_fk" FOREIGN KEY ("workshop_id","customer_id") REFERENCES "public"."customers"("workshop_id","id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deliveries" ADD CONSTRAINT "deliveries_created_by_fk" FOREIGN KEY ("workshop_id","created_by") REFERENCES "public"."users"("workshop_id","id") ON DELETE set null (created_by) ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "delivery_lines" ADD CONSTRAINT "delivery_lines_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "delivery_lines" ADD CONSTRAINT "delivery_lines_delivery_fk" FOREIGN KEY ("workshop_id","delivery_id") REFERENCES "public"."deliveries"("workshop_id","id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "delivery_lines" ADD CONSTRAINT "delivery_lines_batch_fk" FOREIGN KEY ("workshop_id","batch_id") REFERENCES "public"."batches"("workshop_id","id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "recall_notices" ADD CONSTRAINT "recall_notices_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "recall_notices" ADD CONSTRAINT "recall_notices_recall_fk" FOREIGN KEY ("workshop_id","recall_id") REFERENCES "public"."recalls"("workshop_id","id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "recall_notices" ADD CONSTRAINT "recall_notices_customer_fk" FOREIGN KEY ("workshop_id","customer_id") REFERENCES "public"."customers"("workshop_id","id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "recall_replies" ADD CONSTRAINT "recall_replies_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "recall_replies" ADD CONSTRAINT "recall_replies_recall_fk" FOREIGN KEY ("workshop_id","recall_id") REFERENCES "public"."recalls"("workshop_id","id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "recall_replies" ADD CONSTRAINT "recall_replies_customer_fk" FOREIGN KEY ("workshop_id","customer_id") REFERENCES "public"."customers"("workshop_id","id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "recall_replies" ADD CONSTRAINT "recall_replies_created_by_fk" FOREIGN KEY ("workshop_id","created_by") REFERENCES "public"."users"("workshop_id","id") ON DELETE set null (created_by) ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "recalls" ADD CONSTRAINT "recalls_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "recalls" ADD CONSTRAINT "recalls_supplier_lot_fk" FOREIGN KEY ("workshop_id","supplier_lot_id") REFERENCES "public"."lots"("workshop_id","id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "recalls" ADD CONSTRAINT "recalls_opened_by_fk" FOREIGN KEY ("workshop_id","opened_by") REFERENCES "public"."users"("workshop_id","id") ON DELETE set null (opened_by) ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "recalls" ADD CONSTRAINT "recalls_closed_by_fk" FOREIGN KEY ("workshop_id","closed_by") REFERENCES "public"."users"("workshop_id","id") ON DELETE set null (closed_by) ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "complaints" ADD CONSTRAINT "complaints_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "complaints" ADD CONSTRAINT "complaints_formula_fk" FOREIGN KEY ("workshop_id","formula_id") REFERENCES "public"."formulas"("workshop_id","id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "complaints" ADD CONSTRAINT "complaints_batch_fk" FOREIGN KEY ("workshop_id","batch_id") REFERENCES "public"."batches"("workshop_id","id") ON DELETE set null (batch_id) ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "complaints" ADD CONSTRAINT "complaints_created_by_fk" FOREIGN KEY ("workshop_id","created_by") REFERENCES "public"."users"("workshop_id","id") ON DELETE set null (created_by) ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "batch_amendments_batch_idx" ON "batch_amendments" USING btree ("batch_id","created_at");--> statement-breakpoint
CREATE UNIQUE INDEX "batches_workshop_code_key" ON "batches" USING btree ("workshop_id","batch_code");--> statement-breakpoint
CREATE INDEX "batches_workshop_made_idx" ON "batches" USING btree ("workshop_id","made_on","id");--> statement-breakpoint
CREATE INDEX "batches_workshop_state_ready_idx" ON "batches" USING btree ("workshop_id","state","ready_on");--> statement-breakpoint
CREATE INDEX "batches_workshop_created_idx" ON "batches" USING btree ("workshop_id","created_at","id");--> statement-breakpoint
CREATE INDEX "batches_formula_idx" ON "batches" USING btree ("workshop_id","formula_id","made_on");--> statement-breakpoint
CREATE INDEX "batches_code_trgm_idx" ON "batches" USING gin ("batch_code" gin_trgm_ops);--> statement-breakpoint
CREATE UNIQUE INDEX "formula_line_substitutes_key" ON "formula_line_substitutes" USING btree ("line_id","material_id");--> statement-breakpoint
CREATE INDEX "formula_line_substitutes_material_idx" ON "formula_line_substitutes" USING btree ("workshop_id","material_id");--> statement-breakpoint
CREATE INDEX "customers_workshop_name_idx" ON "customers" USING btree ("workshop_id","name","id");--> statement-breakpoint
CREATE INDEX "customers_workshop_created_idx" ON "customers" USING btree ("workshop_id","created_at","id");--> statement-breakpoint
CREATE INDEX "deliveries_workshop_delivered_idx" ON "deliveries" USING btree ("workshop_id","delivered_on","id");--> statement-breakpoint
CREATE INDEX "deliveries_customer_idx" ON "deliveries" USING btree ("workshop_id","customer_id","delivered_on");--> statement-breakpoint
CREATE UNIQUE INDEX "delivery_lines_position_key" ON "delivery_lines" USING btree ("delivery_id","position");--> statement-breakpoint
CREATE INDEX "delivery_lines_batch_idx" ON "delivery_lines" USING btree ("batch_id","delivery_id");--> statement-breakpoint
CREATE UNIQUE INDEX "recall_notices_customer_key" ON "recall_notices" USING btree ("recall_id","customer_id");--> statement-breakpoint
CREATE INDEX "recall_replies_recall_idx" ON "recall_replies" USING btree ("recall_id","created_at");--> statement-breakpoint
CREATE INDEX "recalls_workshop_state_idx" ON "recalls" USING btree ("workshop_id","state","opened_at");--> statement-breakpoint
CREATE INDEX "recalls_workshop_opened_idx" ON "recalls" USING btree ("workshop_id","opened_at","id");--> statement-breakpoint
CREATE INDEX "complaints_workshop_received_idx" ON "complaints" USING btree ("workshop_id","received_on","id");--> statement-breakpoint
CREATE INDEX "complaints_workshop_open_idx" ON "complaints" USING btree ("workshop_id","status","serious");--> statement-breakpoint
CREATE INDEX "complaints_batch_idx" ON "complaints" USING btree ("workshop_id","batch_id");--> statement-breakpoint
ALTER TABLE "lot_consumptions" ADD CONSTRAINT "lot_consumptions_batch_fk" FOREIGN KEY ("workshop_id","batch_id") REFERENCES "public"."batches"("workshop_id","id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lot_consumptions" ADD CONSTRAINT "lot_consumptions_created_by_fk" FOREIGN KEY ("workshop_id","created_by") REFERENCES "public"."users"("workshop_id","id") ON DELETE set null (created_by) ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "label_runs" ADD CONSTRAINT "label_runs_batch_fk" FOREIGN KEY ("workshop_id","batch_id") REFERENCES "public"."batches"("workshop_id","id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "lot_consumptions_batch_idx" ON "lot_consumptions" USING btree ("batch_id","lot_id");--> statement-breakpoint
CREATE INDEX "label_runs_batch_idx" ON "label_runs" USING btree ("workshop_id","batch_id");--> statement-breakpoint
CREATE INDEX "lot_consumptions_lot_idx" ON "lot_consumptions" USING btree ("lot_id","batch_id");--> statement-breakpoint
ALTER TABLE "lot_consumptions" ADD CONSTRAINT "lot_consumptions_batch_rows_name_batch" CHECK ("lot_consumptions"."kind" = 'adjustment' or "lot_consumptions"."batch_id" is not null);--> statement-breakpoint
ALTER TABLE "lot_consumptions" ADD CONSTRAINT "lot_consumptions_adjustments_have_reason" CHECK ("lot_consumptions"."kind" <> 'adjustment' or "lot_consumptions"."reason" is not null);--> statement-breakpoint
-- Records that keep: once a batch is released its record never changes. Corrections are rows of
-- batch_amendments; only the effective columns that follow them (ready_on, units_made, updated_at)
-- may be written, and the member columns cleared when a member is removed (created_by, released_by). A released batch is never deleted (the foreign keys of its stock rows restrict).
CREATE FUNCTION "batches_keep_released"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'DELETE' THEN
    -- A workshop's deletion cascades here after its row is gone: only then may its batches go.
    IF OLD.state = 'released' AND EXISTS (SELECT 1 FROM workshops WHERE id = OLD.workshop_id) THEN
      RAISE EXCEPTION 'batch % is released and cannot be deleted', OLD.batch_code USING ERRCODE = 'P0001';
    END IF;
    RETURN OLD;
  END IF;
  IF OLD.state = 'released' AND (
    (to_jsonb(NEW) - 'ready_on' - 'units_made' - 'updated_at' - 'created_by' - 'released_by')
      IS DISTINCT FROM (to_jsonb(OLD) - 'ready_on' - 'units_made' - 'updated_at' - 'created_by' - 'released_by')
  ) THEN
    RAISE EXCEPTION 'batch % is released: correct it with an amendment', OLD.batch_code USING ERRCODE = 'P0001';
  END IF;
  RETURN NEW;
END
$$;--> statement-breakpoint
CREATE TRIGGER "batches_keep_released" BEFORE UPDATE OR DELETE ON "batches"
  FOR EACH ROW EXECUTE FUNCTION "batches_keep_released"();--> statement-breakpoint
-- Amendments are kept as written: never changed, never deleted.
CREATE FUNCTION "batch_amendments_keep"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'DELETE' AND NOT EXISTS (SELECT 1 FROM workshops WHERE id = OLD.workshop_id) THEN
    RETURN OLD;
  END IF;
  IF TG_OP = 'UPDATE' AND (to_jsonb(NEW) - 'amended_by' - 'updated_at') = (to_jsonb(OLD) - 'amended_by' - 'updated_at') THEN
    RETURN NEW;
  END IF;
  RAISE EXCEPTION 'batch amendments are kept as written' USING ERRCODE = 'P0001';
END
$$;--> statement-breakpoint
CREATE TRIGGER "batch_amendments_keep" BEFORE UPDATE OR DELETE ON "batch_amendments"
  FOR EACH ROW EXECUTE FUNCTION "batch_amendments_keep"();
