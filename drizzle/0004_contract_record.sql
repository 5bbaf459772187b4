ALTER TYPE "public"."pay_unit" ADD VALUE 'DAY' BEFORE 'm3';--> statement-breakpoint
ALTER TYPE "public"."pay_unit" ADD VALUE 'HR' BEFORE 'm3';--> statement-breakpoint
-- Bid items keep their original unit price; approved price changes are read from change orders. Earlier
-- approvals wrote the new price onto the bid item: put back the price it had before its first approved change.
UPDATE "bid_items" AS b SET "unit_price_cents" = f."from_price"
FROM (
  SELECT DISTINCT ON (elem->>'bidItemId') (elem->>'bidItemId')::uuid AS "id", (elem->>'from')::bigint AS "from_price"
  FROM "audit_events" a, jsonb_array_elements(a."after"->'applied') AS elem
  WHERE a."action" = 'change_order.approved' AND elem->>'kind' = 'change_price' AND elem->>'from' IS NOT NULL
  ORDER BY elem->>'bidItemId', a."created_at" ASC, a."id" ASC
) AS f
WHERE b."id" = f."id";
