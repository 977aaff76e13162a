ALTER TABLE "deliveries" ADD COLUMN "nominal_date" date;--> statement-breakpoint
ALTER TABLE "deliveries" ADD COLUMN "roast_level" "roast_level";--> statement-breakpoint
ALTER TABLE "deliveries" ADD COLUMN "bag_size" "bag_size";--> statement-breakpoint
ALTER TABLE "deliveries" ADD COLUMN "bags_per_delivery" integer;--> statement-breakpoint
ALTER TABLE "deliveries" ADD COLUMN "grind" "grind";--> statement-breakpoint
ALTER TABLE "deliveries" ADD COLUMN "brew_method" "brew_method";--> statement-breakpoint
ALTER TABLE "deliveries" ADD COLUMN "charge_deferred" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "subscriptions" ADD COLUMN "anchor_date" date;--> statement-breakpoint
ALTER TABLE "subscriptions" ADD COLUMN "cancel_at_period_end" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "subscriptions" ADD COLUMN "change_version" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "subscriptions" ADD COLUMN "stripe_synced_version" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
CREATE UNIQUE INDEX "deliveries_subscription_id_nominal_date_key" ON "deliveries" USING btree ("subscription_id","nominal_date");