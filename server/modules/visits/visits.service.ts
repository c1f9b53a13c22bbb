import { assertBookingCovers, markBookingDoneIfVisited } from '../bookings';
import type { z } from 'zod';
import type { AppContext } from '../../context';
import type { Tx } from '../../db/client';
import { conflict, notFound, validationFailed } from '../../lib/http-error';
import type { VisitDto, visitStartInput } from '../../../shared/schemas/visits';
import { recordAudit } from '../../core/audit-log';
import { companyToday } from '../../core/company-today';
import { recomputeDueForAppliance } from '../due';
import { appendCompletionEvents, applyFindingsToComponents } from './visit-completion';
import { mergeDraft, type DraftFields } from './visit-draft';
import { loadVisitDto } from './visit-dto';
import { assertCompletable } from './visit-sign-off';
import { amendVisit, type AmendmentFields } from './visit-amendments';
import { swapPart, type SwapFields } from './visit-swaps';
import { visitsRepository, type VisitRow } from './visits.repository';
import { lockDraft, type Member } from './visit-lock';
import { findTemplateFor } from '../checklists';
import { requiredReadingsFor } from '../../../shared/visits/required-readings';
import { queueVisitReportMail } from '../visit-reports';

type StartFields = z.output<typeof visitStartInput>;

