import type { BookingDto, LoadListDto, LoadListLineDto } from '../../../shared/schemas/bookings';
import { LABELS, type ApplianceKind, type Fuel, type VisitOutcome } from '../../../shared/schemas/enums';
import { localDateTimeOf } from '../../../shared/dates';
import { formatCalendarDate } from '../../../shared/format/dates';
import { typeLabelFor } from '../../core/type-label';
import type { BookingRow, bookingsRepository } from './bookings.repository';

type Details = Awaited<ReturnType<typeof bookingsRepository.details>>;
export type Part = Omit<Details['parts'][number], 'id'>;

export const partLabel = (p: Part) => [typeLabelFor(p.typeCode), p.specKey].filter(Boolean).join(', ');
/** Wanted on the van: due for replacement by the booking's day, or failed when last looked at. Inspections need no part. */
const wantsPart = (p: Part) => p.conditionFailed || p.dueKind === 'replacement';

export function dueWords(p: Part): string {
  if (p.conditionFailed) return `${partLabel(p)}: failed at the last check, replace`;
  const when = p.dueOn ? ` (due ${formatCalendarDate(p.dueOn)})` : '';
  return `${partLabel(p)}: ${p.dueKind === 'replacement' ? 'replace' : 'inspect'}${when}`;
}

export function bookingDtos(rows: BookingRow[], details: Details, timeZone: string): BookingDto[] {
  const heads = new Map(details.heads.map((h) => [h.id, h]));
  return rows.map((b) => {
    const head = heads.get(b.id)!;
    const lines = details.lines.filter((l) => l.bookingId === b.id);
    return {
      id: b.id,
      status: b.status,
      source: b.source,
      startsAt: b.startsAt.toISOString(),
      endsAt: b.endsAt.toISOString(),
      start: localDateTimeOf(timeZone, b.startsAt),
      end: localDateTimeOf(timeZone, b.endsAt),
      timeZone,
      technician: { id: b.technicianId, name: head.technicianName },
      site: { id: head.siteId, street: head.street, town: head.town, postalCode: head.postalCode, accessNotes: head.accessNotes },
      customer: { id: head.customerId, name: head.customerName, phone: head.customerPhone },
      appliances: lines.map((l) => ({
        id: l.applianceId,
        kind: l.kind as ApplianceKind,
        fuel: l.fuel as Fuel,
        title: `${LABELS.applianceKind[l.kind as ApplianceKind]}, ${LABELS.fuel[l.fuel as Fuel].toLowerCase()}`,
        lastOutcome: (l.lastOutcome as VisitOutcome | null) ?? null,
        lastVisitOn: l.lastVisitOn,
        due: details.parts.filter((p) => p.applianceId === l.applianceId).map(dueWords),
      })),
      note: b.note,
      statusReason: b.statusReason,
      serviceRequestId: b.serviceRequestId,
      visitIds: details.visitLinks.filter((v) => v.bookingId === b.id).map((v) => v.id),
      bookedBy: b.createdBy ? { id: b.createdBy, name: head.bookedByName ?? '' } : null,
      createdAt: b.createdAt.toISOString(),
      updatedAt: b.updatedAt.toISOString(),
    };
  });
}

/** The parts the live bookings need, grouped by type and specification ("Thermocouple, 24 in × 2"). */
export function loadList(rows: BookingRow[], details: Details, range: { from: string; to: string; technicianId: string | null }): LoadListDto {
  const live = new Set(rows.filter((b) => b.status === 'booked' || b.status === 'confirmed').map((b) => b.id));
  const customerOf = new Map(details.heads.map((h) => [h.id, h.customerName]));
  const groups = new Map<string, LoadListLineDto>();
  for (const line of details.lines) {
    if (!live.has(line.bookingId)) continue;
    for (const part of details.parts) {
      if (part.applianceId !== line.applianceId || !wantsPart(part)) continue;
      const key = `${part.typeCode}|${part.specKey}`;
      const group = groups.get(key) ?? { specKey: key, label: partLabel(part), count: 0, reasons: [], appliances: [] };
      group.count += 1;
      const reason = part.conditionFailed ? 'condition' : 'age';
      if (!group.reasons.includes(reason)) group.reasons.push(reason);
      group.appliances.push({ applianceId: line.applianceId, bookingId: line.bookingId, customerName: customerOf.get(line.bookingId) ?? '' });
      groups.set(key, group);
    }
  }
  return { ...range, lines: [...groups.values()].sort((a, b) => b.count - a.count || a.label.localeCompare(b.label)) };
}
