-- Custom migration (hand-written): stored due reasons say their dates in words ("installed Mar 31, 2004"), as the
-- recompute statement now writes them (server/modules/due/due-recompute.sql.ts; formatCalendarDate in en-US).
-- A reason holds at most one date; the statement is run twice so that a second one would be turned as well.
UPDATE "components"
SET "due_reason" = regexp_replace("due_reason", '\d{4}-\d{2}-\d{2}', to_char(substring("due_reason" from '\d{4}-\d{2}-\d{2}')::date, 'Mon FMDD, YYYY'))
WHERE "due_reason" ~ '\d{4}-\d{2}-\d{2}';--> statement-breakpoint
UPDATE "components"
SET "due_reason" = regexp_replace("due_reason", '\d{4}-\d{2}-\d{2}', to_char(substring("due_reason" from '\d{4}-\d{2}-\d{2}')::date, 'Mon FMDD, YYYY'))
WHERE "due_reason" ~ '\d{4}-\d{2}-\d{2}';
