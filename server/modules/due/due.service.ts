import type { AppContext } from '../../context';
import { badRequest, notFound } from '../../lib/http-error';
import { addDays } from '../../../shared/trade/iso-date';
import { PLANNING_MEDIAN_SOURCE, PLANNING_MEDIAN_YEARS } from '../../../shared/trade/due-dates';
import type { DueItemDto, DueRuleDto, DueStockDto, DueStockRow } from '../../../shared/schemas/due';
import type { Page } from '../../../shared/schemas/records';
import type { ApplianceKind } from '../../../shared/schemas/enums';
import { recordAudit } from '../../core/audit-log';
import { companyDueClock, companyToday } from '../../core/company-today';
import { describeStoredDue } from './due-status';
import { dueRepository, recomputeDueForCompany, type DueRuleChange, type DueRuleRow } from './due.repository';
import { typeLabelFor } from '../../core/type-label';

type Actor = { userId: string; companyId: string };

const toRuleDto = ({ rule, catalogLabel }: { rule: DueRuleRow; catalogLabel: string | null }): DueRuleDto => ({
  id: rule.id,
  componentType: rule.componentType,
  typeLabel: typeLabelFor(rule.componentType, catalogLabel),
  applianceKind: rule.applianceKind,
  inspectionIntervalMonths: rule.inspectionIntervalMonths,
  replacementAgeYears: rule.replacementAgeYears,
  planningAgeYears: rule.planningAgeYears,
  replacementPolicy: rule.replacementPolicy,
  basis: rule.basis,
  source: rule.source,
  updatedAt: rule.updatedAt.toISOString(),
});

const encodeCursor = (dueOn: string, id: string) => `${dueOn}_${id}`;
function decodeCursor(cursor: string) {
  const match = /^(\d{4}-\d{2}-\d{2})_([0-9a-f-]{36})$/i.exec(cursor);
  if (!match) throw badRequest('The page cursor is not valid.', { after: ['Not a valid cursor.'] });
  return { dueOn: match[1], id: match[2] };
}

const MAX_EXPORT_ROWS = 20_000;

export function dueService(ctx: AppContext) {
  return {
    async listRules(companyId: string): Promise<DueRuleDto[]> {
      return (await dueRepository.listRules(ctx.db, companyId)).map(toRuleDto);
    },

    async updateRule(actor: Actor, id: string, change: DueRuleChange): Promise<DueRuleDto> {
      await ctx.db.transaction(async (tx) => {
        const before = await dueRepository.findRule(tx, actor.companyId, id);
        if (!before) throw notFound('Due rule');
        await dueRepository.updateRule(tx, actor.companyId, id, change, actor.userId);
        await recomputeDueForCompany(tx, actor.companyId);
        await recordAudit(tx, {
          companyId: actor.companyId,
          actorId: actor.userId,
          action: 'update',
          entity: 'due_rule',
          entityId: id,
          changes: { before: pickChange(before.rule), after: change },
        });
      });
      return toRuleDto((await dueRepository.findRule(ctx.db, actor.companyId, id))!);
    },

    async listDue(
      companyId: string,
      q: { withinDays: number; type?: string; applianceKind?: ApplianceKind; technicianId?: string; town?: string; after?: string; limit: number },
    ): Promise<Page<DueItemDto>> {
      const { today, dueSoonDays } = await companyDueClock(ctx.db, companyId);
      const rows = await dueRepository.listDue(ctx.db, {
        ...q,
        companyId,
        through: addDays(today, q.withinDays),
        after: q.after ? decodeCursor(q.after) : null,
        limit: q.limit + 1,
      });
      const page = rows.slice(0, q.limit);
      const items = page.map((r): DueItemDto => {
        const c = r.component;
        const described = describeStoredDue(c, today, dueSoonDays)!;
        return {
          componentId: c.id,
          typeCode: c.typeCode,
          typeLabel: typeLabelFor(c.typeCode, r.catalogLabel),
          specKey: c.specKey,
          description: c.description,
          dueOn: c.dueOn!,
          dueKind: c.dueKind!,
          status: described.status === 'ok' ? 'later' : described.status,
          reason: described.reason,
          appliance: r.appliance,
          site: { ...r.site, assignedTechnicianName: r.technicianName },
          customer: r.customer,
        };
      });
      const last = page.at(-1);
      return { items, nextCursor: rows.length > q.limit && last ? encodeCursor(last.component.dueOn!, last.component.id) : null };
    },

    /** Every matching item, walked page by page along the same keyset; capped so one request stays bounded. */
    async exportAll(companyId: string, q: { withinDays: number; type?: string; applianceKind?: ApplianceKind; technicianId?: string; town?: string }) {
      const items: DueItemDto[] = [];
      let after: string | undefined;
      do {
        const page = await this.listDue(companyId, { ...q, after, limit: 100 });
        items.push(...page.items);
        after = page.nextCursor ?? undefined;
      } while (after && items.length < MAX_EXPORT_ROWS);
      return items.slice(0, MAX_EXPORT_ROWS);
    },

    async stock(companyId: string, withinDays: number): Promise<DueStockDto> {
      const through = addDays(await companyToday(ctx.db, companyId), withinDays);
      const rows = await dueRepository.stock(ctx.db, companyId, through);
      const pick = (kind: 'inspection' | 'replacement'): DueStockRow[] =>
        rows
          .filter((r) => r.dueKind === kind)
          .map((r) => ({ typeCode: r.typeCode, typeLabel: typeLabelFor(r.typeCode, r.catalogLabel), specKey: r.specKey, count: r.count }));
      const aged = await dueRepository.pastMedianLife(ctx.db, companyId, through, PLANNING_MEDIAN_YEARS);
      const pastMedianLife = aged.map((r) => ({ typeCode: r.type_code, typeLabel: typeLabelFor(r.type_code, r.catalog_label), specKey: r.spec_key, count: r.count }));
      return { withinDays, through, replacements: pick('replacement'), inspections: pick('inspection'), pastMedianLife, pastMedianLifeSource: `${PLANNING_MEDIAN_SOURCE}; where the company adopted a median learned from its own swaps, that median` };
    },
  };
}

function pickChange(rule: DueRuleRow): DueRuleChange {
  const { inspectionIntervalMonths, replacementAgeYears, replacementPolicy, basis, source } = rule;
  return { inspectionIntervalMonths, replacementAgeYears, replacementPolicy, basis, source };
}
