ALTER TABLE "materials" ADD COLUMN "search_text" text GENERATED ALWAYS AS (lower(trade_name || E'\n' || inci || E'\n' || coalesce(us_name, '') || E'\n' || coalesce(cas, ''))) STORED;--> statement-breakpoint
ALTER TABLE "lots" ADD COLUMN "material_name" text DEFAULT '' NOT NULL;--> statement-breakpoint
UPDATE "lots" SET "material_name" = "materials"."trade_name" FROM "materials" WHERE "materials"."id" = "lots"."material_id";--> statement-breakpoint
CREATE INDEX "materials_search_text_trgm_idx" ON "materials" USING gin ("search_text" gin_trgm_ops);--> statement-breakpoint
CREATE INDEX "lots_workshop_material_name_idx" ON "lots" USING btree ("workshop_id","material_name","id");--> statement-breakpoint
-- lots.material_name is a copy of the material's trade name, so that the lots list sorts by it through
-- lots_workshop_material_name_idx. These triggers keep it in the writing transaction, whatever writes.
-- A material that is not found leaves '' so that the foreign key, not NOT NULL, refuses the row.
CREATE FUNCTION "lots_copy_material_name"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  NEW.material_name := coalesce(
    (SELECT m.trade_name FROM materials m WHERE m.id = NEW.material_id AND m.workshop_id = NEW.workshop_id),
    '');
  RETURN NEW;
END
$$;--> statement-breakpoint
CREATE TRIGGER "lots_copy_material_name" BEFORE INSERT OR UPDATE OF "material_id", "material_name" ON "lots"
  FOR EACH ROW EXECUTE FUNCTION "lots_copy_material_name"();--> statement-breakpoint
CREATE FUNCTION "materials_rename_lots"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  UPDATE lots SET material_name = NEW.trade_name
  WHERE workshop_id = NEW.workshop_id AND material_id = NEW.id;
  RETURN NULL;
END
$$;--> statement-breakpoint
CREATE TRIGGER "materials_rename_lots" AFTER UPDATE OF "trade_name" ON "materials"
  FOR EACH ROW WHEN (OLD.trade_name IS DISTINCT FROM NEW.trade_name)
  EXECUTE FUNCTION "materials_rename_lots"();
