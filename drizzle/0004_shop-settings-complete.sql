ALTER TABLE "shop_settings" ADD COLUMN "loss_model_min_batches" integer DEFAULT 3 NOT NULL;--> statement-breakpoint
ALTER TABLE "shop_settings" ADD COLUMN "currency" text DEFAULT 'usd' NOT NULL;--> statement-breakpoint
ALTER TABLE "shop_settings" ADD COLUMN "rest_adjust_days" jsonb DEFAULT '{"light":0,"medium":0,"medium-dark":0,"dark":0,"french":0}'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "shop_settings" ADD COLUMN "roasted_bag_price_cents" jsonb DEFAULT '{"12oz":1800,"1lb":2300,"2lb":4400}'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "shop_settings" ADD COLUMN "subscription_discount_pct" numeric(5, 2) DEFAULT 10 NOT NULL;--> statement-breakpoint
ALTER TABLE "shop_settings" ADD COLUMN "renewal_reminder_days" integer DEFAULT 3 NOT NULL;--> statement-breakpoint
ALTER TABLE "shop_settings" ADD COLUMN "shipping" jsonb DEFAULT '{"bands":[{"maxGrams":500,"cents":695},{"maxGrams":1000,"cents":895},{"maxGrams":2000,"cents":1195},{"maxGrams":5000,"cents":1695},{"maxGrams":10000,"cents":2495}],"bagTareGrams":20,"boxTareGrams":180}'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "shop_settings" ADD CONSTRAINT "shop_settings_loss_model_min_batches_range" CHECK ("shop_settings"."loss_model_min_batches" between 1 and 100);--> statement-breakpoint
ALTER TABLE "shop_settings" ADD CONSTRAINT "shop_settings_currency_code" CHECK ("shop_settings"."currency" ~ '^[a-z]{3}$');--> statement-breakpoint
ALTER TABLE "shop_settings" ADD CONSTRAINT "shop_settings_subscription_discount_range" CHECK ("shop_settings"."subscription_discount_pct" >= 0 and "shop_settings"."subscription_discount_pct" <= 50);--> statement-breakpoint
ALTER TABLE "shop_settings" ADD CONSTRAINT "shop_settings_renewal_reminder_days_range" CHECK ("shop_settings"."renewal_reminder_days" between 0 and 14);