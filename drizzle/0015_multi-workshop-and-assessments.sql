CREATE TYPE "public"."assessment_status" AS ENUM('draft', 'signed');--> statement-breakpoint
CREATE TYPE "public"."market_record_kind" AS ENUM('eu-notification', 'uk-notification', 'us-listing', 'us-substantiation', 'ca-notification');--> statement-breakpoint
CREATE TABLE "memberships" (
	"workshop_id" uuid NOT NULL,
	"user_id" uuid NOT NULL,
	"role" "member_role" NOT NULL,
	"last_active_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "memberships_pkey" PRIMARY KEY("workshop_id","user_id")
);
--> statement-breakpoint
CREATE TABLE "assessment_shares" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"version_id" uuid NOT NULL,
	"assessor_id" uuid NOT NULL,
	"shared_by" uuid,
	"revoked_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "assessment_shares_workshop_key" UNIQUE("workshop_id","id")
);
--> statement-breakpoint
CREATE TABLE "assessments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"version_id" uuid NOT NULL,
	"share_id" uuid,
	"assessor_id" uuid,
	"assessor_name" text NOT NULL,
	"status" "assessment_status" DEFAULT 'draft' NOT NULL,
	"exposure" jsonb,
	"substances" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"part_b" jsonb NOT NULL,
	"signed_at" timestamp with time zone,
	"signed_by" uuid,
	"signed_by_name" text,
	"content_hash" text,
	"signed_packet" jsonb,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "assessments_workshop_key" UNIQUE("workshop_id","id")
);
--> statement-breakpoint
CREATE TABLE "market_records" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"formula_id" uuid NOT NULL,
	"kind" "market_record_kind" NOT NULL,
	"reference" text,
	"recorded_on" date,
	"first_sale_on" date,
	"small_business_exempt" boolean,
	"notes" text,
	"updated_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "market_records_workshop_key" UNIQUE("workshop_id","id")
);
--> statement-breakpoint
CREATE TABLE "safety_notes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workshop_id" uuid NOT NULL,
	"version_id" uuid NOT NULL,
	"notes" jsonb NOT NULL,
	"updated_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "safety_notes_workshop_key" UNIQUE("workshop_id","id")
);
--> statement-breakpoint
-- Every existing user becomes a member of the workshop they belonged to, with the same role.
INSERT INTO "memberships" ("workshop_id", "user_id", "role", "last_active_at", "created_at", "updated_at")
  SELECT "workshop_id", "id", "role", now(), "created_at", "updated_at" FROM "users";--> statement-breakpoint
