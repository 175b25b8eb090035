CREATE INDEX "materials_trade_name_trgm_idx" ON "materials" USING gin ("trade_name" gin_trgm_ops);--> statement-breakpoint
CREATE INDEX "materials_inci_trgm_idx" ON "materials" USING gin ("inci" gin_trgm_ops);--> statement-breakpoint
CREATE INDEX "lots_lot_number_trgm_idx" ON "lots" USING gin ("supplier_lot_number" gin_trgm_ops);