ALTER TABLE "due_rules" ADD COLUMN "planning_age_years" integer;--> statement-breakpoint
-- Age is not a fault (as 0019 for the ASHRAE defaults): a learned median adopted before this migration was written as a
-- fixed replacement age. It becomes the rule's planning age; the part is inspected (every 12 months unless the rule
-- had its own interval) and replaced on condition. The parts those rules govern get the due state the due engine
-- (server/modules/due/due-recompute.sql.ts) gives such a rule; a part that failed on condition keeps "replace now".
WITH converted AS (
  UPDATE "due_rules"
  SET "planning_age_years" = "replacement_age_years", "replacement_policy" = 'on_condition', "replacement_age_years" = NULL,
      "inspection_interval_months" = coalesce("inspection_interval_months", 12),
      "source" = "source" || ' Adopted as a planning age (inspect and plan), not a replacement date: medians describe populations, not one unit.',
      "updated_at" = now()
  WHERE "basis" = 'learned' AND "replacement_policy" = 'fixed_age' AND "source" LIKE 'Learned from %'
  RETURNING "company_id", "component_type", "appliance_kind", "inspection_interval_months"
)
UPDATE "components" c
SET "due_on" = d.due_on, "due_kind" = 'inspection', "due_reason" = d.due_reason
FROM (
  SELECT x.id,
    CASE WHEN x.base IS NULL THEN current_date ELSE (x.base + make_interval(months => x.months))::date END AS due_on,
    CASE
      WHEN x.base IS NULL THEN 'no inspection or install date on record'
      WHEN x.base = x.last_inspected THEN 'every ' || x.months || ' months since last inspection ' || to_char(x.base, 'YYYY-MM-DD')
      ELSE 'every ' || x.months || ' months since ' || x.installed_from
    END AS due_reason
  FROM (
    SELECT p.id, p.last_inspected_on AS last_inspected, r.inspection_interval_months AS months,
      greatest(p.last_inspected_on, coalesce(p.installed_on, a.installed_on)) AS base,
      CASE
        WHEN p.installed_on IS NOT NULL THEN 'installed ' || to_char(p.installed_on, 'YYYY-MM-DD')
        WHEN a.installed_on IS NOT NULL THEN 'original with the appliance, installed ' || to_char(a.installed_on, 'YYYY-MM-DD')
      END AS installed_from
    FROM "components" p
    JOIN "appliances" a ON a.id = p.appliance_id AND a.company_id = p.company_id
    JOIN converted r ON r.company_id = p.company_id AND r.component_type = p.type_code
      AND (r.appliance_kind = a.kind OR (r.appliance_kind IS NULL AND NOT EXISTS (
        SELECT 1 FROM "due_rules" dk
        WHERE dk.company_id = p.company_id AND dk.component_type = p.type_code AND dk.appliance_kind = a.kind
      )))
    WHERE p.removed_on IS NULL AND p.condition_failed = false
  ) x
) d
WHERE c.id = d.id;
