ALTER TABLE "orders" ADD COLUMN "checkout_key" text;--> statement-breakpoint
CREATE UNIQUE INDEX "orders_user_id_checkout_key_key" ON "orders" USING btree ("user_id","checkout_key") WHERE "orders"."status" <> 'cancelled';--> statement-breakpoint
CREATE INDEX "orders_pending_payment_created_at_idx" ON "orders" USING btree ("created_at") WHERE "orders"."status" = 'pending_payment';