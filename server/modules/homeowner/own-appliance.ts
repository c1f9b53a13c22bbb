import type { AppContext } from '../../context';
import { notFound } from '../../lib/http-error';
import type { Principal } from '../../../shared/schemas/roles';
import { homeownerRepository } from './homeowner.repository';

type Homeowner = Extract<Principal, { kind: 'homeowner' }>;

/** The homeowner's own appliances (those at their customers' sites). */
export function ownAppliances(ctx: AppContext, me: Homeowner) {
  return homeownerRepository.appliancesOfCustomers(ctx.db, me.companyId, me.customerIds);
}

/** One of the homeowner's own appliances; someone else's answers exactly like one that does not exist. */
export async function requireOwnAppliance(ctx: AppContext, me: Homeowner, applianceId: string) {
  const own = await ownAppliances(ctx, me);
  if (!own.some((a) => a.id === applianceId)) throw notFound('Appliance');
}
