import type { z } from 'zod';
import type { AppContext } from '../../context';
import type { DbOrTx } from '../../db/client';
import { notFound } from '../../lib/http-error';
import { describeAmendment, describeChange, type ChangeWords, type VisitState } from '../../../shared/audit/describe-change';
import type { ChangeDto, ChangesPageDto, changesQuery } from '../../../shared/schemas/changes';
import { changesRepository as repo, type ChangeRow } from './changes.repository';

type Query = z.output<typeof changesQuery>;

/**
 * Each amendment told against the visit as it stood just before it: the signed-off values (the visit row, which
 * amendments never overwrite) with every earlier amendment laid over them in order.
 */
async function amendmentWords(db: DbOrTx, companyId: string, rows: ChangeRow[]) {
  const visitIds = [...new Set(rows.filter((r) => r.entity === 'visit' && r.action === 'amend').map((r) => r.entity_id))];
  const words = new Map<string, ChangeWords>();
  if (!visitIds.length) return words;
  const [originals, amendments] = await Promise.all([repo.visitOriginals(db, companyId, visitIds), repo.amendmentsOf(db, companyId, visitIds)]);
  const state = new Map<string, VisitState>(
    originals.map((v) => [
      v.id,
      { outcome: v.outcome, outcomeReason: v.outcome_reason, findings: v.findings, recommendations: v.recommendations, readings: v.readings ?? {} },
    ]),
  );
  for (const a of amendments) {
    const before = state.get(a.entity_id);
    if (!before) continue;
    const told = describeAmendment(a.changes ?? {}, before);
    words.set(a.id, told.words);
    state.set(a.entity_id, told.next);
  }
  return words;
}

async function toPage(db: DbOrTx, companyId: string, page: { items: ChangeRow[]; nextCursor: string | null }): Promise<ChangesPageDto> {
  const amended = await amendmentWords(db, companyId, page.items);
  const items: ChangeDto[] = page.items.map((r) => {
    const words = amended.get(r.id) ?? describeChange({ action: r.action, entity: r.entity, changes: r.changes });
    return { id: r.id, at: r.at.toISOString(), who: r.who, visit: r.visit_id && r.visited_on ? { id: r.visit_id, visitedOn: r.visited_on } : null, ...words };
  });
  return { items, nextCursor: page.nextCursor };
}

/** The history of changes of a life record or a visit, read from audit_log (written by every change, in its transaction). */
export function changesService(ctx: AppContext) {
  return {
    async ofAppliance(companyId: string, applianceId: string, q: Query) {
      if (!(await repo.applianceExists(ctx.db, companyId, applianceId))) throw notFound('Appliance');
      return toPage(ctx.db, companyId, await repo.ofAppliance(ctx.db, companyId, applianceId, q));
    },
    async ofVisit(companyId: string, visitId: string, q: Query) {
      if (!(await repo.visitExists(ctx.db, companyId, visitId))) throw notFound('Visit');
      return toPage(ctx.db, companyId, await repo.ofVisit(ctx.db, companyId, visitId, q));
    },
  };
}
