import type { Tx } from '../client';
import { dueRules } from '../schema/index';
import type { ApplianceKind } from '../../../shared/schemas/enums';

const DEMO_POLICY_SOURCE = 'Company policy (demo)';

type PolicyRule = { componentType: string; applianceKind: ApplianceKind | null; replacementAgeYears: number };

/**
 * The demo company's own replacement ages, layered over the defaults. Oil nozzles and filters are already replaced
 * at every annual service by the default rules (common practice), so they need no company rule.
 */
const DEMO_POLICIES: PolicyRule[] = [
  { componentType: 'thermocouple', applianceKind: 'steam_boiler', replacementAgeYears: 5 },
  { componentType: 'thermocouple', applianceKind: 'hot_water_boiler', replacementAgeYears: 5 },
  { componentType: 'pilot_assembly', applianceKind: null, replacementAgeYears: 10 },
];

export async function applyDemoCompanyPolicies(tx: Tx, companyId: string) {
  for (const p of DEMO_POLICIES) {
    const values = {
      inspectionIntervalMonths: 12,
      replacementAgeYears: p.replacementAgeYears,
      replacementPolicy: 'fixed_age' as const,
      basis: 'company_policy' as const,
      source: DEMO_POLICY_SOURCE,
    };
    await tx
      .insert(dueRules)
      .values({ companyId, componentType: p.componentType, applianceKind: p.applianceKind, ...values })
      .onConflictDoUpdate({ target: [dueRules.companyId, dueRules.componentType, dueRules.applianceKind], set: values });
  }
}