export function visitsService(ctx: AppContext) {
  const dto = async (companyId: string, visit: VisitRow) => loadVisitDto(ctx.db, companyId, visit);

  async function saveDraftIn(tx: Tx, actor: Member, visitId: string, input: DraftFields) {
    const { visit, appliance } = await lockDraft(tx, actor.companyId, visitId);
    if (input.revision !== visit.revision) {
      throw conflict('Someone saved this visit since you opened it. Reload to see the latest, then make your change again.', {
        currentRevision: visit.revision,
      });
    }
    const { patch, results, changedFields } = await mergeDraft(tx, actor.companyId, visit, input, appliance);
    return { visit, appliance, patch: { ...patch, revision: visit.revision + 1, updatedBy: actor.userId }, results, changedFields };
  }

  return {
    async get(actor: Member, visitId: string): Promise<VisitDto> {
      const visit = await visitsRepository.findVisit(ctx.db, actor.companyId, visitId);
      if (!visit) throw notFound('Visit');
      return dto(actor.companyId, visit);
    },

    /** Idempotent per appliance and technician: a retried tap gets the draft the first tap made. */
    async start(actor: Member, input: StartFields): Promise<VisitDto> {
      const visit = await ctx.db.transaction(async (tx) => {
        const appliance = await visitsRepository.applianceReadingFacts(tx, actor.companyId, input.applianceId);
        if (!appliance) throw notFound('Appliance');
        await visitsRepository.lockStart(tx, appliance.id, actor.userId);
        if (input.id) {
          await visitsRepository.lockVisitId(tx, input.id);
          const owner = await visitsRepository.findVisitOwner(tx, input.id);
          const ours = owner && owner.companyId === actor.companyId && owner.applianceId === appliance.id && owner.technicianIds.includes(actor.userId);
          // The same start sent again (an offline outbox replaying): the visit it made. Anything else: not this id.
          if (ours) return (await visitsRepository.findVisit(tx, actor.companyId, input.id))!;
          if (owner) throw conflict('This visit id is already in use. Start the visit again without an id to get a new one.', { id: ['This visit id is already in use.'] });
        }
        const existing = await visitsRepository.findOpenDraft(tx, actor.companyId, appliance.id, actor.userId);
        if (existing) return existing;

        if (input.bookingId) await assertBookingCovers(tx, actor.companyId, input.bookingId, appliance.id);
        const today = await companyToday(tx, actor.companyId);
        if (input.visitedOn && input.visitedOn > today) throw validationFailed({ visitedOn: ['A visit cannot be dated in the future.'] });
        const template = await findTemplateFor(tx, actor.companyId, appliance.kind, appliance.fuel);
        const created = await visitsRepository.insertVisit(tx, {
          ...(input.id ? { id: input.id } : {}),
          companyId: actor.companyId,
          applianceId: appliance.id,
          type: input.type,
          visitedOn: input.visitedOn ?? today,
          technicianIds: [actor.userId],
          arrivedAt: input.arrivedAt ? new Date(input.arrivedAt) : new Date(),
          checklist: (template?.items ?? []).map((item) => ({ ...item, mark: null, note: '' })),
          requiredReadings: requiredReadingsFor(template, input.type),
          bookingId: input.bookingId ?? null,
          createdBy: actor.userId,
          updatedBy: actor.userId,
        });
        await recordAudit(tx, {
          companyId: actor.companyId,
          actorId: actor.userId,
          action: 'start',
          entity: 'visit',
          entityId: created.id,
          changes: { applianceId: appliance.id, type: input.type, templateId: template?.id ?? null, requiredReadings: created.requiredReadings },
        });
        return created;
      });
      return dto(actor.companyId, visit);
    },

    async saveDraft(actor: Member, visitId: string, input: DraftFields): Promise<VisitDto> {
      const saved = await ctx.db.transaction(async (tx) => {
        const { patch, changedFields } = await saveDraftIn(tx, actor, visitId, input);
        const row = await visitsRepository.updateVisit(tx, actor.companyId, visitId, patch);
        await recordAudit(tx, {
          companyId: actor.companyId,
          actorId: actor.userId,
          action: 'save_draft',
          entity: 'visit',
          entityId: visitId,
          changes: { fields: changedFields, revision: row.revision },
        });
        return row;
      });
      return dto(actor.companyId, saved);
    },

    /** Saves the final fields, signs off, and writes everything the visit changed, all in one transaction. */
    async complete(actor: Member, visitId: string, input: DraftFields): Promise<VisitDto> {
      const { row: completed, report } = await ctx.db.transaction(async (tx) => {
        const { visit, appliance, patch, results, changedFields } = await saveDraftIn(tx, actor, visitId, input);
        const merged = { ...visit, ...patch };
        assertCompletable(merged, results, appliance);

        const now = new Date();
        const row = await visitsRepository.updateVisit(tx, actor.companyId, visitId, {
          ...patch,
          status: 'completed',
          completedAt: now,
          signedOffBy: actor.userId,
          signedOffAt: now,
          departedAt: merged.departedAt ?? now,
        });
        await applyFindingsToComponents(tx, actor.companyId, actor.userId, row, results);
        await recomputeDueForAppliance(tx, actor.companyId, row.applianceId);
        if (row.bookingId) await markBookingDoneIfVisited(tx, actor.companyId, row.bookingId, actor.userId);
        await appendCompletionEvents(tx, actor.companyId, actor.userId, row, results);
        await recordAudit(tx, {
          companyId: actor.companyId,
          actorId: actor.userId,
          action: 'complete',
          entity: 'visit',
          entityId: visitId,
          changes: { fields: changedFields, outcome: row.outcome, revision: row.revision },
        });
        // The household's copy of the visit report, queued with the sign-off so it is never lost or sent for a rolled-back visit.
        return { row, report: await queueVisitReportMail(ctx, tx, actor, visitId) };
      });
      if ('mailId' in report) await ctx.mail.deliver(report.mailId);
      return dto(actor.companyId, completed);
    },

    async swap(actor: Member, visitId: string, input: SwapFields): Promise<VisitDto> {
      const visit = await ctx.db.transaction((tx) => swapPart(tx, actor, visitId, input));
      return dto(actor.companyId, visit);
    },

    async amend(actor: Member, visitId: string, input: AmendmentFields): Promise<VisitDto> {
      const visit = await ctx.db.transaction((tx) => amendVisit(tx, actor, visitId, input));
      return dto(actor.companyId, visit);
    },
  };
}
