-- Reordered by hand before merge: a foreign key needs the unique (workshop_id, id) it points at,
-- and drizzle-kit wrote the unique constraints last.
ALTER TABLE "invitations" DROP CONSTRAINT "invitations_invited_by_users_id_fk";
--> statement-breakpoint
ALTER TABLE "password_resets" DROP CONSTRAINT "password_resets_user_id_users_id_fk";
--> statement-breakpoint
ALTER TABLE "refresh_sessions" DROP CONSTRAINT "refresh_sessions_user_id_users_id_fk";
--> statement-breakpoint
ALTER TABLE "audit_events" DROP CONSTRAINT "audit_events_actor_id_users_id_fk";
--> statement-breakpoint
ALTER TABLE "materials" DROP CONSTRAINT "materials_supplier_id_suppliers_id_fk";
--> statement-breakpoint
ALTER TABLE "lot_consumptions" DROP CONSTRAINT "lot_consumptions_lot_id_lots_id_fk";
--> statement-breakpoint
ALTER TABLE "lots" DROP CONSTRAINT "lots_material_id_materials_id_fk";
--> statement-breakpoint
ALTER TABLE "documents" DROP CONSTRAINT "documents_material_id_materials_id_fk";
--> statement-breakpoint
ALTER TABLE "documents" DROP CONSTRAINT "documents_lot_id_lots_id_fk";
--> statement-breakpoint
ALTER TABLE "documents" DROP CONSTRAINT "documents_uploaded_by_users_id_fk";
--> statement-breakpoint
ALTER TABLE "formula_lines" DROP CONSTRAINT "formula_lines_version_id_formula_versions_id_fk";
--> statement-breakpoint
ALTER TABLE "formula_lines" DROP CONSTRAINT "formula_lines_material_id_materials_id_fk";
--> statement-breakpoint
ALTER TABLE "formula_versions" DROP CONSTRAINT "formula_versions_formula_id_formulas_id_fk";
--> statement-breakpoint
ALTER TABLE "formula_versions" DROP CONSTRAINT "formula_versions_released_by_users_id_fk";
--> statement-breakpoint
ALTER TABLE "idempotency_keys" DROP CONSTRAINT "idempotency_keys_user_id_users_id_fk";
--> statement-breakpoint
ALTER TABLE "users" ADD CONSTRAINT "users_workshop_key" UNIQUE("workshop_id","id");
--> statement-breakpoint
ALTER TABLE "invitations" ADD CONSTRAINT "invitations_workshop_key" UNIQUE("workshop_id","id");
--> statement-breakpoint
ALTER TABLE "password_resets" ADD CONSTRAINT "password_resets_workshop_key" UNIQUE("workshop_id","id");
--> statement-breakpoint
ALTER TABLE "refresh_sessions" ADD CONSTRAINT "refresh_sessions_workshop_key" UNIQUE("workshop_id","id");
--> statement-breakpoint
ALTER TABLE "audit_events" ADD CONSTRAINT "audit_events_workshop_key" UNIQUE("workshop_id","id");
--> statement-breakpoint
ALTER TABLE "suppliers" ADD CONSTRAINT "suppliers_workshop_key" UNIQUE("workshop_id","id");
--> statement-breakpoint
ALTER TABLE "materials" ADD CONSTRAINT "materials_workshop_key" UNIQUE("workshop_id","id");
--> statement-breakpoint
ALTER TABLE "lot_consumptions" ADD CONSTRAINT "lot_consumptions_workshop_key" UNIQUE("workshop_id","id");
--> statement-breakpoint
ALTER TABLE "lots" ADD CONSTRAINT "lots_workshop_key" UNIQUE("workshop_id","id");
--> statement-breakpoint
ALTER TABLE "documents" ADD CONSTRAINT "documents_workshop_key" UNIQUE("workshop_id","id");
--> statement-breakpoint
ALTER TABLE "formula_lines" ADD CONSTRAINT "formula_lines_workshop_key" UNIQUE("workshop_id","id");
--> statement-breakpoint
ALTER TABLE "formula_versions" ADD CONSTRAINT "formula_versions_workshop_key" UNIQUE("workshop_id","id");
--> statement-breakpoint
ALTER TABLE "formulas" ADD CONSTRAINT "formulas_workshop_key" UNIQUE("workshop_id","id");
--> statement-breakpoint
ALTER TABLE "invitations" ADD CONSTRAINT "invitations_invited_by_fk" FOREIGN KEY ("workshop_id","invited_by") REFERENCES "public"."users"("workshop_id","id") ON DELETE set null (invited_by) ON UPDATE no action;
--> statement-breakpoint
ALTER TABLE "password_resets" ADD CONSTRAINT "password_resets_user_fk" FOREIGN KEY ("workshop_id","user_id") REFERENCES "public"."users"("workshop_id","id") ON DELETE cascade ON UPDATE no action;
--> statement-breakpoint
ALTER TABLE "refresh_sessions" ADD CONSTRAINT "refresh_sessions_user_fk" FOREIGN KEY ("workshop_id","user_id") REFERENCES "public"."users"("workshop_id","id") ON DELETE cascade ON UPDATE no action;
--> statement-breakpoint
ALTER TABLE "audit_events" ADD CONSTRAINT "audit_events_actor_fk" FOREIGN KEY ("workshop_id","actor_id") REFERENCES "public"."users"("workshop_id","id") ON DELETE set null (actor_id) ON UPDATE no action;
--> statement-breakpoint
ALTER TABLE "materials" ADD CONSTRAINT "materials_supplier_fk" FOREIGN KEY ("workshop_id","supplier_id") REFERENCES "public"."suppliers"("workshop_id","id") ON DELETE set null (supplier_id) ON UPDATE no action;
--> statement-breakpoint
ALTER TABLE "lot_consumptions" ADD CONSTRAINT "lot_consumptions_lot_fk" FOREIGN KEY ("workshop_id","lot_id") REFERENCES "public"."lots"("workshop_id","id") ON DELETE restrict ON UPDATE no action;
--> statement-breakpoint
ALTER TABLE "lots" ADD CONSTRAINT "lots_material_fk" FOREIGN KEY ("workshop_id","material_id") REFERENCES "public"."materials"("workshop_id","id") ON DELETE restrict ON UPDATE no action;
--> statement-breakpoint
ALTER TABLE "documents" ADD CONSTRAINT "documents_material_fk" FOREIGN KEY ("workshop_id","material_id") REFERENCES "public"."materials"("workshop_id","id") ON DELETE cascade ON UPDATE no action;
--> statement-breakpoint
ALTER TABLE "documents" ADD CONSTRAINT "documents_lot_fk" FOREIGN KEY ("workshop_id","lot_id") REFERENCES "public"."lots"("workshop_id","id") ON DELETE cascade ON UPDATE no action;
--> statement-breakpoint
ALTER TABLE "documents" ADD CONSTRAINT "documents_uploaded_by_fk" FOREIGN KEY ("workshop_id","uploaded_by") REFERENCES "public"."users"("workshop_id","id") ON DELETE set null (uploaded_by) ON UPDATE no action;
--> statement-breakpoint
ALTER TABLE "formula_lines" ADD CONSTRAINT "formula_lines_version_fk" FOREIGN KEY ("workshop_id","version_id") REFERENCES "public"."formula_versions"("workshop_id","id") ON DELETE cascade ON UPDATE no action;
--> statement-breakpoint
ALTER TABLE "formula_lines" ADD CONSTRAINT "formula_lines_material_fk" FOREIGN KEY ("workshop_id","material_id") REFERENCES "public"."materials"("workshop_id","id") ON DELETE restrict ON UPDATE no action;
--> statement-breakpoint
ALTER TABLE "formula_versions" ADD CONSTRAINT "formula_versions_formula_fk" FOREIGN KEY ("workshop_id","formula_id") REFERENCES "public"."formulas"("workshop_id","id") ON DELETE cascade ON UPDATE no action;
--> statement-breakpoint
ALTER TABLE "formula_versions" ADD CONSTRAINT "formula_versions_released_by_fk" FOREIGN KEY ("workshop_id","released_by") REFERENCES "public"."users"("workshop_id","id") ON DELETE set null (released_by) ON UPDATE no action;
--> statement-breakpoint
ALTER TABLE "idempotency_keys" ADD CONSTRAINT "idempotency_keys_user_fk" FOREIGN KEY ("workshop_id","user_id") REFERENCES "public"."users"("workshop_id","id") ON DELETE cascade ON UPDATE no action;
