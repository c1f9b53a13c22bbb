import { COMPONENT_TYPES, type ComponentGroup, type ComponentType } from '../trade/component-types';

const isKnownType = (code: string): code is ComponentType => Object.hasOwn(COMPONENT_TYPES, code);

/**
 * A part type's display name: the company's own catalog label when it has one, else the generic name from
 * shared/trade, else the code made readable ("zone_valve" → "zone valve"). Never the bare code.
 */
export function partName(typeCode: string, catalogLabel?: string | null): string {
  if (catalogLabel) return catalogLabel;
  return isKnownType(typeCode) ? COMPONENT_TYPES[typeCode].label : typeCode.replaceAll('_', ' ');
}

/** The groups part types are listed under, in the trade's usual order (the catalog page and the part picker). */
export const PART_GROUP_LABELS: Record<ComponentGroup, string> = {
  gas: 'Gas burner and controls',
  oil: 'Oil burner',
  steam: 'Steam',
  hot_water: 'Hot water',
  common: 'Common',
};

/** A group's name; a group the glossary does not know is made readable, never shown as a code. */
export const partGroupName = (group: string) => (Object.hasOwn(PART_GROUP_LABELS, group) ? PART_GROUP_LABELS[group as ComponentGroup] : group.replaceAll('_', ' '));
