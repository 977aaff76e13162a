ALTER TABLE "orders" DROP CONSTRAINT "orders_total_is_subtotal_plus_shipping";--> statement-breakpoint
ALTER TABLE "orders" ADD COLUMN "discount_cents" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "orders" ADD CONSTRAINT "orders_discount_within_subtotal" CHECK ("orders"."discount_cents" >= 0 and "orders"."discount_cents" <= "orders"."subtotal_cents");--> statement-breakpoint
ALTER TABLE "orders" ADD CONSTRAINT "orders_total_adds_up" CHECK ("orders"."total_cents" = "orders"."subtotal_cents" - "orders"."discount_cents" + "orders"."shipping_cents");