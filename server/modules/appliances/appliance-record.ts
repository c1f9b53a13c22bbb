import type { DbOrTx } from '../../db/client';
import { notFound } from '../../lib/http-error';
import type { ApplianceDto, ApplianceRecordDto } from '../../../shared/schemas/records';
import { nextBookingOf } from '../bookings';
import { companyDueClock } from '../../core/company-today';
import { findCustomer } from '../../core/tenant-finders';
import { toCustomerDto } from '../../core/customer-dto';
import { findSiteDto } from '../sites';
import { ageStartDate, endOfLifeFor, wholeYearsBetween } from './appliance-age';
import { applianceLabel } from './appliance-label';
import { appliancesRepository, type ApplianceRow } from './appliances.repository';
import { transferProvenance } from '../record-transfers';
import { toComponentDto } from './component-dto';

const STATUS_ORDER = { replace_now: 0, overdue: 1, due_soon: 2, ok: 3 } as const;

function toApplianceDto(a: ApplianceRow, replaced: ApplianceRow | null): ApplianceDto {
  return {
    id: a.id,
    siteId: a.siteId,
    kind: a.kind,
    fuel: a.fuel,
    construction: a.construction,
    manufacturer: a.manufacturer,
    model: a.model,
    serial: a.serial,
    status: a.status,
    installedOn: a.installedOn,
    location: a.location,
    inputBtuh: a.inputBtuh,
    firingRateGph: a.firingRateGph,
    grossOutputBtuh: a.grossOutputBtuh,
    mawpPsi: a.mawpPsi,
    manufacturedMonth: a.manufacturedMonth,
    manufacturedYear: a.manufacturedYear,
    ignitionType: a.ignitionType,
    burnerCount: a.burnerCount,
    ventType: a.ventType,
    replacedById: a.replacedById,
    replaces: replaced ? { id: replaced.id, label: applianceLabel(replaced) } : null,
  };
}

/** Everything the life record shows about one appliance, read with the caller's company. */
export async function loadApplianceRecord(db: DbOrTx, companyId: string, applianceId: string): Promise<ApplianceRecordDto> {
  const appliance = await appliancesRepository.find(db, companyId, applianceId);
  if (!appliance) throw notFound('Appliance');
  const [site, { today, dueSoonDays }, replaced, componentRows, lastVisit, draft, nextBooking, transferredFrom] = await Promise.all([
    findSiteDto(db, companyId, appliance.siteId),
    companyDueClock(db, companyId),
    appliancesRepository.findReplaced(db, companyId, applianceId),
    appliancesRepository.components(db, companyId, applianceId),
    appliancesRepository.latestVisit(db, companyId, applianceId, 'completed'),
    appliancesRepository.latestVisit(db, companyId, applianceId, 'draft'),
    nextBookingOf(db, companyId, applianceId),
    transferProvenance(db, appliance.importedFromTransferId),
  ]);
  const customer = site && (await findCustomer(db, companyId, site.customerId));
  if (!site || !customer) throw notFound('Appliance');

  const componentDtos = componentRows.map((r) => toComponentDto(r.component, r.catalogLabel, today, dueSoonDays));
  const due = componentDtos
    .filter((c) => c.due && !c.removedOn)
    .map((c) => ({ componentId: c.id, typeLabel: c.typeLabel, kind: c.due!.kind, dueOn: c.due!.dueOn, status: c.due!.status, reason: c.due!.reason }))
    .sort((a, b) => STATUS_ORDER[a.status] - STATUS_ORDER[b.status] || a.dueOn.localeCompare(b.dueOn));
  const ageFrom = ageStartDate(appliance);

  return {
    appliance: toApplianceDto(appliance, replaced),
    site,
    customer: toCustomerDto(customer),
    ageYears: ageFrom && ageFrom <= today ? wholeYearsBetween(ageFrom, today) : null,
    components: componentDtos,
    lastVisit: lastVisit && { id: lastVisit.id, visitedOn: lastVisit.visitedOn, type: lastVisit.type, outcome: lastVisit.outcome },
    openDraftVisitId: draft?.id ?? null,
    nextBooking,
    unsafe:
      lastVisit?.outcome === 'shut_down_unsafe' ? { visitId: lastVisit.id, visitedOn: lastVisit.visitedOn, reason: lastVisit.outcomeReason } : null,
    due,
    endOfLife: endOfLifeFor(appliance, today),
    transferredFrom,
  };
}
