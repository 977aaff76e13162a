CREATE TABLE "throttle_counters" (
	"key" text PRIMARY KEY NOT NULL,
	"hits" integer NOT NULL,
	"reset_at" timestamp with time zone NOT NULL,
	CONSTRAINT "throttle_counters_hits_not_negative" CHECK ("throttle_counters"."hits" >= 0)
);
--> statement-breakpoint
CREATE INDEX "throttle_counters_reset_at_idx" ON "throttle_counters" USING btree ("reset_at");