import type { Response } from 'express';
import type { AppContext } from '../../context';
import { findCompany } from '../../core/tenant-finders';
import type { MeDto } from '../../../shared/schemas/me';
import { can } from '../../../shared/policy';
import { devOutboxEnabled } from '../reminders';

/** Who the request's session is, as GET /api/me answers it (also embedded in the HTML of the record). */
export async function describeMe(ctx: AppContext, res: Response): Promise<MeDto | { user: null }> {
  const session = res.locals.session;
  if (!session) return { user: null };
  const principal = res.locals.principal ?? null;
  const company = principal ? await findCompany(ctx.db, principal.companyId) : null;
  return {
    user: { id: session.userId, name: session.name, email: session.email },
    principal,
    company: company
      ? { id: company.id, name: company.name, phone: company.phone, timeZone: company.timeZone, underFiringTolerancePct: company.underFiringTolerancePct }
      : null,
    devOutbox: devOutboxEnabled(ctx.config) && can(principal, 'dev:outbox'),
  };
}
