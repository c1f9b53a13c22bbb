import { COMPONENT_TYPES, type ComponentType } from '../trade/component-types';

const isKnownType = (code: string): code is ComponentType => Object.hasOwn(COMPONENT_TYPES, code);

/**
 * A part type's display name: the company's own catalog label when it has one, else the generic name from
 * shared/trade, else the code made readable ("zone_valve" → "zone valve"). Never the bare code.
 */
export function partName(typeCode: string, catalogLabel?: string | null): string {
  if (catalogLabel) return catalogLabel;
  return isKnownType(typeCode) ? COMPONENT_TYPES[typeCode].label : typeCode.replaceAll('_', ' ');
}
