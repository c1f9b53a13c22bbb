import type { AppContext } from '../../context';
import { conflict, HttpError, notFound } from '../../lib/http-error';
import { formatTagCode, generateTagCode } from '../../../shared/tags/tag-code';
import type { Principal } from '../../../shared/schemas/roles';
import type { PublicTagDto, TagBatchDto, TagDto, TagFormatId, TagResolutionDto } from '../../../shared/schemas/tags';
import { recordAudit } from '../../core/audit-log';
import { appendTimelineEvent } from '../../core/timeline';
import { renderTagSheetPdf } from './tag-sheet-pdf';
import { tagsRepository as repo, type TagRow } from './tags.repository';
import { findAppliance } from '../../core/tenant-finders';

type Member = Extract<Principal, { kind: 'member' }>;

export const DAMAGED_NOTE = 'replaced: damaged';
// 30^7 possible bodies: a collision is rare, a run of them means something else is wrong.
const MAX_GENERATION_ROUNDS = 20;

export const tagDto = (t: TagRow): TagDto => ({
  id: t.id,
  code: t.code,
  status: t.status,
  applianceId: t.applianceId,
  assignedAt: t.assignedAt?.toISOString() ?? null,
  retiredAt: t.retiredAt?.toISOString() ?? null,
  retiredNote: t.retiredNote,
  replacedByTagId: t.replacedByTagId,
});

export function tagsService(ctx: AppContext, generate: () => string = generateTagCode) {
  return {
    async createBatch(actor: Member, input: { count: number; format: TagFormatId }): Promise<TagBatchDto> {
      return ctx.db.transaction(async (tx) => {
        const batch = await repo.insertBatch(tx, { companyId: actor.companyId, format: input.format, count: input.count, createdBy: actor.userId });
        const codes: string[] = [];
        for (let round = 0; codes.length < input.count; round++) {
          if (round >= MAX_GENERATION_ROUNDS) throw new HttpError(503, 'codes_exhausted', 'Could not make unique tag codes. Try again.');
          const wanted = new Set<string>();
          while (wanted.size < input.count - codes.length) wanted.add(generate());
          codes.push(...(await repo.insertCodes(tx, [...wanted].map((code) => ({ companyId: actor.companyId, batchId: batch.id, code })))));
        }
        await recordAudit(tx, { companyId: actor.companyId, actorId: actor.userId, action: 'create', entity: 'tag_batch', entityId: batch.id, changes: input });
        return { id: batch.id, format: batch.format, count: batch.count, assignedCount: 0, createdAt: batch.createdAt.toISOString(), createdByName: null, codes };
      });
    },

    async listBatches(actor: Member): Promise<TagBatchDto[]> {
      const rows = await repo.listBatches(ctx.db, actor.companyId);
      return rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() }));
    },

    async batchPdf(actor: Member, batchId: string): Promise<{ pdf: Uint8Array; filename: string }> {
      const batch = await repo.findBatch(ctx.db, actor.companyId, batchId);
      if (!batch) throw notFound('Tag batch');
      const company = await repo.company(ctx.db, actor.companyId);
      const codes = await repo.batchCodes(ctx.db, batch.id);
      const pdf = await renderTagSheetPdf({ codes, baseUrl: ctx.config.BASE_URL, companyName: company?.name ?? '', format: batch.format });
      return { pdf, filename: `tags-${batch.createdAt.toISOString().slice(0, 10)}-${batch.id.slice(0, 8)}.pdf` };
    },

    async assign(actor: Member, input: { code: string; applianceId: string; replaceDamaged: boolean }): Promise<TagDto> {
      return ctx.db.transaction(async (tx) => {
        const tag = await repo.findByCode(tx, input.code, { forUpdate: true });
        if (!tag || tag.companyId !== actor.companyId) throw notFound('Tag');
        const appliance = await findAppliance(tx, actor.companyId, input.applianceId, { forUpdate: true });
        if (!appliance) throw notFound('Appliance');
        if (tag.status === 'assigned') {
          const where = tag.applianceId === appliance.id ? 'this appliance' : 'another appliance';
          throw conflict(`Tag ${formatTagCode(tag.code)} is already on ${where}. Use a new tag.`, { code: [`Already on ${where}.`] });
        }
        if (tag.status === 'retired') throw conflict(`Tag ${formatTagCode(tag.code)} was retired and cannot be used again.`, { code: ['This tag was retired.'] });

        const current = await repo.activeTagOf(tx, actor.companyId, appliance.id);
        if (current && !input.replaceDamaged) {
          const message = `This appliance already has tag ${formatTagCode(current.code)}. Replace it only if it is damaged or lost.`;
          throw conflict(message, { replaceDamaged: [message] });
        }
        const now = new Date();
        if (current) {
          // Retired first: only one tag per appliance may be 'assigned' (a partial unique index says so too).
          await repo.update(tx, current.id, { status: 'retired', retiredAt: now, retiredNote: DAMAGED_NOTE, replacedByTagId: tag.id });
        }
        const assigned = await repo.update(tx, tag.id, { status: 'assigned', applianceId: appliance.id, assignedAt: now, assignedBy: actor.userId });
        const summary = `Tag ${formatTagCode(tag.code)} attached${current ? ` in place of damaged tag ${formatTagCode(current.code)}` : ''}`;
        await appendTimelineEvent(tx, {
          companyId: actor.companyId,
          applianceId: appliance.id,
          occurredAt: now,
          kind: 'note',
          summary,
          refId: tag.id,
          data: { tag: { code: tag.code, replacedCode: current?.code ?? null } },
          actorId: actor.userId,
        });
        await recordAudit(tx, {
          companyId: actor.companyId,
          actorId: actor.userId,
          action: 'assign',
          entity: 'tag',
          entityId: tag.id,
          changes: { code: tag.code, applianceId: appliance.id, retiredTagId: current?.id ?? null },
        });
        return tagDto(assigned);
      });
    },

    async listForAppliance(actor: Member, applianceId: string): Promise<TagDto[]> {
      if (!(await findAppliance(ctx.db, actor.companyId, applianceId))) throw notFound('Appliance');
      return (await repo.tagsOf(ctx.db, actor.companyId, applianceId)).map(tagDto);
    },

    /** Members of the owning company see the tag's state; a homeowner sees only their own appliance; anyone else 404. */
    async resolve(principal: Principal | null | undefined, code: string): Promise<TagResolutionDto> {
      const tag = await repo.findByCode(ctx.db, code);
      if (!tag || !principal || principal.companyId !== tag.companyId) throw notFound('Tag');
      if (principal.kind === 'member') {
        if (tag.status === 'unassigned' || !tag.applianceId) return { status: 'unassigned' };
        return { status: tag.status, applianceId: tag.applianceId, ...(tag.status === 'retired' ? { retiredNote: tag.retiredNote } : {}) };
      }
      if (tag.applianceId && (await repo.applianceOwnedBy(ctx.db, tag.companyId, tag.applianceId, principal.customerIds))) {
        return { applianceId: tag.applianceId, homeowner: true };
      }
      throw notFound('Tag');
    },

    /** What a stranger who scans a tag may learn: whose tag it is and how to call them. Nothing about the home. */
    async publicInfo(code: string): Promise<PublicTagDto> {
      const tag = await repo.findByCode(ctx.db, code);
      const company = tag ? await repo.company(ctx.db, tag.companyId) : null;
      if (!company) return { known: false, companyName: null, companyPhone: null };
      return { known: true, companyName: company.name, companyPhone: company.phone };
    },
  };
}

export type TagsService = ReturnType<typeof tagsService>;
