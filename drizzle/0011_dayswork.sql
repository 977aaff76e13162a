ALTER TABLE "orders" ADD COLUMN "discarded_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "orders" ADD COLUMN "staff_note" text;--> statement-breakpoint
ALTER TABLE "subscriptions" ADD COLUMN "discarded_at" timestamp with time zone;