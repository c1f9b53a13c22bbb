import { LABELS } from '../../shared/schemas/enums';
import { PHOTO_KIND_LABELS, PHOTO_KINDS } from '../../shared/schemas/photos';
import { INVENTED_NEIGHBOUR_TOWNS } from '../../server/db/factories/invented-names';
import { READINGS_PER_WEAR, WEAR_LEVELS, type buildPrototypes } from './prototypes';
import type { buildNameLists } from './name-lists';

export type LoadStep = { name: string; sql: string; params?: unknown[] };

/** Share of years with an annual visit, of visits with a part swap and of visits with a photo. */
const VISIT_YEAR_SHARE = 0.5;
/** In the last two years most customers are on an annual service agreement, as a working company's records show. */
const RECENT_VISIT_YEAR_SHARE = 0.92;
const SWAP_SHARE = 0.28;
const PHOTO_SHARE = 0.15;
const HISTORY_DAYS = 7305; // 20 years

/** Temp tables the set-based steps read: the companies to fill and the prototypes built in JS. */
export function prototypeSteps(protos: ReturnType<typeof buildPrototypes>): LoadStep[] {
  return [
    {
      name: 'prototypes',
      sql: `
        create temp table bench_proto as
        select * from jsonb_to_recordset($1::jsonb) as t(p int, kind text, fuel text, construction text, manufacturer text, model text,
          input_btuh int, firing_rate_gph numeric, gross_output_btuh int, mawp_psi numeric, manufactured_month smallint, location text,
          ignition_type text, burner_count smallint, vent_type text, nslots int);
        create temp table bench_proto_slot as
        select * from jsonb_to_recordset($2::jsonb) as t(p int, slot int, type_code text, spec jsonb, spec_key text, label text, reasons text[], annual boolean);
        create temp table bench_reading as
        select * from jsonb_to_recordset($3::jsonb) as t(p int, wear int, r int, readings jsonb, results jsonb, key jsonb, summary text, findings text);
        create index on bench_proto_slot (p, slot);
        create index on bench_reading (p, wear, r);`,
      params: [
        JSON.stringify(
          protos.prototypes.map(({ p, row }) => ({
            p,
            kind: row.kind,
            fuel: row.fuel,
            construction: row.construction,
            manufacturer: row.manufacturer,
            model: row.model,
            input_btuh: row.inputBtuh,
            firing_rate_gph: row.firingRateGph,
            gross_output_btuh: row.grossOutputBtuh,
            mawp_psi: row.mawpPsi,
            manufactured_month: row.manufacturedMonth,
            location: row.location,
            ignition_type: row.ignitionType,
            burner_count: row.burnerCount,
            vent_type: row.ventType,
            nslots: protos.slots.filter((s) => s.p === p).length,
          })),
        ),
        JSON.stringify(protos.slots.map((s) => ({ p: s.p, slot: s.slot, type_code: s.typeCode, spec: s.spec, spec_key: s.specKey, label: s.label, reasons: s.reasons, annual: s.annual }))),
        JSON.stringify(protos.readings),
      ],
    },
  ];
}

const PROTOTYPE_PICK = `floor(pg_temp.h(co.k || ':ap:' || i) * (select count(*) from bench_proto))::int`;

