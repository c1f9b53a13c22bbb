import type { ApplianceDto, SiteDto } from '@shared/schemas/records';
import type { ResultFacts } from '@shared/visits/visit-results';

/** The appliance, site and company facts the shared visit results need, from what the phone has loaded. */
export function resultFacts(
  appliance: ApplianceDto | undefined,
  underFiringTolerancePct: number | null,
  site?: Pick<SiteDto, 'elevationFt'> | null,
): ResultFacts | undefined {
  if (!appliance) return undefined;
  const { kind, fuel, ventType, construction, inputBtuh } = appliance;
  return { kind, fuel, ventType, construction, inputBtuh, underFiringTolerancePct, elevationFt: site?.elevationFt ?? null };
}
