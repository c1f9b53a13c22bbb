-- The templates every company already has: require on annual maintenance the combustion test and, where the
-- template records one, the low-water cutoff test (server/modules/checklists/default-checklists.ts for new companies).
UPDATE "checklist_templates" SET "required_readings" = jsonb_build_object('annual_maintenance', (
  SELECT coalesce(jsonb_agg(k), '[]'::jsonb)
  FROM unnest(ARRAY['combustion', 'lowWaterCutoff']) AS k
  WHERE "items" @> jsonb_build_array(jsonb_build_object('readings', jsonb_build_array(k)))
))
WHERE "required_readings" = '{}'::jsonb;--> statement-breakpoint
-- Open drafts get what a visit started now would copy: the template's readings for the visit type that its own
-- checklist records (the same template the start picks: the fuel's own before the kind's general one).
UPDATE "visits" v SET "required_readings" = coalesce((
  SELECT jsonb_agg(r)
  FROM jsonb_array_elements_text((
    SELECT t."required_readings" -> v."type"::text
    FROM "checklist_templates" t
    JOIN "appliances" a ON a."id" = v."appliance_id"
    WHERE t."company_id" = v."company_id" AND t."appliance_kind" = a."kind" AND (t."fuel" = a."fuel" OR t."fuel" IS NULL)
    ORDER BY t."fuel" IS NULL, t."created_at"
    LIMIT 1
  )) AS r
  WHERE v."checklist" @> jsonb_build_array(jsonb_build_object('readings', jsonb_build_array(r)))
), '[]'::jsonb)
WHERE v."status" = 'draft';
