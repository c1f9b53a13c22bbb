import type { z } from 'zod';
import type { AppContext } from '../../context';
import { notFound, validationFailed } from '../../lib/http-error';
import type { checklistTemplateInput, ChecklistTemplateDto } from '../../../shared/schemas/records';
import type { Principal } from '../../../shared/schemas/roles';
import { readingsInput } from '../../../shared/schemas/visits';
import { READING_LABELS } from '../../../shared/visits/reading-labels';
import { recordAudit } from '../../core/audit-log';
import { checklistsRepository, type ChecklistTemplateRow } from './checklists.repository';

type Member = Extract<Principal, { kind: 'member' }>;
type TemplateInput = z.output<typeof checklistTemplateInput>;

const READING_KEYS = new Set(Object.keys(readingsInput.shape));

export const toChecklistTemplateDto = (r: ChecklistTemplateRow): ChecklistTemplateDto => ({
  id: r.id,
  name: r.name,
  applianceKind: r.applianceKind,
  fuel: r.fuel,
  items: r.items.map((i) => ({ ...i, caution: i.caution })),
  requiredReadings: r.requiredReadings as ChecklistTemplateDto['requiredReadings'],
  updatedAt: r.updatedAt.toISOString(),
});

/** Keys identify items in every visit copied from the template, so they must be unique; readings must be known fields. */
function checkItems(input: TemplateInput) {
  const errors: Record<string, string[]> = {};
  const seen = new Set<string>();
  input.items.forEach((item, i) => {
    if (seen.has(item.key)) errors[`items.${i}.key`] = [`The key "${item.key}" is used by another item.`];
    seen.add(item.key);
    const unknown = (item.readings ?? []).filter((r) => !READING_KEYS.has(r));
    if (unknown.length) errors[`items.${i}.readings`] = [`Unknown reading: ${unknown.join(', ')}.`];
  });
  const recorded = new Set(input.items.flatMap((i) => i.readings ?? []));
  for (const [type, keys] of Object.entries(input.requiredReadings ?? {})) {
    const unrecorded = (keys ?? []).filter((k) => !recorded.has(k));
    if (unrecorded.length) {
      errors[`requiredReadings.${type}`] = [`No item records ${unrecorded.map((k) => READING_LABELS[k].toLowerCase()).join(', ')}: add it to an item's readings first.`];
    }
  }
  if (Object.keys(errors).length) throw validationFailed(errors);
}

export function checklistsService(ctx: AppContext) {
  return {
    async list(companyId: string) {
      return (await checklistsRepository.list(ctx.db, companyId)).map(toChecklistTemplateDto);
    },
    async replace(actor: Member, id: string, input: TemplateInput) {
      checkItems(input);
      return ctx.db.transaction(async (tx) => {
        const items = input.items.map(({ caution, readings, ...rest }) => ({
          ...rest,
          ...(caution ? { caution } : {}),
          ...(readings?.length ? { readings } : {}),
        }));
        const row = await checklistsRepository.update(tx, actor.companyId, id, {
          name: input.name,
          items,
          ...(input.requiredReadings ? { requiredReadings: input.requiredReadings } : {}),
          updatedBy: actor.userId,
        });
        if (!row) throw notFound('Checklist');
        await recordAudit(tx, {
          companyId: actor.companyId,
          actorId: actor.userId,
          action: 'update',
          entity: 'checklist_template',
          entityId: id,
          changes: { name: input.name, itemKeys: items.map((i) => i.key), ...(input.requiredReadings ? { requiredReadings: input.requiredReadings } : {}) },
        });
        return toChecklistTemplateDto(row);
      });
    },
  };
}
