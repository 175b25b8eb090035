ALTER TABLE "materials" DROP CONSTRAINT "materials_supplier_fk";
--> statement-breakpoint
ALTER TABLE "documents" DROP CONSTRAINT "documents_material_fk";
--> statement-breakpoint
ALTER TABLE "suppliers" ADD COLUMN "archived_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "materials" ADD COLUMN "archived_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "documents" ADD COLUMN "replaces_id" uuid;--> statement-breakpoint
ALTER TABLE "documents" ADD COLUMN "archived_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "formulas" ADD COLUMN "archived_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "materials" ADD CONSTRAINT "materials_supplier_fk" FOREIGN KEY ("workshop_id","supplier_id") REFERENCES "public"."suppliers"("workshop_id","id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "documents" ADD CONSTRAINT "documents_replaces_fk" FOREIGN KEY ("workshop_id","replaces_id") REFERENCES "public"."documents"("workshop_id","id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "documents" ADD CONSTRAINT "documents_material_fk" FOREIGN KEY ("workshop_id","material_id") REFERENCES "public"."materials"("workshop_id","id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "documents_replaces_key" ON "documents" USING btree ("workshop_id","replaces_id") WHERE "documents"."replaces_id" is not null;