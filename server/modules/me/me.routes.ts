import { Router } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { companyRepository } from '../company/company.repository';
import type { MeDto } from '../../../shared/schemas/me';

export function meRoutes(ctx: AppContext) {
  const router = Router();
  // Public so that a signed-out browser asks without an error: it learns it is signed out from `user: null`.
  defineRoute(router, 'get', '/me', { access: 'public' }, async (_i, _req, res): Promise<MeDto | { user: null }> => {
    const session = res.locals.session;
    if (!session) return { user: null };
    const principal = res.locals.principal ?? null;
    const company = principal ? await companyRepository.findById(ctx.db, principal.companyId) : null;
    return {
      user: { id: session.userId, name: session.name, email: session.email },
      principal,
      company: company
        ? { id: company.id, name: company.name, phone: company.phone, timeZone: company.timeZone, underFiringTolerancePct: company.underFiringTolerancePct }
        : null,
    };
  });
  return router;
}
