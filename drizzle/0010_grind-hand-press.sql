-- The grind for a hand-held plunger press is named for what it is, not for a brand.
ALTER TYPE "public"."grind" RENAME VALUE 'aeropress' TO 'hand-press';
