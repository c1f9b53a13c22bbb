import type { AppContext } from '../../context';
import { companyToday } from '../../core/company-today';
import type { AnnualServiceDueDto, ReplacementProspectDto } from '../../../shared/schemas/fleet';
import type { ApplianceKind, Fuel } from '../../../shared/schemas/enums';
import { addMonths } from '../../../shared/trade/iso-date';
import { wholeYearsBetween } from '../appliances';
import { findAnnualServiceDue } from './annual-service.repository';
import { findReplacementProspects } from './replacement-prospects.repository';

/** The fleet reports: appliances whose annual service is overdue, and those near or past their planning life. */
export function fleetService(ctx: AppContext) {
  return {
    async annualServiceDue(companyId: string, query: { limit: number }): Promise<AnnualServiceDueDto> {
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
    async replacementProspects(companyId: string, query: { nearYears: number; limit: number }): Promise<ReplacementProspectDto[]> {
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
  };
}
