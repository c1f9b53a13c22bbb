import type { DbOrTx } from '../../db/client';
import { dueRules } from '../../db/schema/index';
import { DEFAULT_DUE_RULES } from '../../../shared/trade/due-dates';

/** Gives a new company the default due rules (one per component type); the company edits them afterwards. */
export async function seedCompanyDueRules(tx: DbOrTx, companyId: string) {
  const rows = Object.values(DEFAULT_DUE_RULES).map((rule) => ({
    companyId,
    componentType: rule.componentType,
    applianceKind: rule.applianceKind ?? null,
    inspectionIntervalMonths: rule.inspectionIntervalMonths,
    replacementAgeYears: rule.replacementAgeYears,
    replacementPolicy: rule.replacementPolicy,
    basis: rule.basis,
    source: rule.source,
  }));
  await tx.insert(dueRules).values(rows).onConflictDoNothing();
}
