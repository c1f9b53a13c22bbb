import type { AppContext } from '../../context';
import { badRequest, notFound } from '../../lib/http-error';
import { todayInTimeZone } from '../../../shared/dates';
import { DEFAULT_BOOKING_MINUTES, type UnbookedItemDto, type UnbookedPageDto } from '../../../shared/schemas/bookings';
import type { ApplianceKind, Fuel } from '../../../shared/schemas/enums';
import { LABELS } from '../../../shared/schemas/enums';
import { dueWords } from './booking-dto';
import { bookingsRepository } from './bookings.repository';
import { duePartsOf, listUnbooked } from './unbooked.repository';

type Query = {
  from: string;
  to: string;
  applianceKind?: ApplianceKind;
  fuel?: Fuel;
  town?: string;
  search?: string;
  technicianId?: string;
  after?: string;
  limit: number;
};

const encodeCursor = (firstDueOn: string, id: string) => `${firstDueOn}_${id}`;
function decodeCursor(cursor: string) {
  const match = /^(\d{4}-\d{2}-\d{2})_([0-9a-f-]{36})$/i.exec(cursor);
  if (!match) throw badRequest('The page cursor is not valid.', { after: ['Not a valid cursor.'] });
  return { firstDueOn: match[1], id: match[2] };
}

export function unbookedService(ctx: AppContext) {
  return {
    async list(companyId: string, q: Query): Promise<UnbookedPageDto> {
      const company = await bookingsRepository.company(ctx.db, companyId);
      if (!company) throw notFound('Company');
      const now = new Date();
      const today = todayInTimeZone(company.timeZone, now);
      const { after, limit, from: _from, to, ...filters } = q;
      const rows = await listUnbooked(ctx.db, {
        ...filters,
        companyId,
        through: to,
        today,
        now,
        after: after ? decodeCursor(after) : null,
        limit: limit + 1,
      });
      const page = rows.slice(0, limit);
      const parts = page.length ? await duePartsOf(ctx.db, companyId, page.map((r) => r.appliance_id), to) : [];
      const items = page.map(
        (r): UnbookedItemDto => ({
          appliance: { id: r.appliance_id, kind: r.kind, fuel: r.fuel, title: `${LABELS.applianceKind[r.kind]}, ${LABELS.fuel[r.fuel].toLowerCase()}` },
          site: { id: r.site_id, street: r.street, town: r.town, assignedTechnicianId: r.assigned_technician_id, assignedTechnicianName: r.assigned_technician_name },
          customer: { id: r.customer_id, name: r.customer_name },
          firstDueOn: r.first_due_on,
          overdue: r.first_due_on < today,
          due: parts.filter((p) => p.applianceId === r.appliance_id).map(dueWords),
        }),
      );
      const last = page.at(-1);
      return {
        items,
        nextCursor: rows.length > limit && last ? encodeCursor(last.first_due_on, last.appliance_id) : null,
        technicians: await bookingsRepository.technicians(ctx.db, companyId),
        bookingMinutes: { ...DEFAULT_BOOKING_MINUTES, ...company.bookingMinutes },
      };
    },
  };
}
