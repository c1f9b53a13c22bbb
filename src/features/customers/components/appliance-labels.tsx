import type { ApplianceSummary } from '@shared/schemas/records';
import { LABELS, type ApplianceStatus } from '@shared/schemas/enums';
import { StatusBadge, type Status } from '@/components/ui/status-badge';

/** "Steam boiler, natural gas · Harrowgate Foundry model X · in the basement" style one-liner. */
export function applianceLabel(a: Pick<ApplianceSummary, 'kind' | 'fuel' | 'manufacturer' | 'model'>): string {
  const makeModel = [a.manufacturer, a.model].filter(Boolean).join(' ');
  return `${LABELS.applianceKind[a.kind]}, ${LABELS.fuel[a.fuel].toLowerCase()}${makeModel ? ` · ${makeModel}` : ''}`;
}

const STATUS_LOOK: Record<ApplianceStatus, Status> = { in_service: 'ok', out_of_service: 'due', removed: 'info' };

export function ApplianceStatusBadge({ status }: { status: ApplianceStatus }) {
  return <StatusBadge status={STATUS_LOOK[status]}>{LABELS.applianceStatus[status]}</StatusBadge>;
}
