import type { ApplianceKind, Fuel, VisitType } from '../schemas/enums';
import type { ReadingKey } from '../schemas/visits';

type TemplateLike = { items: ReadonlyArray<{ readings?: ReadonlyArray<string> }>; requiredReadings: Partial<Record<VisitType, ReadonlyArray<string>>> };

/**
 * The readings a visit of this type must have, as the template says. Only readings one of the template's items
 * records count: a requirement the form has no inputs for could only ever be skipped. The server runs this when a
 * visit starts; the phone runs it when a visit starts with no signal.
 */
export function requiredReadingsFor(template: TemplateLike | null | undefined, type: VisitType): ReadingKey[] {
  if (!template) return [];
  const recorded = new Set(template.items.flatMap((i) => i.readings ?? []));
  return (template.requiredReadings[type] ?? []).filter((key) => recorded.has(key)) as ReadingKey[];
}

/** The template for this kind and fuel: one made for the fuel before one for any fuel (as the server's query orders them). */
export function chooseChecklistTemplate<T extends { applianceKind: ApplianceKind; fuel: Fuel | null }>(templates: readonly T[], kind: ApplianceKind, fuel: Fuel): T | null {
  const forKind = templates.filter((t) => t.applianceKind === kind);
  return forKind.find((t) => t.fuel === fuel) ?? forKind.find((t) => t.fuel === null) ?? null;
}
