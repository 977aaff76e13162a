ALTER TABLE "shop_settings" ALTER COLUMN "rest_adjust_days" SET DEFAULT '{"light":1,"medium":0,"medium-dark":-1,"dark":-1,"french":-1}'::jsonb;--> statement-breakpoint
ALTER TABLE "roast_days" ADD COLUMN "ship_open" boolean;--> statement-breakpoint
ALTER TABLE "shop_settings" ADD COLUMN "ship_policy" text DEFAULT 'ready_on_arrival' NOT NULL;--> statement-breakpoint
ALTER TABLE "shop_settings" ADD COLUMN "hold_over_weekend" boolean DEFAULT true NOT NULL;--> statement-breakpoint
ALTER TABLE "shop_settings" ADD CONSTRAINT "shop_settings_ship_policy" CHECK ("shop_settings"."ship_policy" in ('ready_on_arrival', 'after_degassing'));--> statement-breakpoint
-- A closure made before roast and ship days were apart closed both: keep what it meant.
UPDATE "roast_days" SET "ship_open" = false WHERE "open" = false;--> statement-breakpoint
-- A settings row still on the old all-zero level adjustments takes the sourced defaults.
UPDATE "shop_settings" SET "rest_adjust_days" = '{"light":1,"medium":0,"medium-dark":-1,"dark":-1,"french":-1}'::jsonb
WHERE "rest_adjust_days" = '{"light":0,"medium":0,"medium-dark":0,"dark":0,"french":0}'::jsonb;
