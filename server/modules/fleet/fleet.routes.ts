import { Router } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { currentMember } from '../../middleware/authenticate';
import { annualServiceDueQuery, replacementProspectsQuery, type AnnualServiceDueDto, type ReplacementProspectDto } from '../../../shared/schemas/fleet';
import { findReplacementProspects } from './replacement-prospects.repository';
import { wholeYearsBetween } from '../appliances/appliance-age';
import type { ApplianceKind, Fuel } from '../../../shared/schemas/enums';
import { addMonths } from '../../../shared/trade/iso-date';
import { companyToday } from '../../core/company-today';
import { findAnnualServiceDue } from './annual-service.repository';

export function fleetRoutes(ctx: AppContext) {
  const router = Router();
  defineRoute(
    router,
    'get',
    '/fleet/annual-service-due',
    { access: { permission: 'records:read' }, schemas: { query: annualServiceDueQuery } },
    async ({ query }, _req, res): Promise<AnnualServiceDueDto> => {
      const { companyId } = currentMember(res);
      const today = await companyToday(ctx.db, companyId);
      // "More than a year ago": the last annual visit was on or before this day a year back.
      const rows = await findAnnualServiceDue(ctx.db, companyId, addMonths(today, -12), query.limit);
      return {
        asOf: today,
        total: rows[0]?.total ?? 0,
        items: rows.map((r) => ({
          applianceId: r.appliance_id,
          kind: r.kind as ApplianceKind,
          fuel: r.fuel as Fuel,
          makeAndModel: [r.manufacturer, r.model].filter(Boolean).join(' ') || null,
          street: r.street,
          town: r.town,
          lastAnnualOn: r.last_annual_on,
          customer: { id: r.customer_id, name: r.name, phone: r.phone, email: r.email, remindersOptOut: r.reminders_opt_out },
        })),
      };
    },
  );
  defineRoute(
    router,
    'get',
    '/fleet/replacement-prospects',
    { access: { permission: 'records:read' }, schemas: { query: replacementProspectsQuery } },
    async ({ query }, _req, res): Promise<ReplacementProspectDto[]> => {
      const { companyId } = currentMember(res);
      const today = await companyToday(ctx.db, companyId);
      const rows = await findReplacementProspects(ctx.db, companyId, today, query.nearYears, query.limit);
      return rows.map((r) => {
        const ageYears = wholeYearsBetween(r.age_from, today);
        return {
          applianceId: r.appliance_id,
          kind: r.kind as ApplianceKind,
          fuel: r.fuel as Fuel,
          makeAndModel: [r.manufacturer, r.model].filter(Boolean).join(' ') || null,
          street: r.street,
          town: r.town,
          customerName: r.customer_name,
          ageYears,
          medianYears: r.median_years,
          status: ageYears >= r.median_years ? 'past' : 'near',
          lastCombustion:
            r.combustion && r.combustion_on
              ? { on: r.combustion_on, efficiencyPct: r.combustion.efficiencyPct ?? null, coAirFreePpm: r.combustion.coAirFreePpm ?? null }
              : null,
        };
      });
    },
  );
  return router;
}