ALTER TABLE "users" DROP CONSTRAINT "users_workshop_id_workshops_id_fk";
--> statement-breakpoint
ALTER TABLE "invitations" DROP CONSTRAINT "invitations_invited_by_fk";
--> statement-breakpoint
ALTER TABLE "password_resets" DROP CONSTRAINT "password_resets_user_fk";
--> statement-breakpoint
ALTER TABLE "refresh_sessions" DROP CONSTRAINT "refresh_sessions_user_fk";
--> statement-breakpoint
ALTER TABLE "audit_events" DROP CONSTRAINT "audit_events_actor_fk";
--> statement-breakpoint
ALTER TABLE "lot_consumptions" DROP CONSTRAINT "lot_consumptions_created_by_fk";
--> statement-breakpoint
ALTER TABLE "documents" DROP CONSTRAINT "documents_uploaded_by_fk";
--> statement-breakpoint
ALTER TABLE "formula_versions" DROP CONSTRAINT "formula_versions_released_by_fk";
--> statement-breakpoint
ALTER TABLE "idempotency_keys" DROP CONSTRAINT "idempotency_keys_user_fk";
--> statement-breakpoint
ALTER TABLE "label_runs" DROP CONSTRAINT "label_runs_created_by_fk";
--> statement-breakpoint
ALTER TABLE "product_identities" DROP CONSTRAINT "product_identities_updated_by_fk";
--> statement-breakpoint
ALTER TABLE "batch_amendments" DROP CONSTRAINT "batch_amendments_amended_by_fk";
--> statement-breakpoint
ALTER TABLE "batches" DROP CONSTRAINT "batches_created_by_fk";
--> statement-breakpoint
ALTER TABLE "batches" DROP CONSTRAINT "batches_released_by_fk";
--> statement-breakpoint
ALTER TABLE "deliveries" DROP CONSTRAINT "deliveries_created_by_fk";
--> statement-breakpoint
ALTER TABLE "recall_replies" DROP CONSTRAINT "recall_replies_created_by_fk";
--> statement-breakpoint
ALTER TABLE "recalls" DROP CONSTRAINT "recalls_opened_by_fk";
--> statement-breakpoint
ALTER TABLE "recalls" DROP CONSTRAINT "recalls_closed_by_fk";
--> statement-breakpoint
ALTER TABLE "complaints" DROP CONSTRAINT "complaints_created_by_fk";
--> statement-breakpoint
-- Dropped after the foreign keys that use it as their target.
ALTER TABLE "users" DROP CONSTRAINT "users_workshop_key";--> statement-breakpoint
DROP INDEX "users_workshop_idx";--> statement-breakpoint
ALTER TABLE "memberships" ADD CONSTRAINT "memberships_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "memberships" ADD CONSTRAINT "memberships_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "assessment_shares" ADD CONSTRAINT "assessment_shares_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "assessment_shares" ADD CONSTRAINT "assessment_shares_version_fk" FOREIGN KEY ("workshop_id","version_id") REFERENCES "public"."formula_versions"("workshop_id","id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "assessment_shares" ADD CONSTRAINT "assessment_shares_assessor_fk" FOREIGN KEY ("workshop_id","assessor_id") REFERENCES "public"."memberships"("workshop_id","user_id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "assessment_shares" ADD CONSTRAINT "assessment_shares_shared_by_fk" FOREIGN KEY ("workshop_id","shared_by") REFERENCES "public"."memberships"("workshop_id","user_id") ON DELETE set null (shared_by) ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "assessments" ADD CONSTRAINT "assessments_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "assessments" ADD CONSTRAINT "assessments_version_fk" FOREIGN KEY ("workshop_id","version_id") REFERENCES "public"."formula_versions"("workshop_id","id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "assessments" ADD CONSTRAINT "assessments_share_fk" FOREIGN KEY ("workshop_id","share_id") REFERENCES "public"."assessment_shares"("workshop_id","id") ON DELETE set null (share_id) ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "assessments" ADD CONSTRAINT "assessments_assessor_fk" FOREIGN KEY ("workshop_id","assessor_id") REFERENCES "public"."memberships"("workshop_id","user_id") ON DELETE set null (assessor_id) ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "assessments" ADD CONSTRAINT "assessments_signed_by_fk" FOREIGN KEY ("workshop_id","signed_by") REFERENCES "public"."memberships"("workshop_id","user_id") ON DELETE set null (signed_by) ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "market_records" ADD CONSTRAINT "market_records_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "market_records" ADD CONSTRAINT "market_records_formula_fk" FOREIGN KEY ("workshop_id","formula_id") REFERENCES "public"."formulas"("workshop_id","id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "market_records" ADD CONSTRAINT "market_records_updated_by_fk" FOREIGN KEY ("workshop_id","updated_by") REFERENCES "public"."memberships"("workshop_id","user_id") ON DELETE set null (updated_by) ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "safety_notes" ADD CONSTRAINT "safety_notes_workshop_id_workshops_id_fk" FOREIGN KEY ("workshop_id") REFERENCES "public"."workshops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "safety_notes" ADD CONSTRAINT "safety_notes_version_fk" FOREIGN KEY ("workshop_id","version_id") REFERENCES "public"."formula_versions"("workshop_id","id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "safety_notes" ADD CONSTRAINT "safety_notes_updated_by_fk" FOREIGN KEY ("workshop_id","updated_by") REFERENCES "public"."memberships"("workshop_id","user_id") ON DELETE set null (updated_by) ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "memberships_user_idx" ON "memberships" USING btree ("user_id");--> statement-breakpoint
CREATE UNIQUE INDEX "assessment_shares_live_key" ON "assessment_shares" USING btree ("workshop_id","version_id","assessor_id") WHERE "assessment_shares"."revoked_at" IS NULL;--> statement-breakpoint
CREATE INDEX "assessment_shares_assessor_idx" ON "assessment_shares" USING btree ("workshop_id","assessor_id");--> statement-breakpoint
CREATE UNIQUE INDEX "assessments_version_key" ON "assessments" USING btree ("workshop_id","version_id");--> statement-breakpoint
CREATE INDEX "assessments_workshop_updated_idx" ON "assessments" USING btree ("workshop_id","updated_at");--> statement-breakpoint
CREATE UNIQUE INDEX "market_records_formula_kind_key" ON "market_records" USING btree ("workshop_id","formula_id","kind");--> statement-breakpoint
CREATE UNIQUE INDEX "safety_notes_version_key" ON "safety_notes" USING btree ("workshop_id","version_id");--> statement-breakpoint
ALTER TABLE "invitations" ADD CONSTRAINT "invitations_invited_by_fk" FOREIGN KEY ("workshop_id","invited_by") REFERENCES "public"."memberships"("workshop_id","user_id") ON DELETE set null (invited_by) ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "password_resets" ADD CONSTRAINT "password_resets_user_fk" FOREIGN KEY ("workshop_id","user_id") REFERENCES "public"."memberships"("workshop_id","user_id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "refresh_sessions" ADD CONSTRAINT "refresh_sessions_user_fk" FOREIGN KEY ("workshop_id","user_id") REFERENCES "public"."memberships"("workshop_id","user_id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "audit_events" ADD CONSTRAINT "audit_events_actor_fk" FOREIGN KEY ("workshop_id","actor_id") REFERENCES "public"."memberships"("workshop_id","user_id") ON DELETE set null (actor_id) ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lot_consumptions" ADD CONSTRAINT "lot_consumptions_created_by_fk" FOREIGN KEY ("workshop_id","created_by") REFERENCES "public"."memberships"("workshop_id","user_id") ON DELETE set null (created_by) ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "documents" ADD CONSTRAINT "documents_uploaded_by_fk" FOREIGN KEY ("workshop_id","uploaded_by") REFERENCES "public"."memberships"("workshop_id","user_id") ON DELETE set null (uploaded_by) ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "formula_versions" ADD CONSTRAINT "formula_versions_released_by_fk" FOREIGN KEY ("workshop_id","released_by") REFERENCES "public"."memberships"("workshop_id","user_id") ON DELETE set null (released_by) ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "idempotency_keys" ADD CONSTRAINT "idempotency_keys_user_fk" FOREIGN KEY ("workshop_id","user_id") REFERENCES "public"."memberships"("workshop_id","user_id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "label_runs" ADD CONSTRAINT "label_runs_created_by_fk" FOREIGN KEY ("workshop_id","created_by") REFERENCES "public"."memberships"("workshop_id","user_id") ON DELETE set null (created_by) ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "product_identities" ADD CONSTRAINT "product_identities_updated_by_fk" FOREIGN KEY ("workshop_id","updated_by") REFERENCES "public"."memberships"("workshop_id","user_id") ON DELETE set null (updated_by) ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "batch_amendments" ADD CONSTRAINT "batch_amendments_amended_by_fk" FOREIGN KEY ("workshop_id","amended_by") REFERENCES "public"."memberships"("workshop_id","user_id") ON DELETE set null (amended_by) ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "batches" ADD CONSTRAINT "batches_created_by_fk" FOREIGN KEY ("workshop_id","created_by") REFERENCES "public"."memberships"("workshop_id","user_id") ON DELETE set null (created_by) ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "batches" ADD CONSTRAINT "batches_released_by_fk" FOREIGN KEY ("workshop_id","released_by") REFERENCES "public"."memberships"("workshop_id","user_id") ON DELETE set null (released_by) ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deliveries" ADD CONSTRAINT "deliveries_created_by_fk" FOREIGN KEY ("workshop_id","created_by") REFERENCES "public"."memberships"("workshop_id","user_id") ON DELETE set null (created_by) ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "recall_replies" ADD CONSTRAINT "recall_replies_created_by_fk" FOREIGN KEY ("workshop_id","created_by") REFERENCES "public"."memberships"("workshop_id","user_id") ON DELETE set null (created_by) ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "recalls" ADD CONSTRAINT "recalls_opened_by_fk" FOREIGN KEY ("workshop_id","opened_by") REFERENCES "public"."memberships"("workshop_id","user_id") ON DELETE set null (opened_by) ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "recalls" ADD CONSTRAINT "recalls_closed_by_fk" FOREIGN KEY ("workshop_id","closed_by") REFERENCES "public"."memberships"("workshop_id","user_id") ON DELETE set null (closed_by) ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "complaints" ADD CONSTRAINT "complaints_created_by_fk" FOREIGN KEY ("workshop_id","created_by") REFERENCES "public"."memberships"("workshop_id","user_id") ON DELETE set null (created_by) ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "users" DROP COLUMN "workshop_id";--> statement-breakpoint
ALTER TABLE "users" DROP COLUMN "role";--> statement-breakpoint
-- A signed assessment is kept as signed: no change and no deletion (a workshop's own deletion
-- still cascades). A draft may change and be deleted.
CREATE FUNCTION "assessments_keep_signed"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF OLD.status <> 'signed' THEN
    RETURN CASE WHEN TG_OP = 'DELETE' THEN OLD ELSE NEW END;
  END IF;
  IF TG_OP = 'DELETE' AND NOT EXISTS (SELECT 1 FROM workshops WHERE id = OLD.workshop_id) THEN
    RETURN OLD;
  END IF;
  -- A member who leaves the workshop is unlinked (set null); their name stays.
  IF TG_OP = 'UPDATE' AND (to_jsonb(NEW) - 'assessor_id' - 'signed_by' - 'share_id' - 'updated_at') = (to_jsonb(OLD) - 'assessor_id' - 'signed_by' - 'share_id' - 'updated_at') THEN
    RETURN NEW;
  END IF;
  RAISE EXCEPTION 'assessment % is signed and cannot be changed', OLD.id USING ERRCODE = 'P0001';
END $$;--> statement-breakpoint
CREATE TRIGGER "assessments_keep_signed" BEFORE UPDATE OR DELETE ON "assessments"
  FOR EACH ROW EXECUTE FUNCTION "assessments_keep_signed"();
