import { sql, type SQL } from 'drizzle-orm';

/**
 * One UPDATE … FROM that writes components.due_on / due_kind / due_reason for the components `scope` selects.
 * It mirrors computeComponentDue (shared/trade/due-dates.ts) step by step; tests/api/due.test.ts compares the two.
 *
 * due_reason holds the "why" part of computeComponentDue's reason (it does not go stale as days pass);
 * describeStoredDue (due-status.ts) rebuilds the full sentence for a given today.
 *
 * `today` is the company's date, worked out by the caller.
 *
 * Dates in due_reason are written for people, as formatCalendarDate (shared/format/dates.ts) writes them in the
 * company locale (en-US): to_char's 'Mon FMDD, YYYY' gives "Jan 6, 2026" (English month names: no TM prefix, so
 * lc_time does not change them). The parity test in tests/api/due.test.ts compares the two.
 */
const READABLE_DATE = sql.raw(`'Mon FMDD, YYYY'`);

export function recomputeDueStatement(scope: SQL, today: string): SQL {
  return sql`
    with base as (
      select
        c.id,
        c.condition_failed,
        r.replacement_policy as policy,
        r.replacement_age_years as age_years,
        r.inspection_interval_months as interval_months,
        coalesce(c.installed_on, a.installed_on) as installed,
        case
          when c.installed_on is not null then 'installed ' || to_char(c.installed_on, ${READABLE_DATE})
          when a.installed_on is not null then 'original with the appliance, installed ' || to_char(a.installed_on, ${READABLE_DATE})
        end as installed_from,
        c.last_inspected_on as last_inspected,
        ${today}::date as today
      from components c
      join appliances a on a.id = c.appliance_id and a.company_id = c.company_id
      left join lateral (
        select dr.replacement_policy, dr.replacement_age_years, dr.inspection_interval_months
        from due_rules dr
        where dr.company_id = c.company_id
          and dr.component_type = c.type_code
          and (dr.appliance_kind = a.kind or dr.appliance_kind is null)
        -- a kind-specific rule wins over the rule for every kind
        order by dr.appliance_kind nulls last
        limit 1
      ) r on true
      where c.removed_on is null and ${scope}
    ),
    dated as (
      select
        base.*,
        case
          when policy in ('fixed_age', 'annual') and installed is not null then
            (installed + make_interval(months => case when policy = 'annual' then 12 else age_years * 12 end))::date
        end as replacement_due,
        case
          when policy = 'annual' then 'replaced at every annual service (' || installed_from || ')'
          else 'replacement age ' || age_years || ' years (' || installed_from || ')'
        end as replacement_why,
        greatest(last_inspected, installed) as inspect_base
      from base
    ),
    inspected as (
      select
        dated.*,
        case
          when interval_months is null then null
          when inspect_base is null then today
          else (inspect_base + make_interval(months => interval_months))::date
        end as inspection_due,
        case
          when inspect_base is null then 'no inspection or install date on record'
          when inspect_base = last_inspected then
            'every ' || interval_months || ' months since last inspection ' || to_char(inspect_base, ${READABLE_DATE})
          else 'every ' || interval_months || ' months since ' || installed_from
        end as inspection_why
      from dated
    ),
    decided as (
      select
        id,
        case
          when condition_failed then today
          when policy is null then null
          -- earliest first; on a tie the replacement wins, since fitting a new part includes looking at it
          when replacement_due is not null and (inspection_due is null or replacement_due <= inspection_due) then replacement_due
          else inspection_due
        end as due_on,
        case
          when condition_failed then 'replacement'
          when policy is null then null
          when replacement_due is not null and (inspection_due is null or replacement_due <= inspection_due) then 'replacement'
          when inspection_due is not null then 'inspection'
        end as due_kind,
        case
          when condition_failed then 'Failed on condition at inspection: replace now. Findings override age.'
          when policy is null then null
          when replacement_due is not null and (inspection_due is null or replacement_due <= inspection_due) then replacement_why
          when inspection_due is not null then inspection_why
          when policy <> 'on_condition' and installed is null then
            'Install date unknown, so the age-based replacement date cannot be worked out. Record the install date.'
          else 'Replaced on condition; no scheduled inspection.'
        end as due_reason
      from inspected
    )
    update components c
    set due_on = d.due_on, due_kind = d.due_kind, due_reason = d.due_reason
    from decided d
    where c.id = d.id
      and (c.due_on is distinct from d.due_on or c.due_kind is distinct from d.due_kind or c.due_reason is distinct from d.due_reason)
  `;
}
