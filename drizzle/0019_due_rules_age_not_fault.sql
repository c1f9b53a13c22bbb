-- Age is not a fault: the ASHRAE medians were default fixed-age replacement rules for circulators and burners.
-- Rules a company never changed (the old default's exact source) become the new default: inspected yearly,
-- replaced on condition, the median kept in the source as a planning age. Rules a company edited are left alone.
UPDATE "due_rules" SET "replacement_policy" = 'on_condition', "replacement_age_years" = NULL, "inspection_interval_months" = 12, "basis" = 'common_practice', "source" = 'common practice: inspected at every annual service visit; replaced on condition. ASHRAE Handbook, HVAC Applications, "Owning and Operating Costs" chapter, service-life table (1978 survey), secondary copy: "pumps, pipe-mounted" median 10 years is a planning age for the whole population, not a replacement date for one unit', "updated_at" = now()
WHERE "component_type" = 'circulator' AND "appliance_kind" IS NULL AND "replacement_policy" = 'fixed_age' AND "replacement_age_years" = 10 AND "source" = 'ASHRAE Handbook, HVAC Applications, "Owning and Operating Costs" chapter, service-life table (1978 survey), secondary copy: "pumps, pipe-mounted" median 10 years, used as a planning age (a median, not a prediction); inspected annually (common practice)';
--> statement-breakpoint
UPDATE "due_rules" SET "replacement_policy" = 'on_condition', "replacement_age_years" = NULL, "inspection_interval_months" = 12, "basis" = 'common_practice', "source" = 'common practice: inspected at every annual service visit; replaced on condition. ASHRAE Handbook, HVAC Applications, "Owning and Operating Costs" chapter, service-life table (1978 survey), secondary copy: "burners" median 21 years is a planning age for the whole population, not a replacement date for one unit', "updated_at" = now()
WHERE "component_type" = 'burners' AND "appliance_kind" IS NULL AND "replacement_policy" = 'fixed_age' AND "replacement_age_years" = 21 AND "source" = 'ASHRAE Handbook, HVAC Applications, "Owning and Operating Costs" chapter, service-life table (1978 survey), secondary copy: "burners" median 21 years, used as a planning age (a median, not a prediction); inspected annually (common practice)';

--> statement-breakpoint
-- The parts those rules govern get the due state the due engine (server/modules/due/due-recompute.sql.ts) gives an
-- on-condition rule inspected every 12 months; a part that failed on condition keeps "replace now".
UPDATE "components" c
SET "due_on" = d.due_on, "due_kind" = 'inspection', "due_reason" = d.due_reason
FROM (
  SELECT x.id,
    CASE WHEN x.base IS NULL THEN current_date ELSE (x.base + make_interval(months => 12))::date END AS due_on,
    CASE
      WHEN x.base IS NULL THEN 'no inspection or install date on record'
      WHEN x.base = x.last_inspected THEN 'every 12 months since last inspection ' || to_char(x.base, 'YYYY-MM-DD')
      ELSE 'every 12 months since ' || x.installed_from
    END AS due_reason
  FROM (
    SELECT p.id, p.last_inspected_on AS last_inspected,
      greatest(p.last_inspected_on, coalesce(p.installed_on, a.installed_on)) AS base,
      CASE
        WHEN p.installed_on IS NOT NULL THEN 'installed ' || to_char(p.installed_on, 'YYYY-MM-DD')
        WHEN a.installed_on IS NOT NULL THEN 'original with the appliance, installed ' || to_char(a.installed_on, 'YYYY-MM-DD')
      END AS installed_from
    FROM "components" p
    JOIN "appliances" a ON a.id = p.appliance_id AND a.company_id = p.company_id
    WHERE p.removed_on IS NULL AND p.condition_failed = false AND p.type_code IN ('circulator', 'burners')
      AND EXISTS (
        SELECT 1 FROM "due_rules" dr
        WHERE dr.company_id = p.company_id AND dr.component_type = p.type_code AND dr.appliance_kind IS NULL
          AND dr.source IN ('common practice: inspected at every annual service visit; replaced on condition. ASHRAE Handbook, HVAC Applications, "Owning and Operating Costs" chapter, service-life table (1978 survey), secondary copy: "pumps, pipe-mounted" median 10 years is a planning age for the whole population, not a replacement date for one unit', 'common practice: inspected at every annual service visit; replaced on condition. ASHRAE Handbook, HVAC Applications, "Owning and Operating Costs" chapter, service-life table (1978 survey), secondary copy: "burners" median 21 years is a planning age for the whole population, not a replacement date for one unit')
      )
      AND NOT EXISTS (
        SELECT 1 FROM "due_rules" dk
        WHERE dk.company_id = p.company_id AND dk.component_type = p.type_code AND dk.appliance_kind = a.kind
      )
  ) x
) d
WHERE c.id = d.id;
