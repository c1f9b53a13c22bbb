import type { z } from 'zod';
import type { Tx } from '../../db/client';
import { conflict, forbidden, notFound, validationFailed } from '../../lib/http-error';
import { can } from '../../../shared/policy';
import { FORM_ERROR_KEY } from '../../../shared/schemas/errors';
import type { amendmentInput } from '../../../shared/schemas/visits';
import { recordAudit } from '../../core/audit-log';
import { appendTimelineEvent } from '../../core/timeline';
import { companyToday } from '../../core/company-today';
import { recomputeDueForAppliance } from '../due';
import { alertsOf, outcomeRequirements, requirementDetails } from '../../../shared/visits/completion-requirements';
import { mergeChecklist, mergeReadings } from './visit-draft';
import { resultsToStore, type VisitResults } from './visit-results';
import type { Member } from './visit-lock';
import { visitsRepository, type VisitRow } from './visits.repository';

export type AmendmentFields = z.output<typeof amendmentInput>;

/** Owners and managers correct any visit; a technician only a visit they were on. */
function assertMayAmend(actor: Member, visit: VisitRow) {
  if (can(actor, 'visits:amend-any')) return;
  if (can(actor, 'visits:amend-own') && visit.technicianIds.includes(actor.userId)) return;
  throw forbidden('Only a technician who was on this visit, or a manager, can correct it.');
}

/**
 * A correction to a completed visit. The visit row keeps its original values; the amendment row holds the
 * corrected ones. Swap dates are the exception: the part-swap row and both parts' dates follow the correction,
 * because the due engine reads them.
 */
export async function amendVisit(tx: Tx, actor: Member, visitId: string, input: AmendmentFields) {
  const visit = await visitsRepository.findVisit(tx, actor.companyId, visitId, { forUpdate: true });
  if (!visit) throw notFound('Visit');
  if (visit.status !== 'completed') throw conflict('A draft visit is edited, not amended.');
  assertMayAmend(actor, visit);
  const appliance = await visitsRepository.applianceReadingFacts(tx, actor.companyId, visit.applianceId);
  if (!appliance) throw notFound('Appliance');

  const { reason, swaps: swapCorrections, ...corrected } = input;
  const changes: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(corrected)) if (value !== undefined) changes[key] = value;

  if (input.checklist) mergeChecklist(visit.checklist, input.checklist);
  if (input.readings) {
    changes.results = resultsToStore(mergeReadings(visit.readings, input.readings), appliance);
  }
  if (input.outcome) {
    const o = input.outcome;
    const merged = {
      outcome: o.outcome === undefined ? visit.outcome : o.outcome,
      outcomeReason: o.outcomeReason === undefined ? visit.outcomeReason : o.outcomeReason,
      outcomeToldWhom: o.outcomeToldWhom === undefined ? visit.outcomeToldWhom : o.outcomeToldWhom,
    };
    const results = (changes.results ?? visit.results) as Partial<VisitResults>;
    const alerts = alertsOf({ flags: results.flags ?? [], lowWaterCutoffFailed: results.lowWaterCutoff?.passed === false });
    const missing = outcomeRequirements(merged, alerts, 'outcome.');
    if (missing.length) throw validationFailed(requirementDetails(missing));
  }

  if (swapCorrections?.length) changes.swaps = await correctSwaps(tx, actor, visit, swapCorrections);
  if (Object.keys(changes).length === 0) throw validationFailed({ [FORM_ERROR_KEY]: ['Give at least one corrected field.'] });

  const amendment = await visitsRepository.insertAmendment(tx, {
    companyId: actor.companyId,
    visitId: visit.id,
    reason,
    changes,
    createdBy: actor.userId,
  });
  if (swapCorrections?.length) await recomputeDueForAppliance(tx, actor.companyId, visit.applianceId);
  const fields = Object.keys(changes).filter((k) => k !== 'results');
  await appendTimelineEvent(tx, {
    companyId: actor.companyId,
    applianceId: visit.applianceId,
    occurredAt: amendment.createdAt,
    kind: 'amendment',
    refId: visit.id,
    summary: `Visit of ${visit.visitedOn} corrected (${fields.join(', ')}): ${reason}`,
    data: { visitId: visit.id, amendmentId: amendment.id, fields },
    actorId: actor.userId,
  });
  await recordAudit(tx, { companyId: actor.companyId, actorId: actor.userId, action: 'amend', entity: 'visit', entityId: visit.id, changes: { amendmentId: amendment.id, reason, changes } });
  return visit;
}

/** Moves each corrected swap's date onto the swap row, the removed part's removal date and the new part's install date. */
async function correctSwaps(tx: Tx, actor: Member, visit: VisitRow, corrections: NonNullable<AmendmentFields['swaps']>) {
  const found = await visitsRepository.findSwapsOfVisit(tx, actor.companyId, visit.id, corrections.map((c) => c.swapId));
  const today = await companyToday(tx, actor.companyId);
  const errors: Record<string, string[]> = {};
  corrections.forEach((c, i) => {
    if (!found.some((s) => s.id === c.swapId)) errors[`swaps.${i}.swapId`] = ['This part swap is not on this visit.'];
    if (c.swappedOn > today) errors[`swaps.${i}.swappedOn`] = ['A part swap cannot be dated in the future.'];
  });
  if (Object.keys(errors).length) throw validationFailed(errors);

  const applied = [];
  for (const c of corrections) {
    const swap = found.find((s) => s.id === c.swapId)!;
    const reason = c.reason === undefined ? swap.reason : c.reason;
    await visitsRepository.updateSwap(tx, actor.companyId, swap.id, { swappedOn: c.swappedOn, reason });
    await visitsRepository.updateComponent(tx, actor.companyId, swap.removedComponentId, { removedOn: c.swappedOn, updatedBy: actor.userId });
    await visitsRepository.updateComponent(tx, actor.companyId, swap.newComponentId, { installedOn: c.swappedOn, updatedBy: actor.userId });
    applied.push({ swapId: swap.id, swappedOn: c.swappedOn, previousSwappedOn: swap.swappedOn, reason });
  }
  return applied;
}
