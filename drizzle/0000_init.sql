CREATE TYPE "public"."bag_size" AS ENUM('8oz', '12oz', '1lb', '2lb', '5lb');--> statement-breakpoint
CREATE TYPE "public"."brew_method" AS ENUM('filter', 'espresso');--> statement-breakpoint
CREATE TYPE "public"."delivery_status" AS ENUM('scheduled', 'skipped', 'held', 'roasted', 'shipped');--> statement-breakpoint
CREATE TYPE "public"."grind" AS ENUM('whole-bean', 'espresso', 'moka-pot', 'aeropress', 'pour-over', 'drip', 'french-press', 'cold-brew');--> statement-breakpoint
CREATE TYPE "public"."home_roast_device" AS ENUM('popper', 'stovetop-pan', 'oven', 'drum-home', 'fluid-bed-home');--> statement-breakpoint
CREATE TYPE "public"."order_kind" AS ENUM('green', 'roasted');--> statement-breakpoint
CREATE TYPE "public"."order_status" AS ENUM('pending_payment', 'paid', 'held', 'roasted', 'packed', 'shipped', 'cancelled', 'refunded');--> statement-breakpoint
CREATE TYPE "public"."outbox_status" AS ENUM('pending', 'sending', 'sent', 'failed');--> statement-breakpoint
CREATE TYPE "public"."process" AS ENUM('washed', 'natural', 'honey', 'wet-hulled');--> statement-breakpoint
CREATE TYPE "public"."roast_level" AS ENUM('light', 'medium', 'medium-dark', 'dark', 'french');--> statement-breakpoint
CREATE TYPE "public"."role" AS ENUM('customer', 'staff', 'owner');--> statement-breakpoint
CREATE TYPE "public"."stock_movement_reason" AS ENUM('arrival', 'sale', 'roast', 'sample', 'loss', 'count', 'refund');--> statement-breakpoint
CREATE TYPE "public"."subscription_status" AS ENUM('incomplete', 'active', 'paused', 'past_due', 'cancelled');--> statement-breakpoint
CREATE TYPE "public"."upload_kind" AS ENUM('photo', 'spec_sheet');--> statement-breakpoint
CREATE TABLE "addresses" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"user_id" uuid NOT NULL,
	"name" text NOT NULL,
	"line1" text NOT NULL,
	"line2" text,
	"city" text NOT NULL,
	"region" text NOT NULL,
	"postal_code" text NOT NULL,
	"country" text DEFAULT 'US' NOT NULL,
	"is_default" boolean DEFAULT false NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "addresses_country_code" CHECK ("addresses"."country" ~ '^[A-Z]{2}$')
);
--> statement-breakpoint
CREATE TABLE "audit_log" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"actor_id" uuid,
	"action" text NOT NULL,
	"ip" text,
	"detail" jsonb DEFAULT '{}'::jsonb NOT NULL
);
--> statement-breakpoint
CREATE TABLE "invitations" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"email" text NOT NULL,
	"role" "role" NOT NULL,
	"token_hash" text NOT NULL,
	"invited_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"accepted_at" timestamp with time zone,
	CONSTRAINT "invitations_email_lower_case" CHECK ("invitations"."email" = lower("invitations"."email"))
);
--> statement-breakpoint
CREATE TABLE "password_reset_tokens" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"token_hash" text NOT NULL,
	"user_id" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"used_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "sessions" (
	"id" text PRIMARY KEY NOT NULL,
	"user_id" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"last_seen_at" timestamp with time zone DEFAULT now() NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"revoked_at" timestamp with time zone,
	"user_agent" text,
	"ip" text
);
--> statement-breakpoint
CREATE TABLE "users" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"email" text NOT NULL,
	"name" text NOT NULL,
	"password_hash" text NOT NULL,
	"role" "role" DEFAULT 'customer' NOT NULL,
	"disabled_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "users_email_lower_case" CHECK ("users"."email" = lower("users"."email")),
	CONSTRAINT "users_email_shape" CHECK (position('@' in "users"."email") > 1),
	CONSTRAINT "users_name_not_blank" CHECK (length(trim("users"."name")) > 0)
);
--> statement-breakpoint
CREATE TABLE "lot_price_breaks" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"lot_id" uuid NOT NULL,
	"min_grams" integer NOT NULL,
	"price_per_kg_cents" integer NOT NULL,
	CONSTRAINT "lot_price_breaks_min_grams_positive" CHECK ("lot_price_breaks"."min_grams" > 0),
	CONSTRAINT "lot_price_breaks_price_positive" CHECK ("lot_price_breaks"."price_per_kg_cents" > 0)
);
--> statement-breakpoint
CREATE TABLE "lots" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"code" text NOT NULL,
	"name" text NOT NULL,
	"origin" text NOT NULL,
	"region" text NOT NULL,
	"producer" text NOT NULL,
	"variety" text NOT NULL,
	"process" "process" NOT NULL,
	"altitude_m" integer NOT NULL,
	"crop_year" integer NOT NULL,
	"moisture_pct" numeric(4, 2) NOT NULL,
	"density_g_per_l" integer,
	"screen_size" text,
	"cupping_score" numeric(5, 2),
	"tasting_notes" text[] DEFAULT '{}'::text[] NOT NULL,
	"description" text DEFAULT '' NOT NULL,
	"suggested_level" "roast_level" NOT NULL,
	"allowed_levels" "roast_level"[] NOT NULL,
	"stock_grams" integer DEFAULT 0 NOT NULL,
	"price_per_kg_cents" integer NOT NULL,
	"is_listed" boolean DEFAULT true NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "lots_code_not_blank" CHECK (length(trim("lots"."code")) > 0),
	CONSTRAINT "lots_stock_grams_non_negative" CHECK ("lots"."stock_grams" >= 0),
	CONSTRAINT "lots_price_per_kg_positive" CHECK ("lots"."price_per_kg_cents" > 0),
	CONSTRAINT "lots_moisture_range" CHECK ("lots"."moisture_pct" >= 0 and "lots"."moisture_pct" <= 20),
	CONSTRAINT "lots_cupping_score_range" CHECK ("lots"."cupping_score" is null or ("lots"."cupping_score" >= 0 and "lots"."cupping_score" <= 100)),
	CONSTRAINT "lots_altitude_range" CHECK ("lots"."altitude_m" >= 0 and "lots"."altitude_m" <= 3500),
	CONSTRAINT "lots_crop_year_range" CHECK ("lots"."crop_year" between 1990 and 2100),
	CONSTRAINT "lots_density_positive" CHECK ("lots"."density_g_per_l" is null or "lots"."density_g_per_l" > 0),
	CONSTRAINT "lots_allowed_levels_not_empty" CHECK (cardinality("lots"."allowed_levels") > 0),
	CONSTRAINT "lots_suggested_level_allowed" CHECK ("lots"."suggested_level" = any("lots"."allowed_levels"))
);
--> statement-breakpoint
CREATE TABLE "stock_movements" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"lot_id" uuid NOT NULL,
	"delta_grams" integer NOT NULL,
	"reason" "stock_movement_reason" NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"order_id" uuid,
	"batch_id" uuid,
	"actor_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "stock_movements_delta_non_zero" CHECK ("stock_movements"."delta_grams" <> 0)
);
--> statement-breakpoint
CREATE TABLE "uploads" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"lot_id" uuid,
	"kind" "upload_kind" NOT NULL,
	"storage_key" text NOT NULL,
	"content_type" text NOT NULL,
	"byte_size" integer NOT NULL,
	"original_name" text NOT NULL,
	"position" integer DEFAULT 0 NOT NULL,
	"uploaded_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "uploads_byte_size_positive" CHECK ("uploads"."byte_size" > 0),
	CONSTRAINT "uploads_position_non_negative" CHECK ("uploads"."position" >= 0)
);
--> statement-breakpoint
CREATE TABLE "order_items" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"order_id" uuid NOT NULL,
	"lot_id" uuid,
	"kind" "order_kind" NOT NULL,
	"size" "bag_size" NOT NULL,
	"quantity" integer NOT NULL,
	"fill_grams" integer NOT NULL,
	"roast_level" "roast_level",
	"grind" "grind",
	"brew_method" "brew_method",
	"unit_price_cents" integer NOT NULL,
	"line_total_cents" integer NOT NULL,
	CONSTRAINT "order_items_quantity_positive" CHECK ("order_items"."quantity" > 0),
	CONSTRAINT "order_items_fill_grams_positive" CHECK ("order_items"."fill_grams" > 0),
	CONSTRAINT "order_items_fill_grams_matches_size" CHECK ("order_items"."fill_grams" = case "order_items"."size" when '8oz' then 227 when '12oz' then 341 when '1lb' then 454 when '2lb' then 908 when '5lb' then 2268 end),
	CONSTRAINT "order_items_unit_price_non_negative" CHECK ("order_items"."unit_price_cents" >= 0),
	CONSTRAINT "order_items_line_total" CHECK ("order_items"."line_total_cents" = "order_items"."unit_price_cents" * "order_items"."quantity"),
	CONSTRAINT "order_items_green_shape" CHECK ("order_items"."kind" <> 'green' or ("order_items"."lot_id" is not null and "order_items"."roast_level" is null and "order_items"."grind" is null and "order_items"."size" in ('8oz', '1lb', '2lb', '5lb'))),
	CONSTRAINT "order_items_roasted_shape" CHECK ("order_items"."kind" <> 'roasted' or ("order_items"."roast_level" is not null and "order_items"."grind" is not null and "order_items"."brew_method" is not null and "order_items"."size" in ('12oz', '1lb', '2lb')))
);
--> statement-breakpoint
CREATE TABLE "orders" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"user_id" uuid NOT NULL,
	"kind" "order_kind" NOT NULL,
	"status" "order_status" DEFAULT 'pending_payment' NOT NULL,
	"subscription_id" uuid,
	"delivery_id" uuid,
	"subtotal_cents" integer NOT NULL,
	"shipping_cents" integer DEFAULT 0 NOT NULL,
	"total_cents" integer NOT NULL,
	"currency" text DEFAULT 'usd' NOT NULL,
	"shipping_address" jsonb NOT NULL,
	"roast_date" date,
	"ship_date" date,
	"ready_from" date,
	"best_before" date,
	"carrier" text,
	"tracking_number" text,
	"stripe_checkout_session_id" text,
	"stripe_payment_intent_id" text,
	"stripe_invoice_id" text,
	"paid_at" timestamp with time zone,
	"packed_at" timestamp with time zone,
	"shipped_at" timestamp with time zone,
	"cancelled_at" timestamp with time zone,
	"refunded_cents" integer DEFAULT 0 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "orders_subtotal_non_negative" CHECK ("orders"."subtotal_cents" >= 0),
	CONSTRAINT "orders_shipping_non_negative" CHECK ("orders"."shipping_cents" >= 0),
	CONSTRAINT "orders_total_non_negative" CHECK ("orders"."total_cents" >= 0),
	CONSTRAINT "orders_total_is_subtotal_plus_shipping" CHECK ("orders"."total_cents" = "orders"."subtotal_cents" + "orders"."shipping_cents"),
	CONSTRAINT "orders_refunded_within_total" CHECK ("orders"."refunded_cents" >= 0 and "orders"."refunded_cents" <= "orders"."total_cents"),
	CONSTRAINT "orders_currency_code" CHECK ("orders"."currency" ~ '^[a-z]{3}$'),
	CONSTRAINT "orders_green_has_no_subscription" CHECK ("orders"."kind" = 'roasted' or ("orders"."subscription_id" is null and "orders"."delivery_id" is null)),
	CONSTRAINT "orders_ship_not_before_roast" CHECK ("orders"."ship_date" is null or "orders"."roast_date" is null or "orders"."ship_date" >= "orders"."roast_date")
);
--> statement-breakpoint
CREATE TABLE "deliveries" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"subscription_id" uuid NOT NULL,
	"order_id" uuid,
	"sequence" integer NOT NULL,
	"roast_date" date NOT NULL,
	"ship_date" date NOT NULL,
	"ready_from" date NOT NULL,
	"best_before" date NOT NULL,
	"status" "delivery_status" DEFAULT 'scheduled' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "deliveries_sequence_positive" CHECK ("deliveries"."sequence" > 0),
	CONSTRAINT "deliveries_ship_not_before_roast" CHECK ("deliveries"."ship_date" >= "deliveries"."roast_date"),
	CONSTRAINT "deliveries_ready_not_before_roast" CHECK ("deliveries"."ready_from" >= "deliveries"."roast_date"),
	CONSTRAINT "deliveries_best_before_after_ready" CHECK ("deliveries"."best_before" >= "deliveries"."ready_from")
);
--> statement-breakpoint
CREATE TABLE "rotation_picks" (
	"roast_date" date PRIMARY KEY NOT NULL,
	"lot_id" uuid NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"picked_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "subscriptions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"user_id" uuid NOT NULL,
	"status" "subscription_status" DEFAULT 'incomplete' NOT NULL,
	"lot_id" uuid,
	"roast_level" "roast_level" NOT NULL,
	"bag_size" "bag_size" NOT NULL,
	"bags_per_delivery" integer DEFAULT 1 NOT NULL,
	"grind" "grind" DEFAULT 'whole-bean' NOT NULL,
	"brew_method" "brew_method" DEFAULT 'filter' NOT NULL,
	"cadence_weeks" integer NOT NULL,
	"paused_until" date,
	"shipping_address" jsonb NOT NULL,
	"stripe_subscription_id" text,
	"stripe_customer_id" text,
	"price_cents" integer NOT NULL,
	"currency" text DEFAULT 'usd' NOT NULL,
	"current_period_end" timestamp with time zone,
	"cancelled_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "subscriptions_bags_per_delivery_range" CHECK ("subscriptions"."bags_per_delivery" between 1 and 10),
	CONSTRAINT "subscriptions_cadence_weeks_range" CHECK ("subscriptions"."cadence_weeks" between 1 and 4),
	CONSTRAINT "subscriptions_price_non_negative" CHECK ("subscriptions"."price_cents" >= 0),
	CONSTRAINT "subscriptions_roasted_bag_size" CHECK ("subscriptions"."bag_size" in ('12oz', '1lb', '2lb'))
);
--> statement-breakpoint
CREATE TABLE "bag_allocations" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"batch_id" uuid NOT NULL,
	"order_item_id" uuid NOT NULL,
	"order_id" uuid NOT NULL,
	"bags" integer NOT NULL,
	"grams" integer NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "bag_allocations_bags_positive" CHECK ("bag_allocations"."bags" > 0),
	CONSTRAINT "bag_allocations_grams_positive" CHECK ("bag_allocations"."grams" > 0)
);
--> statement-breakpoint
CREATE TABLE "batches" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"roast_date" date NOT NULL,
	"lot_id" uuid NOT NULL,
	"roast_level" "roast_level" NOT NULL,
	"green_grams_in" integer NOT NULL,
	"roasted_grams_out" integer NOT NULL,
	"total_seconds" integer,
	"first_crack_seconds" integer,
	"operator_id" uuid,
	"loss_pct" numeric(5, 2) NOT NULL,
	"within_expected" boolean NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "batches_green_grams_in_positive" CHECK ("batches"."green_grams_in" > 0),
	CONSTRAINT "batches_roasted_grams_out_positive" CHECK ("batches"."roasted_grams_out" > 0),
	CONSTRAINT "batches_roasted_less_than_green" CHECK ("batches"."roasted_grams_out" < "batches"."green_grams_in"),
	CONSTRAINT "batches_total_seconds_positive" CHECK ("batches"."total_seconds" is null or "batches"."total_seconds" > 0),
	CONSTRAINT "batches_first_crack_within_roast" CHECK ("batches"."first_crack_seconds" is null or ("batches"."first_crack_seconds" > 0 and ("batches"."total_seconds" is null or "batches"."first_crack_seconds" < "batches"."total_seconds"))),
	CONSTRAINT "batches_loss_pct_range" CHECK ("batches"."loss_pct" > 0 and "batches"."loss_pct" < 100)
);
--> statement-breakpoint
CREATE TABLE "roast_days" (
	"date" date PRIMARY KEY NOT NULL,
	"open" boolean NOT NULL,
	"capacity_grams" integer,
	"note" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "roast_days_capacity_non_negative" CHECK ("roast_days"."capacity_grams" is null or "roast_days"."capacity_grams" >= 0)
);
--> statement-breakpoint
CREATE TABLE "shop_settings" (
	"id" integer PRIMARY KEY DEFAULT 1 NOT NULL,
	"shop_name" text NOT NULL,
	"time_zone" text NOT NULL,
	"roast_weekdays" integer[] DEFAULT '{2,4}'::integer[] NOT NULL,
	"cutoff_time" text DEFAULT '12:00' NOT NULL,
	"cutoff_days_before" integer DEFAULT 1 NOT NULL,
	"ship_weekdays" integer[] DEFAULT '{1,2,3,4,5}'::integer[] NOT NULL,
	"transit_days" integer DEFAULT 3 NOT NULL,
	"degas_hold_days" integer DEFAULT 1 NOT NULL,
	"rest_days_filter" integer DEFAULT 2 NOT NULL,
	"rest_days_espresso" integer DEFAULT 7 NOT NULL,
	"best_before_days" integer DEFAULT 28 NOT NULL,
	"overage_pct" numeric(5, 2) DEFAULT 3 NOT NULL,
	"roaster_capacity_grams" integer DEFAULT 6000 NOT NULL,
	"min_load_pct" integer DEFAULT 50 NOT NULL,
	"max_load_pct" integer DEFAULT 80 NOT NULL,
	"daily_capacity_grams" integer DEFAULT 48000 NOT NULL,
	"loss_model" jsonb DEFAULT '{"light":{"minPct":11,"maxPct":14,"defaultPct":12.5},"medium":{"minPct":14,"maxPct":16,"defaultPct":15},"medium-dark":{"minPct":16,"maxPct":18,"defaultPct":17},"dark":{"minPct":18,"maxPct":20,"defaultPct":19},"french":{"minPct":20,"maxPct":25,"defaultPct":22}}'::jsonb NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "shop_settings_single_row" CHECK ("shop_settings"."id" = 1),
	CONSTRAINT "shop_settings_roast_weekdays_iso" CHECK ("shop_settings"."roast_weekdays" <@ array[1,2,3,4,5,6,7]),
	CONSTRAINT "shop_settings_ship_weekdays_iso" CHECK ("shop_settings"."ship_weekdays" <@ array[1,2,3,4,5,6,7] and cardinality("shop_settings"."ship_weekdays") > 0),
	CONSTRAINT "shop_settings_cutoff_time_format" CHECK ("shop_settings"."cutoff_time" ~ '^([01][0-9]|2[0-3]):[0-5][0-9]$'),
	CONSTRAINT "shop_settings_cutoff_days_before_range" CHECK ("shop_settings"."cutoff_days_before" between 0 and 14),
	CONSTRAINT "shop_settings_transit_days_range" CHECK ("shop_settings"."transit_days" between 0 and 30),
	CONSTRAINT "shop_settings_degas_hold_days_range" CHECK ("shop_settings"."degas_hold_days" between 0 and 30),
	CONSTRAINT "shop_settings_rest_days_range" CHECK ("shop_settings"."rest_days_filter" between 0 and 60 and "shop_settings"."rest_days_espresso" between 0 and 60),
	CONSTRAINT "shop_settings_best_before_days_range" CHECK ("shop_settings"."best_before_days" between 1 and 365),
	CONSTRAINT "shop_settings_overage_pct_range" CHECK ("shop_settings"."overage_pct" >= 0 and "shop_settings"."overage_pct" <= 50),
	CONSTRAINT "shop_settings_roaster_capacity_positive" CHECK ("shop_settings"."roaster_capacity_grams" > 0),
	CONSTRAINT "shop_settings_load_pct_range" CHECK ("shop_settings"."min_load_pct" > 0 and "shop_settings"."min_load_pct" <= "shop_settings"."max_load_pct" and "shop_settings"."max_load_pct" <= 100),
	CONSTRAINT "shop_settings_daily_capacity_non_negative" CHECK ("shop_settings"."daily_capacity_grams" >= 0)
);
--> statement-breakpoint
CREATE TABLE "journal_entries" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"user_id" uuid NOT NULL,
	"lot_id" uuid NOT NULL,
	"device" "home_roast_device" NOT NULL,
	"roasted_on" date NOT NULL,
	"green_grams" integer NOT NULL,
	"roasted_grams" integer NOT NULL,
	"yellow_seconds" integer,
	"first_crack_seconds" integer,
	"end_seconds" integer NOT NULL,
	"level_reached" "roast_level",
	"estimated_level" "roast_level" NOT NULL,
	"loss_pct" numeric(5, 2) NOT NULL,
	"development_seconds" integer,
	"notes" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "journal_entries_green_grams_positive" CHECK ("journal_entries"."green_grams" > 0),
	CONSTRAINT "journal_entries_roasted_grams_positive" CHECK ("journal_entries"."roasted_grams" > 0),
	CONSTRAINT "journal_entries_roasted_less_than_green" CHECK ("journal_entries"."roasted_grams" < "journal_entries"."green_grams"),
	CONSTRAINT "journal_entries_end_seconds_positive" CHECK ("journal_entries"."end_seconds" > 0),
	CONSTRAINT "journal_entries_yellow_before_end" CHECK ("journal_entries"."yellow_seconds" is null or ("journal_entries"."yellow_seconds" > 0 and "journal_entries"."yellow_seconds" < "journal_entries"."end_seconds")),
	CONSTRAINT "journal_entries_first_crack_before_end" CHECK ("journal_entries"."first_crack_seconds" is null or ("journal_entries"."first_crack_seconds" > 0 and "journal_entries"."first_crack_seconds" <= "journal_entries"."end_seconds")),
	CONSTRAINT "journal_entries_yellow_before_first_crack" CHECK ("journal_entries"."yellow_seconds" is null or "journal_entries"."first_crack_seconds" is null or "journal_entries"."yellow_seconds" < "journal_entries"."first_crack_seconds"),
	CONSTRAINT "journal_entries_development_non_negative" CHECK ("journal_entries"."development_seconds" is null or "journal_entries"."development_seconds" >= 0),
	CONSTRAINT "journal_entries_loss_pct_range" CHECK ("journal_entries"."loss_pct" > 0 and "journal_entries"."loss_pct" < 100)
);
--> statement-breakpoint
CREATE TABLE "email_outbox" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"template" text NOT NULL,
	"to_address" text NOT NULL,
	"subject" text NOT NULL,
	"payload" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"dedupe_key" text NOT NULL,
	"status" "outbox_status" DEFAULT 'pending' NOT NULL,
	"attempts" integer DEFAULT 0 NOT NULL,
	"last_error" text,
	"send_after" timestamp with time zone DEFAULT now() NOT NULL,
	"sent_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "email_outbox_attempts_non_negative" CHECK ("email_outbox"."attempts" >= 0)
);
--> statement-breakpoint
CREATE TABLE "payment_events" (
	"id" text PRIMARY KEY NOT NULL,
	"type" text NOT NULL,
	"received_at" timestamp with time zone DEFAULT now() NOT NULL,
	"processed_at" timestamp with time zone,
	"payload" jsonb NOT NULL
);
--> statement-breakpoint
ALTER TABLE "addresses" ADD CONSTRAINT "addresses_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "audit_log" ADD CONSTRAINT "audit_log_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "invitations" ADD CONSTRAINT "invitations_invited_by_users_id_fk" FOREIGN KEY ("invited_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "password_reset_tokens" ADD CONSTRAINT "password_reset_tokens_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sessions" ADD CONSTRAINT "sessions_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lot_price_breaks" ADD CONSTRAINT "lot_price_breaks_lot_id_lots_id_fk" FOREIGN KEY ("lot_id") REFERENCES "public"."lots"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_movements" ADD CONSTRAINT "stock_movements_lot_id_lots_id_fk" FOREIGN KEY ("lot_id") REFERENCES "public"."lots"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_movements" ADD CONSTRAINT "stock_movements_order_id_orders_id_fk" FOREIGN KEY ("order_id") REFERENCES "public"."orders"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_movements" ADD CONSTRAINT "stock_movements_batch_id_batches_id_fk" FOREIGN KEY ("batch_id") REFERENCES "public"."batches"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_movements" ADD CONSTRAINT "stock_movements_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "uploads" ADD CONSTRAINT "uploads_lot_id_lots_id_fk" FOREIGN KEY ("lot_id") REFERENCES "public"."lots"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "uploads" ADD CONSTRAINT "uploads_uploaded_by_users_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "order_items" ADD CONSTRAINT "order_items_order_id_orders_id_fk" FOREIGN KEY ("order_id") REFERENCES "public"."orders"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "order_items" ADD CONSTRAINT "order_items_lot_id_lots_id_fk" FOREIGN KEY ("lot_id") REFERENCES "public"."lots"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "orders" ADD CONSTRAINT "orders_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "orders" ADD CONSTRAINT "orders_subscription_id_subscriptions_id_fk" FOREIGN KEY ("subscription_id") REFERENCES "public"."subscriptions"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "orders" ADD CONSTRAINT "orders_delivery_id_deliveries_id_fk" FOREIGN KEY ("delivery_id") REFERENCES "public"."deliveries"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deliveries" ADD CONSTRAINT "deliveries_subscription_id_subscriptions_id_fk" FOREIGN KEY ("subscription_id") REFERENCES "public"."subscriptions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deliveries" ADD CONSTRAINT "deliveries_order_id_orders_id_fk" FOREIGN KEY ("order_id") REFERENCES "public"."orders"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rotation_picks" ADD CONSTRAINT "rotation_picks_lot_id_lots_id_fk" FOREIGN KEY ("lot_id") REFERENCES "public"."lots"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rotation_picks" ADD CONSTRAINT "rotation_picks_picked_by_users_id_fk" FOREIGN KEY ("picked_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "subscriptions" ADD CONSTRAINT "subscriptions_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "subscriptions" ADD CONSTRAINT "subscriptions_lot_id_lots_id_fk" FOREIGN KEY ("lot_id") REFERENCES "public"."lots"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bag_allocations" ADD CONSTRAINT "bag_allocations_batch_id_batches_id_fk" FOREIGN KEY ("batch_id") REFERENCES "public"."batches"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bag_allocations" ADD CONSTRAINT "bag_allocations_order_item_id_order_items_id_fk" FOREIGN KEY ("order_item_id") REFERENCES "public"."order_items"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bag_allocations" ADD CONSTRAINT "bag_allocations_order_id_orders_id_fk" FOREIGN KEY ("order_id") REFERENCES "public"."orders"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "batches" ADD CONSTRAINT "batches_lot_id_lots_id_fk" FOREIGN KEY ("lot_id") REFERENCES "public"."lots"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "batches" ADD CONSTRAINT "batches_operator_id_users_id_fk" FOREIGN KEY ("operator_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "journal_entries" ADD CONSTRAINT "journal_entries_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "journal_entries" ADD CONSTRAINT "journal_entries_lot_id_lots_id_fk" FOREIGN KEY ("lot_id") REFERENCES "public"."lots"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "addresses_user_id_idx" ON "addresses" USING btree ("user_id");--> statement-breakpoint
CREATE UNIQUE INDEX "addresses_one_default_per_user" ON "addresses" USING btree ("user_id") WHERE "addresses"."is_default";--> statement-breakpoint
CREATE INDEX "audit_log_at_idx" ON "audit_log" USING btree ("at");--> statement-breakpoint
CREATE INDEX "audit_log_action_at_idx" ON "audit_log" USING btree ("action","at");--> statement-breakpoint
CREATE INDEX "audit_log_actor_id_idx" ON "audit_log" USING btree ("actor_id");--> statement-breakpoint
CREATE UNIQUE INDEX "invitations_token_hash_key" ON "invitations" USING btree ("token_hash");--> statement-breakpoint
CREATE INDEX "invitations_email_idx" ON "invitations" USING btree ("email");--> statement-breakpoint
CREATE UNIQUE INDEX "password_reset_tokens_token_hash_key" ON "password_reset_tokens" USING btree ("token_hash");--> statement-breakpoint
CREATE INDEX "password_reset_tokens_user_id_idx" ON "password_reset_tokens" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "sessions_user_id_idx" ON "sessions" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "sessions_expires_at_idx" ON "sessions" USING btree ("expires_at");--> statement-breakpoint
CREATE UNIQUE INDEX "users_email_key" ON "users" USING btree ("email");--> statement-breakpoint
CREATE INDEX "users_role_idx" ON "users" USING btree ("role");--> statement-breakpoint
CREATE UNIQUE INDEX "lot_price_breaks_lot_id_min_grams_key" ON "lot_price_breaks" USING btree ("lot_id","min_grams");--> statement-breakpoint
CREATE UNIQUE INDEX "lots_code_key" ON "lots" USING btree ("code");--> statement-breakpoint
CREATE INDEX "lots_origin_idx" ON "lots" USING btree ("origin");--> statement-breakpoint
CREATE INDEX "lots_process_idx" ON "lots" USING btree ("process");--> statement-breakpoint
CREATE INDEX "lots_suggested_level_idx" ON "lots" USING btree ("suggested_level");--> statement-breakpoint
CREATE INDEX "stock_movements_lot_id_created_at_idx" ON "stock_movements" USING btree ("lot_id","created_at");--> statement-breakpoint
CREATE INDEX "stock_movements_order_id_idx" ON "stock_movements" USING btree ("order_id");--> statement-breakpoint
CREATE INDEX "stock_movements_batch_id_idx" ON "stock_movements" USING btree ("batch_id");--> statement-breakpoint
CREATE UNIQUE INDEX "uploads_storage_key_key" ON "uploads" USING btree ("storage_key");--> statement-breakpoint
CREATE INDEX "uploads_lot_id_kind_position_idx" ON "uploads" USING btree ("lot_id","kind","position");--> statement-breakpoint
CREATE INDEX "order_items_order_id_idx" ON "order_items" USING btree ("order_id");--> statement-breakpoint
CREATE INDEX "order_items_lot_id_idx" ON "order_items" USING btree ("lot_id");--> statement-breakpoint
CREATE INDEX "orders_user_id_created_at_idx" ON "orders" USING btree ("user_id","created_at");--> statement-breakpoint
CREATE INDEX "orders_status_idx" ON "orders" USING btree ("status");--> statement-breakpoint
CREATE INDEX "orders_roast_date_idx" ON "orders" USING btree ("roast_date");--> statement-breakpoint
CREATE INDEX "orders_ship_date_idx" ON "orders" USING btree ("ship_date");--> statement-breakpoint
CREATE INDEX "orders_subscription_id_idx" ON "orders" USING btree ("subscription_id");--> statement-breakpoint
CREATE UNIQUE INDEX "orders_delivery_id_key" ON "orders" USING btree ("delivery_id");--> statement-breakpoint
CREATE UNIQUE INDEX "orders_stripe_checkout_session_id_key" ON "orders" USING btree ("stripe_checkout_session_id");--> statement-breakpoint
CREATE UNIQUE INDEX "orders_stripe_invoice_id_key" ON "orders" USING btree ("stripe_invoice_id");--> statement-breakpoint
CREATE INDEX "orders_stripe_payment_intent_id_idx" ON "orders" USING btree ("stripe_payment_intent_id");--> statement-breakpoint
CREATE UNIQUE INDEX "deliveries_subscription_id_sequence_key" ON "deliveries" USING btree ("subscription_id","sequence");--> statement-breakpoint
CREATE INDEX "deliveries_roast_date_idx" ON "deliveries" USING btree ("roast_date");--> statement-breakpoint
CREATE UNIQUE INDEX "deliveries_order_id_key" ON "deliveries" USING btree ("order_id");--> statement-breakpoint
CREATE INDEX "subscriptions_user_id_idx" ON "subscriptions" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "subscriptions_status_idx" ON "subscriptions" USING btree ("status");--> statement-breakpoint
CREATE INDEX "subscriptions_lot_id_idx" ON "subscriptions" USING btree ("lot_id");--> statement-breakpoint
CREATE UNIQUE INDEX "subscriptions_stripe_subscription_id_key" ON "subscriptions" USING btree ("stripe_subscription_id");--> statement-breakpoint
CREATE INDEX "subscriptions_stripe_customer_id_idx" ON "subscriptions" USING btree ("stripe_customer_id");--> statement-breakpoint
CREATE INDEX "bag_allocations_batch_id_idx" ON "bag_allocations" USING btree ("batch_id");--> statement-breakpoint
CREATE INDEX "bag_allocations_order_id_idx" ON "bag_allocations" USING btree ("order_id");--> statement-breakpoint
CREATE INDEX "bag_allocations_order_item_id_idx" ON "bag_allocations" USING btree ("order_item_id");--> statement-breakpoint
CREATE INDEX "batches_lot_id_roast_level_idx" ON "batches" USING btree ("lot_id","roast_level");--> statement-breakpoint
CREATE INDEX "batches_roast_date_idx" ON "batches" USING btree ("roast_date");--> statement-breakpoint
CREATE INDEX "journal_entries_lot_id_idx" ON "journal_entries" USING btree ("lot_id");--> statement-breakpoint
CREATE INDEX "journal_entries_user_id_created_at_idx" ON "journal_entries" USING btree ("user_id","created_at");--> statement-breakpoint
CREATE UNIQUE INDEX "email_outbox_dedupe_key_key" ON "email_outbox" USING btree ("dedupe_key");--> statement-breakpoint
CREATE INDEX "email_outbox_status_send_after_idx" ON "email_outbox" USING btree ("status","send_after");--> statement-breakpoint
CREATE INDEX "email_outbox_created_at_idx" ON "email_outbox" USING btree ("created_at");--> statement-breakpoint
CREATE INDEX "payment_events_type_idx" ON "payment_events" USING btree ("type");