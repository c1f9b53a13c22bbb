import type { Tx } from '../../db/client';
import { conflict, notFound } from '../../lib/http-error';
import type { Principal } from '../../../shared/schemas/roles';
import { visitsRepository } from './visits.repository';

export type Member = Extract<Principal, { kind: 'member' }>;

export const COMPLETED_IS_AMENDED = 'A completed visit is amended, not edited.';

/** The visit locked for writing, with its appliance; 404 for another tenant's id, 409 once completed. */
export async function lockDraft(tx: Tx, companyId: string, visitId: string) {
  const visit = await visitsRepository.findVisit(tx, companyId, visitId, { forUpdate: true });
  if (!visit) throw notFound('Visit');
  if (visit.status === 'completed') throw conflict(COMPLETED_IS_AMENDED);
  const appliance = await visitsRepository.applianceReadingFacts(tx, companyId, visit.applianceId);
  if (!appliance) throw notFound('Appliance');
  return { visit, appliance };
}

