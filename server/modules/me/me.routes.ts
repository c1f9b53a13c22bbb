import { Router } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { companyRepository } from '../company/company.repository';
import type { MeDto } from '../../../shared/schemas/me';

export function meRoutes(ctx: AppContext) {
  const router = Router();
  defineRoute(router, 'get', '/me', { access: 'signed-in' }, async (_i, _req, res): Promise<MeDto> => {
    const session = res.locals.session!;
    const principal = res.locals.principal ?? null;
    const company = principal ? await companyRepository.findById(ctx.db, principal.companyId) : null;
    return {
      user: { id: session.userId, name: session.name, email: session.email },
      principal,
      company: company ? { id: company.id, name: company.name, phone: company.phone, timeZone: company.timeZone } : null,
    };
  });
  return router;
}
