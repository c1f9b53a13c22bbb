import type { z } from 'zod';
import type { Tx } from '../../db/client';
import { badRequest, notFound, validationFailed } from '../../lib/http-error';
import type { swapInput } from '../../../shared/schemas/visits';
import { COMPONENT_TYPES, formatSpec, type ComponentType } from '../../../shared/trade/component-types';
import { TradeInputError } from '../../../shared/trade/trade-input-error';
import { recordAudit } from '../../core/audit-log';
import { appendTimelineEvent } from '../../core/timeline';
import { companyToday } from '../../core/company-today';
import { recomputeDueForAppliance } from '../due';
import { typeLabelFor } from '../../core/type-label';
import { lockDraft, type Member } from './visit-lock';
import { visitsRepository } from './visits.repository';

export type SwapFields = z.output<typeof swapInput>;

/** The spec's stock-count key; a spec the part type does not know is a field error. */
function specKeyFor(typeCode: string, spec: Record<string, string | number>): string {
  if (!Object.hasOwn(COMPONENT_TYPES, typeCode)) return Object.values(spec).join(', ');
  try {
    return formatSpec(typeCode as ComponentType, spec);
  } catch (err) {
    if (err instanceof TradeInputError) throw validationFailed({ [`newSpec.${err.field.replace(/^spec\./, '')}`]: [err.message] });
    throw err;
  }
}

/** A timeline time for a date: now when it is today, else midday of that date (the hour is not known). */
export const occurredAtFor = (date: string, today: string) => (date === today ? new Date() : new Date(`${date}T12:00:00Z`));

/**
 * Part swap on a draft visit: the old part is marked removed, the new one installed the same day with a link
 * between them, the swap recorded, the timeline and audit written, and the appliance's due dates recomputed.
 */
export async function swapPart(tx: Tx, actor: Member, visitId: string, input: SwapFields) {
  const { visit } = await lockDraft(tx, actor.companyId, visitId);
  const old = await visitsRepository.findComponent(tx, actor.companyId, input.componentId, { forUpdate: true });
  if (!old) throw notFound('Part');
  if (old.applianceId !== visit.applianceId) throw validationFailed({ componentId: ['This part belongs to another appliance.'] });
  if (old.removedOn) throw validationFailed({ componentId: ['This part was already removed.'] });

  const today = await companyToday(tx, actor.companyId);
  const swappedOn = input.swappedOn ?? today;
  if (swappedOn > today) throw validationFailed({ swappedOn: ['A part swap cannot be dated in the future.'] });
  if (old.installedOn && swappedOn < old.installedOn) {
    throw badRequest('The swap date is before the old part was installed.', { swappedOn: [`The old part was installed ${old.installedOn}.`] });
  }
  const spec = input.newSpec ?? old.spec;
  const specKey = input.newSpec ? specKeyFor(old.typeCode, spec) : old.specKey;

  const fresh = await visitsRepository.insertComponent(tx, {
    companyId: actor.companyId,
    applianceId: old.applianceId,
    typeCode: old.typeCode,
    description: input.newDescription ?? null,
    spec,
    specKey,
    installedOn: swappedOn,
    originalWithAppliance: false,
    createdBy: actor.userId,
    updatedBy: actor.userId,
  });
  await visitsRepository.updateComponent(tx, actor.companyId, old.id, {
    removedOn: swappedOn,
    removalReason: input.reason ?? null,
    replacedById: fresh.id,
    dueOn: null,
    dueKind: null,
    dueReason: null,
    updatedBy: actor.userId,
  });
  const swap = await visitsRepository.insertSwap(tx, {
    companyId: actor.companyId,
    visitId: visit.id,
    applianceId: visit.applianceId,
    removedComponentId: old.id,
    newComponentId: fresh.id,
    swappedOn,
    reason: input.reason ?? null,
    cause: input.cause,
    createdBy: actor.userId,
  });
  const label = typeLabelFor(old.typeCode);
  await appendTimelineEvent(tx, {
    companyId: actor.companyId,
    applianceId: visit.applianceId,
    occurredAt: occurredAtFor(swappedOn, today),
    kind: 'part_swap',
    refId: swap.id,
    summary: `Replaced the ${label}${specKey ? ` (${specKey})` : ''}${input.reason ? `: ${input.reason}` : ''}.`,
    data: { swapId: swap.id, visitId: visit.id, typeCode: old.typeCode, specKey, removedComponentId: old.id, newComponentId: fresh.id, swappedOn },
    actorId: actor.userId,
  });
  await recordAudit(tx, {
    companyId: actor.companyId,
    actorId: actor.userId,
    action: 'swap',
    entity: 'part_swap',
    entityId: swap.id,
    changes: { visitId: visit.id, removedComponentId: old.id, newComponentId: fresh.id, swappedOn, spec, reason: input.reason ?? null },
  });
  await recomputeDueForAppliance(tx, actor.companyId, visit.applianceId);
  return visit;
}
