ALTER TYPE "public"."role" ADD VALUE 'packer' BEFORE 'staff';--> statement-breakpoint
ALTER TABLE "shop_settings" ADD COLUMN "place_of_business" jsonb;