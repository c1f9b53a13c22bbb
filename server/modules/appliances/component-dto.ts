import type { ComponentDto } from '../../../shared/schemas/records';
import { describeStoredDue } from '../due';
import { typeLabelFor } from '../../core/type-label';
import type { ComponentRow } from './appliances.repository';

/** `dueSoonDays` is the company's "due soon" window (companies.due_soon_days). */
export function toComponentDto(c: ComponentRow, catalogLabel: string | null, today: string, dueSoonDays: number): ComponentDto {
  const described = c.removedOn || !c.dueOn || !c.dueKind ? null : describeStoredDue(c, today, dueSoonDays);
  return {
    id: c.id,
    typeCode: c.typeCode,
    typeLabel: typeLabelFor(c.typeCode, catalogLabel),
    description: c.description,
    spec: c.spec,
    specKey: c.specKey,
    installedOn: c.installedOn,
    originalWithAppliance: c.originalWithAppliance,
    note: c.note,
    conditionFailed: c.conditionFailed,
    conditionNote: c.conditionNote,
    lastInspectedOn: c.lastInspectedOn,
    removedOn: c.removedOn,
    removalReason: c.removalReason,
    replacedById: c.replacedById,
    due: described && c.dueOn && c.dueKind ? { kind: c.dueKind, dueOn: c.dueOn, status: described.status, reason: described.reason } : null,
  };
}
