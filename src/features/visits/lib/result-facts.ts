import type { ApplianceDto } from '@shared/schemas/records';
import type { ResultFacts } from '@shared/visits/visit-results';

/** The appliance and company facts the shared visit results need, from what the phone has loaded. */
export function resultFacts(appliance: ApplianceDto | undefined, underFiringTolerancePct: number | null): ResultFacts | undefined {
  if (!appliance) return undefined;
  const { fuel, ventType, construction, inputBtuh } = appliance;
  return { fuel, ventType, construction, inputBtuh, underFiringTolerancePct };
}
