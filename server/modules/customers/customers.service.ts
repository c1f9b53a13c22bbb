import type { z } from 'zod';
import type { AppContext } from '../../context';
import { notFound } from '../../lib/http-error';
import type { customerInput, customerListQuery, customerPatch, CustomerDetailDto, CustomerListItem, Page } from '../../../shared/schemas/records';
import type { Principal } from '../../../shared/schemas/roles';
import { recordAudit } from '../../core/audit-log';
import { applianceSummariesForSites } from '../appliances';
import { sitesOfCustomers } from '../sites';
import { decodeCustomerCursor, encodeCustomerCursor } from './customer-cursor';
import { customersRepository, sortKeyCount } from './customers.repository';
import { findCustomer } from '../../core/tenant-finders';
import { toCustomerDto } from '../../core/customer-dto';

type Member = Extract<Principal, { kind: 'member' }>;


export function customersService(ctx: AppContext) {
  return {
    async list(companyId: string, q: z.output<typeof customerListQuery>): Promise<Page<CustomerListItem>> {
      const after = q.after ? decodeCustomerCursor(q.sort, q.after, sortKeyCount(q.sort)) : null;
      const rows = await customersRepository.list(ctx.db, { companyId, sort: q.sort, after, limit: q.limit, text: q.q || undefined });
      const page = rows.slice(0, q.limit);
      const last = page.at(-1);
      return {
        items: page.map((r) => ({ ...toCustomerDto(r.customer), siteCount: r.siteCount, applianceCount: r.applianceCount, firstTown: r.firstTown })),
        nextCursor: rows.length > q.limit && last ? encodeCustomerCursor(q.sort, last.keys) : null,
      };
    },
    async get(companyId: string, id: string): Promise<CustomerDetailDto> {
      const customer = await findCustomer(ctx.db, companyId, id);
      if (!customer) throw notFound('Customer');
      const sites = await sitesOfCustomers(ctx.db, companyId, [id]);
      const appliances = await applianceSummariesForSites(ctx.db, companyId, sites.map((s) => s.id));
      return { ...toCustomerDto(customer), sites: sites.map((s) => ({ ...s, appliances: appliances.filter((a) => a.siteId === s.id) })) };
    },
    async create(actor: Member, input: z.output<typeof customerInput>) {
      return ctx.db.transaction(async (tx) => {
        const row = await customersRepository.insert(tx, { ...input, companyId: actor.companyId, createdBy: actor.userId, updatedBy: actor.userId });
        await recordAudit(tx, { companyId: actor.companyId, actorId: actor.userId, action: 'create', entity: 'customer', entityId: row.id, changes: input });
        return toCustomerDto(row);
      });
    },
    async update(actor: Member, id: string, input: z.output<typeof customerPatch>) {
      return ctx.db.transaction(async (tx) => {
        const row = await customersRepository.update(tx, actor.companyId, id, { ...input, updatedBy: actor.userId });
        if (!row) throw notFound('Customer');
        await recordAudit(tx, { companyId: actor.companyId, actorId: actor.userId, action: 'update', entity: 'customer', entityId: id, changes: input });
        return toCustomerDto(row);
      });
    },
  };
}
