ALTER TYPE "public"."product_type" ADD VALUE 'body-wash' BEFORE 'lotion';--> statement-breakpoint
ALTER TYPE "public"."product_type" ADD VALUE 'body-oil' BEFORE 'lotion';--> statement-breakpoint
ALTER TYPE "public"."product_type" ADD VALUE 'body-butter' BEFORE 'lotion';--> statement-breakpoint
ALTER TYPE "public"."product_type" ADD VALUE 'scrub' BEFORE 'other';--> statement-breakpoint
ALTER TYPE "public"."product_type" ADD VALUE 'lip-balm' BEFORE 'other';--> statement-breakpoint
ALTER TYPE "public"."product_type" ADD VALUE 'lipstick' BEFORE 'other';--> statement-breakpoint
ALTER TYPE "public"."product_type" ADD VALUE 'deodorant' BEFORE 'other';--> statement-breakpoint
ALTER TYPE "public"."product_type" ADD VALUE 'hair-care' BEFORE 'other';--> statement-breakpoint
ALTER TYPE "public"."product_type" ADD VALUE 'face-care' BEFORE 'other';--> statement-breakpoint
ALTER TYPE "public"."product_type" ADD VALUE 'eye-area-product' BEFORE 'other';--> statement-breakpoint
ALTER TYPE "public"."product_type" ADD VALUE 'nail-product' BEFORE 'other';--> statement-breakpoint
ALTER TABLE "materials" ADD COLUMN "nano" boolean DEFAULT false NOT NULL;