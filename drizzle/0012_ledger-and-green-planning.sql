ALTER TABLE "lots" ADD COLUMN "supplier_lead_time_days" integer DEFAULT 14 NOT NULL;--> statement-breakpoint
ALTER TABLE "orders" ADD COLUMN "refunded_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "subscriptions" ADD COLUMN "paused_at" timestamp with time zone;--> statement-breakpoint
CREATE INDEX "orders_paid_at_idx" ON "orders" USING btree ("paid_at") WHERE "orders"."paid_at" is not null;--> statement-breakpoint
CREATE INDEX "orders_refunded_at_idx" ON "orders" USING btree ("refunded_at") WHERE "orders"."refunded_at" is not null;--> statement-breakpoint
ALTER TABLE "lots" ADD CONSTRAINT "lots_supplier_lead_time_range" CHECK ("lots"."supplier_lead_time_days" between 0 and 365);--> statement-breakpoint
-- Hand-written data update (carry over on renumbering): orders refunded before refunded_at existed
-- count in the week of their last change, the nearest instant the database kept.
UPDATE "orders" SET "refunded_at" = "updated_at" WHERE "refunded_cents" > 0 AND "refunded_at" IS NULL;
