import type { ChecklistItemTemplate, RequiredReadingsByVisitType } from '../../db/schema/index';
import type { VisitType } from '../../../shared/schemas/enums';
import type { ReadingKey } from '../../../shared/schemas/visits';

/**
 * The readings a visit of this type must have, as the template says. Only readings one of the template's items
 * records count: a requirement the form has no inputs for could only ever be skipped.
 */
export function requiredReadingsFor(
  template: { items: ChecklistItemTemplate[]; requiredReadings: RequiredReadingsByVisitType } | null | undefined,
  type: VisitType,
): ReadingKey[] {
  if (!template) return [];
  const recorded = new Set(template.items.flatMap((i) => i.readings ?? []));
  return (template.requiredReadings[type] ?? []).filter((key) => recorded.has(key)) as ReadingKey[];
}