export function recordSteps(opts: { today: string; names: ReturnType<typeof buildNameLists> }): LoadStep[] {
  if (!/^\d{4}-\d{2}-\d{2}$/.test(opts.today)) throw new Error(`today must be YYYY-MM-DD, got ${opts.today}`);
  const today = `'${opts.today}'::date`;
  return [
    {
      name: 'customers',
      sql: `
        insert into customers (id, company_id, name, kind, phone, email, reminders_opt_out)
        select pg_temp.uid(co.k || ':c:' || i), co.id, nm.fn || ' ' || nm.ln,
          (case when pg_temp.h(co.k || ':ck:' || i) < 0.9 then 'homeowner' when pg_temp.h(co.k || ':ck:' || i) < 0.97 then 'landlord' else 'property_manager' end)::customer_kind,
          '555-' || lpad(floor(pg_temp.h(co.k || ':cp:' || i) * 10000)::int::text, 4, '0'),
          lower(regexp_replace(nm.fn || '.' || nm.ln, '[^A-Za-z.]', '', 'g')) || i || '@example.test',
          pg_temp.h(co.k || ':co:' || i) < 0.03
        from bench_co co cross join generate_series(1, co.n_cust) i
        cross join lateral (select pg_temp.pick($1::text[], co.k || ':cf:' || i) as fn, pg_temp.pick($2::text[], co.k || ':cl:' || i) as ln) nm`,
      params: [opts.names.firstNames, opts.names.lastNames],
    },
    {
      name: 'sites',
      sql: `
        insert into sites (id, company_id, customer_id, street, town, postal_code, assigned_technician_id)
        select pg_temp.uid(co.k || ':s:' || i), co.id,
          pg_temp.uid(co.k || ':c:' || (case when i <= co.n_cust then i else pg_temp.between_int(1, co.n_cust, co.k || ':sc:' || i) end)),
          pg_temp.between_int(1, 1990, co.k || ':sn:' || i) || ' ' || pg_temp.pick($1::text[], co.k || ':ss:' || i),
          pg_temp.pick($2::text[], co.k || ':st:' || i),
          lpad(pg_temp.between_int(100, 999, co.k || ':sz:' || i)::text, 5, '0'),
          co.techs[pg_temp.between_int(1, cardinality(co.techs), co.k || ':sx:' || i)]
        from bench_co co cross join generate_series(1, co.n_site) i`,
      params: [opts.names.streets, INVENTED_NEIGHBOUR_TOWNS],
    },
    {
      name: 'appliances',
      sql: `
        create temp table bench_app as
        select co.k, i as n, pg_temp.uid(co.k || ':a:' || i) as id, co.id as company_id,
          pg_temp.uid(co.k || ':s:' || (case when i <= co.n_site then i else pg_temp.between_int(1, co.n_site, co.k || ':as:' || i) end)) as site_id,
          ${PROTOTYPE_PICK} as p,
          ${today} - pg_temp.between_int(365, 24 * 365, co.k || ':ai:' || i) as installed_on,
          case when pg_temp.h(co.k || ':ax:' || i) < 0.02 then 'removed' when pg_temp.h(co.k || ':ax:' || i) < 0.03 then 'out_of_service' else 'in_service' end as status,
          co.techs[pg_temp.between_int(1, cardinality(co.techs), co.k || ':at:' || i)] as tech
        from bench_co co cross join generate_series(1, co.n_app) i;
        insert into appliances (id, company_id, site_id, kind, fuel, construction, manufacturer, model, serial, input_btuh, firing_rate_gph,
          gross_output_btuh, mawp_psi, manufactured_month, manufactured_year, installed_on, location, ignition_type, burner_count, vent_type,
          status, created_by, updated_by)
        select a.id, a.company_id, a.site_id, pr.kind::appliance_kind, pr.fuel::fuel, pr.construction::construction, pr.manufacturer, pr.model,
          upper(left(pr.manufacturer, 1)) || to_char(a.installed_on, 'YY') || upper(substr(md5(a.id::text), 1, 7)),
          pr.input_btuh, pr.firing_rate_gph, pr.gross_output_btuh, pr.mawp_psi, pr.manufactured_month, extract(year from a.installed_on)::smallint,
          a.installed_on, pr.location, pr.ignition_type::ignition_type, pr.burner_count, pr.vent_type::vent_type, a.status::appliance_status, a.tech, a.tech
        from bench_app a join bench_proto pr on pr.p = a.p`,
    },
    {
      name: 'visits',
      sql: `
        create temp table bench_vis as
        select a.k, a.n, a.id as appliance_id, a.company_id, a.p, a.tech, y, pg_temp.uid(a.k || ':v:' || a.n || ':' || y) as id, d.visited_on,
          least(${WEAR_LEVELS - 1}, round((d.visited_on - a.installed_on) / 365.0 / 40 * ${WEAR_LEVELS - 1}))::int as wear,
          floor(pg_temp.h(a.k || ':vr:' || a.n || ':' || y) * ${READINGS_PER_WEAR})::int as r,
          (case when t.x < 0.86 then 'annual_maintenance' when t.x < 0.93 then 'repair' when t.x < 0.98 then 'no_heat' else 'inspection' end) as type,
          (d.visited_on + time '13:00' + make_interval(hours => pg_temp.between_int(0, 5, a.k || ':vh:' || a.n || ':' || y))) at time zone 'UTC' as arrived_at
        from bench_app a cross join generate_series(1, 24) y
        cross join lateral (select a.installed_on + y * 365 + pg_temp.between_int(-20, 20, a.k || ':vd:' || a.n || ':' || y) as visited_on) d
        cross join lateral (select pg_temp.h(a.k || ':vt:' || a.n || ':' || y) as x) t
        where d.visited_on < ${today} and d.visited_on > ${today} - ${HISTORY_DAYS}
          and pg_temp.h(a.k || ':vy:' || a.n || ':' || y) < (case when d.visited_on > ${today} - 730 then ${RECENT_VISIT_YEAR_SHARE} else ${VISIT_YEAR_SHARE} end);
        alter table bench_vis add column departed_at timestamptz;
        update bench_vis set departed_at = arrived_at + make_interval(mins => pg_temp.between_int(60, 150, k || ':vm:' || n || ':' || y));
        create temp table bench_last as select appliance_id, max(visited_on) as last_visit from bench_vis group by appliance_id;
        insert into visits (id, company_id, appliance_id, type, status, visited_on, technician_ids, arrived_at, departed_at, readings, results, findings,
          recommendations, outcome, signed_off_by, signed_off_at, completed_at, revision, created_by, updated_by)
        select v.id, v.company_id, v.appliance_id, v.type::visit_type, 'completed', v.visited_on, array[v.tech], v.arrived_at, v.departed_at,
          rd.readings, rd.results, rd.findings, '', 'left_operating', v.tech, v.departed_at, v.departed_at, 1, v.tech, v.tech
        from bench_vis v join bench_reading rd on rd.p = v.p and rd.wear = v.wear and rd.r = v.r`,
    },
    {
      name: 'components and part swaps',
      sql: `
        create temp table bench_swp as
        select sw.*, row_number() over (partition by sw.appliance_id, sw.slot order by sw.visited_on) as seg
        from (
          -- one part at random at some visits, and the annual parts at every visit, one swap per part per visit
          select distinct on (v.id, ps.slot) v.*, ps.slot, ps.type_code, ps.spec_key, ps.label,
            pg_temp.uid(v.k || ':sw:' || v.n || ':' || v.y || ':' || ps.slot) as swap_id,
            ps.reasons[pg_temp.between_int(1, cardinality(ps.reasons), v.k || ':rs:' || v.n || ':' || v.y || ':' || ps.slot)] as reason
          from bench_vis v
          join bench_proto pr on pr.p = v.p
          join bench_proto_slot ps on ps.p = v.p
            and (ps.annual or (ps.slot = floor(pg_temp.h(v.k || ':sl:' || v.n || ':' || v.y) * pr.nslots)::int
                               and pg_temp.h(v.k || ':sx:' || v.n || ':' || v.y) < ${SWAP_SHARE}))
          order by v.id, ps.slot
        ) sw;
        insert into components (id, company_id, appliance_id, type_code, spec, spec_key, installed_on, original_with_appliance, last_inspected_on,
          removed_on, removal_reason, replaced_by_id, condition_failed, condition_note, note, created_by, updated_by)
        select pg_temp.uid(s.k || ':p:' || s.n || ':' || s.slot || ':' || s.seg), s.company_id, s.appliance_id, ps.type_code, ps.spec, ps.spec_key,
          s.installed_on, s.seg = 0,
          case when s.next_on is null then l.last_visit end,
          s.next_on, s.next_reason,
          case when s.next_on is not null then pg_temp.uid(s.k || ':p:' || s.n || ':' || s.slot || ':' || (s.seg + 1)) end,
          s.next_on is null and pg_temp.h(s.k || ':cf:' || s.n || ':' || s.slot) < 0.004,
          case when s.next_on is null and pg_temp.h(s.k || ':cf:' || s.n || ':' || s.slot) < 0.004 then 'Failed the check at the last visit: replace.' end,
          null, s.tech, s.tech
        from (
          select seg.*, lead(seg.installed_on) over w as next_on, lead(seg.reason) over w as next_reason
          from (
            select a.k, a.n, a.id as appliance_id, a.company_id, a.p, a.tech, ps.slot, 0::bigint as seg, null::date as installed_on, null::text as reason
              from bench_app a join bench_proto_slot ps on ps.p = a.p
            union all
            select k, n, appliance_id, company_id, p, tech, slot, seg, visited_on, reason from bench_swp
          ) seg
          window w as (partition by seg.appliance_id, seg.slot order by seg.seg)
        ) s
        join bench_proto_slot ps on ps.p = s.p and ps.slot = s.slot
        left join bench_last l on l.appliance_id = s.appliance_id;
        insert into part_swaps (id, company_id, visit_id, appliance_id, removed_component_id, new_component_id, swapped_on, reason, created_by)
        select swap_id, company_id, id, appliance_id, pg_temp.uid(k || ':p:' || n || ':' || slot || ':' || (seg - 1)),
          pg_temp.uid(k || ':p:' || n || ':' || slot || ':' || seg), visited_on, reason, tech
        from bench_swp`,
    },
    {
      name: 'photos (metadata only)',
      sql: `
        create temp table bench_pho as
        select v.*, pg_temp.uid(v.k || ':ph:' || v.n || ':' || v.y) as photo_id,
          pg_temp.pick($1::text[], v.k || ':pk:' || v.n || ':' || v.y) as photo_kind,
          pg_temp.h(v.k || ':pv:' || v.n || ':' || v.y) < 0.5 as shown
        from bench_vis v where pg_temp.h(v.k || ':ph:' || v.n || ':' || v.y) < ${PHOTO_SHARE};
        insert into photos (id, company_id, appliance_id, visit_id, kind, homeowner_visible, sha256, width, height, display_key, thumb_key, bytes,
          created_by, created_at)
        select photo_id, company_id, appliance_id, id, photo_kind::photo_kind, shown, md5(photo_id::text) || md5(id::text), 1600, 1200,
          company_id || '/' || appliance_id || '/' || photo_id || '-display.jpg', company_id || '/' || appliance_id || '/' || photo_id || '-thumb.jpg',
          pg_temp.between_int(120000, 420000, k || ':pb:' || n || ':' || y), tech, departed_at
        from bench_pho`,
      params: [[...PHOTO_KINDS]],
    },
    {
      name: 'timeline events',
      sql: `
        insert into timeline_events (company_id, appliance_id, occurred_at, kind, ref_id, summary, data, homeowner_visible, actor_id)
        select a.company_id, a.id, (a.installed_on + time '12:00') at time zone 'UTC', 'install', null,
          'Installed: ' || pr.manufacturer || ' ' || pr.model || ', ' || lower($1::jsonb ->> pr.kind) || '.', '{}'::jsonb, true, a.tech
        from bench_app a join bench_proto pr on pr.p = a.p;
        insert into timeline_events (company_id, appliance_id, occurred_at, kind, ref_id, summary, data, homeowner_visible, actor_id)
        select v.company_id, v.appliance_id, v.departed_at, 'visit', v.id,
          ($2::jsonb ->> v.type) || ': left operating.' || coalesce(' Replaced: ' || s.parts || '.', ''),
          jsonb_build_object('visitId', v.id, 'type', v.type, 'outcome', 'left_operating', 'visitedOn', v.visited_on, 'swapIds', coalesce(s.ids, '[]'::jsonb)),
          true, v.tech
        from bench_vis v
        left join (
          select id, string_agg(label || case when spec_key <> '' then ' (' || spec_key || ')' else '' end, ', ' order by slot) as parts,
            jsonb_agg(swap_id order by slot) as ids
          from bench_swp group by id
        ) s on s.id = v.id;
        insert into timeline_events (company_id, appliance_id, occurred_at, kind, ref_id, summary, data, homeowner_visible, actor_id)
        select v.company_id, v.appliance_id, v.departed_at, 'reading', v.id, rd.summary,
          jsonb_build_object('visitId', v.id, 'visitedOn', v.visited_on) || coalesce(rd.key, '{}'::jsonb), true, v.tech
        from bench_vis v join bench_reading rd on rd.p = v.p and rd.wear = v.wear and rd.r = v.r;
        insert into timeline_events (company_id, appliance_id, occurred_at, kind, ref_id, summary, data, homeowner_visible, actor_id)
        select company_id, appliance_id, departed_at - interval '1 minute', 'part_swap', swap_id,
          'Replaced the ' || label || case when spec_key <> '' then ' (' || spec_key || ')' else '' end || ': ' || reason || '.',
          jsonb_build_object('swapId', swap_id, 'visitId', id, 'typeCode', type_code, 'specKey', spec_key, 'swappedOn', visited_on,
            'removedComponentId', pg_temp.uid(k || ':p:' || n || ':' || slot || ':' || (seg - 1)), 'newComponentId', pg_temp.uid(k || ':p:' || n || ':' || slot || ':' || seg)),
          true, tech
        from bench_swp;
        insert into timeline_events (company_id, appliance_id, occurred_at, kind, ref_id, summary, data, homeowner_visible, actor_id)
        select company_id, appliance_id, departed_at, 'photo', photo_id, ($3::jsonb ->> photo_kind) || ' photo added',
          jsonb_build_object('photo', jsonb_build_object('kind', photo_kind, 'visitId', id, 'componentId', null)), shown, tech
        from bench_pho`,
      params: [JSON.stringify(LABELS.applianceKind), JSON.stringify(LABELS.visitType), JSON.stringify(PHOTO_KIND_LABELS)],
    },
  ];
}
