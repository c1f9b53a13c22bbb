import type { AppContext } from '../../context';
import { notFound } from '../../lib/http-error';
import { companyRepository } from './company.repository';
import { todayInTimeZone } from '../../../shared/dates';
import type { CompanyDto, CompanySettingsInput } from '../../../shared/schemas/company';
import { DEFAULT_BOOKING_MINUTES, type BookingMinutesSetting } from '../../../shared/schemas/bookings';
import { recordAudit } from '../../core/audit-log';

type CompanyRow = { id: string; name: string; phone: string; timeZone: string; underFiringTolerancePct: number | null; dueSoonDays: number; bookingMinutes: Partial<BookingMinutesSetting> };

const toDto = (c: CompanyRow): CompanyDto => ({
  id: c.id,
  name: c.name,
  phone: c.phone,
  timeZone: c.timeZone,
  today: todayInTimeZone(c.timeZone),
  underFiringTolerancePct: c.underFiringTolerancePct,
  dueSoonDays: c.dueSoonDays,
  bookingMinutes: { ...DEFAULT_BOOKING_MINUTES, ...c.bookingMinutes },
});

export function companyService(ctx: AppContext) {
  return {
    async get(companyId: string) {
      const company = await companyRepository.findById(ctx.db, companyId);
      if (!company) throw notFound('Company');
      return toDto(company);
    },
    async update(companyId: string, actorId: string, input: CompanySettingsInput) {
      // Nothing named, nothing to write (an UPDATE with no columns is an SQL error).
      if (Object.values(input).every((v) => v === undefined)) return this.get(companyId);
      return ctx.db.transaction(async (tx) => {
        const company = await companyRepository.update(tx, companyId, input);
        if (!company) throw notFound('Company');
        await recordAudit(tx, { companyId, actorId, action: 'update', entity: 'company', entityId: companyId, changes: input });
        return toDto(company);
      });
    },
  };
}
